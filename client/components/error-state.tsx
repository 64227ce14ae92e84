import { ApiError } from '@client/api/api-client.ts';

function describe(error: unknown): { title: string; message: string } {
  if (error instanceof ApiError) {
    switch (error.code) {
      case 'not-found':
        return { title: 'Not found', message: error.message };
      case 'unauthenticated':
        return { title: 'Please sign in', message: 'This page needs you to be signed in.' };
      case 'forbidden':
        return { title: 'Not allowed', message: error.message };
      case 'network':
        return { title: 'The server could not be reached', message: error.message };
      default:
        return { title: 'Something went wrong', message: error.message };
    }
  }
  return {
    title: 'Something went wrong',
    message: error instanceof Error ? error.message : String(error),
  };
}

/** A failed request, in words, with a way to try again. */
export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  const { title, message } = describe(error);
  return (
    <div role="alert" className="rounded border border-beyond/40 bg-beyond/5 px-5 py-4">
      <p className="font-medium text-beyond">
        <span aria-hidden="true">✕ </span>
        {title}
      </p>
      <p className="mt-1 text-sm text-ink-soft">{message}</p>
      {onRetry ? (
        <button
          type="button"
          onClick={onRetry}
          className="mt-3 rounded border border-ink/40 px-3 py-1 text-sm hover:bg-paper-deep"
        >
          Try again
        </button>
      ) : null}
    </div>
  );
}
