import { SignalBadge } from '@client/components/signal-badge.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import type { Review } from '@shared/api/reviews.ts';

/** Every verdict on every revision, oldest first. */
export function ReviewHistory({ reviews }: { reviews: readonly Review[] }) {
  if (reviews.length === 0) {
    return <p className="text-sm text-ink-soft">No one has signed off or sent back yet.</p>;
  }
  return (
    <ol className="space-y-3">
      {reviews.map((r) => (
        <li key={r.id} className="rounded border border-rule bg-white/60 p-3">
          <p className="flex flex-wrap items-center gap-2 text-sm">
            {r.verdict === 'sign-off' ? (
              <SignalBadge signal="within">signed off</SignalBadge>
            ) : (
              <SignalBadge signal="beyond">sent back</SignalBadge>
            )}
            <span className="font-medium">{r.reviewer.name ?? r.reviewer.login}</span>
            <span className="text-ink-soft">
              revision {r.revisionNumber} · {formatDateTime(r.createdAt)}
            </span>
          </p>
          {r.body ? <p className="mt-1 whitespace-pre-line text-sm">{r.body}</p> : null}
        </li>
      ))}
    </ol>
  );
}
