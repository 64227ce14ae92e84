import { formatDateTime } from '@client/components/number-format.ts';
import type { Comment } from '@shared/api/comments.ts';

/** Comments oldest first, each with who wrote it, when, and on which revision. */
export function CommentList({ comments, empty }: { comments: readonly Comment[]; empty: string }) {
  if (comments.length === 0) return <p className="text-sm text-ink-soft">{empty}</p>;
  return (
    <ol className="space-y-3">
      {comments.map((c) => (
        <li key={c.id} className="rounded border border-rule bg-white/60 p-3">
          <p className="text-xs text-ink-soft">
            <span className="font-medium text-ink">{c.author.name ?? c.author.login}</span> ·{' '}
            {formatDateTime(c.createdAt)}
            {c.revisionNumber !== null ? ` · revision ${c.revisionNumber}` : ''}
            {c.line !== null ? ` · line ${c.line}` : ''}
          </p>
          <p className="mt-1 whitespace-pre-line text-sm">{c.body}</p>
        </li>
      ))}
    </ol>
  );
}
