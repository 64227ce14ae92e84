import { Link } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import type { CandidateDetail } from '@shared/api/candidates.ts';

/**
 * For the candidate's author: what to fix (the reasons it was sent back, or why the trial could
 * not run) and the way to submit a new revision.
 */
export function AuthorGuidance({
  candidate,
  teamSlug,
  isOwn,
}: {
  candidate: CandidateDetail;
  teamSlug: string;
  isOwn: boolean;
}) {
  if (!isOwn) return null;
  const latest = candidate.revisions.at(-1);
  const sentBack = candidate.reviews.filter(
    (r) => r.verdict === 'send-back' && r.revisionId === latest?.id,
  );
  const needsWork = candidate.state === 'returned' || candidate.state === 'trial-failed';
  const reviseHref = paths.revise(teamSlug, candidate.id);
  if (!needsWork && !candidate.permissions.revise) return null;
  return (
    <section
      aria-labelledby="to-fix-title"
      className={`mt-6 rounded border p-4 ${needsWork ? 'border-beyond/50 bg-beyond/5' : 'border-rule'}`}
    >
      <h2 id="to-fix-title" className="font-semibold">
        {needsWork ? 'What to fix' : 'Your candidate'}
      </h2>
      {candidate.state === 'returned' ? (
        sentBack.length > 0 ? (
          <ul className="mt-2 space-y-2 text-sm">
            {sentBack.map((r) => (
              <li key={r.id}>
                <span className="font-medium">{r.reviewer.name ?? r.reviewer.login}</span> sent
                revision {r.revisionNumber} back:{' '}
                <span className="whitespace-pre-line">“{r.body}”</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-2 text-sm">A reviewer sent the latest revision back.</p>
        )
      ) : candidate.state === 'trial-failed' ? (
        <p className="mt-2 text-sm">
          {candidate.latestTrial?.message ??
            (latest && latest.errorCount > 0
              ? `Revision ${latest.number} has type errors against the contract.`
              : 'The trial could not run.')}
        </p>
      ) : null}
      {needsWork ? (
        <p className="mt-2 text-sm text-ink-soft">
          The line comments in and under the diff below say where.
        </p>
      ) : null}
      {candidate.permissions.revise ? (
        <Link
          to={reviseHref}
          className="mt-3 inline-block rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper"
        >
          Submit a new revision
        </Link>
      ) : null}
    </section>
  );
}
