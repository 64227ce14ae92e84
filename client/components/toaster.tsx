import { Toaster as SonnerToaster } from 'sonner';

/** Toasts for the outcome of every mutation (`toast.success` / `toast.error` from sonner). */
export function Toaster() {
  return (
    <SonnerToaster
      position="bottom-right"
      closeButton
      toastOptions={{
        style: {
          background: 'var(--color-paper)',
          color: 'var(--color-ink)',
          border: '1px solid var(--color-rule)',
          fontFamily: 'var(--font-sans)',
        },
      }}
    />
  );
}
