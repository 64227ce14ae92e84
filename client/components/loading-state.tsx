/** A quiet "loading" line for a page or a panel; announced to screen readers. */
export function LoadingState({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-8 text-ink-soft">
      <span
        aria-hidden="true"
        className="inline-block h-3 w-3 animate-pulse rounded-full bg-ink-soft/50"
      />
      <span>{label}</span>
    </div>
  );
}
