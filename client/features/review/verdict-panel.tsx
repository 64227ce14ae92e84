import type { CandidateDetail } from '@shared/api/candidates.ts';
import { candidateStateLabels } from '@shared/states.ts';
import { VerdictForm } from './verdict-form.tsx';

/** Why this person sees no verdict buttons, in plain words; null when they may give one. */
export function whyNoVerdict(candidate: CandidateDetail, userId: number | null): string | null {
  const latest = candidate.revisions.at(-1);
  const mine = candidate.reviews.find(
    (r) => r.revisionId === latest?.id && r.reviewer.id === userId && r.verdict === 'sign-off',
  );
  // A second sign-off of the same revision by the same person is refused, so offer none.
  if (mine) return `You signed off revision ${mine.revisionNumber} already.`;
  if (candidate.permissions.review) return null;
  if (userId !== null && userId === candidate.author.id) {
    return 'You wrote this candidate, so you cannot sign it off or send it back; another reviewer must.';
  }
  if (candidate.permissions.role === 'author') {
    return 'Your role in this team is author. Reviewers and maintainers give verdicts.';
  }
  if (candidate.state !== 'in-review' && candidate.state !== 'cleared') {
    return `Verdicts are given while a candidate is in review; this one is ${candidateStateLabels[candidate.state]}.`;
  }
  return 'You cannot give a verdict on this candidate now.';
}

/** The reviewer's verdicts, or the reason they are not offered. */
export function VerdictPanel({
  candidate,
  userId,
}: {
  candidate: CandidateDetail;
  userId: number | null;
}) {
  const latest = candidate.revisions.at(-1);
  const reason = whyNoVerdict(candidate, userId);
  return (
    <section aria-labelledby="verdict-title" className="rounded border border-rule p-4">
      <h2 id="verdict-title" className="font-semibold">
        Your verdict
      </h2>
      {reason === null && latest ? (
        <div className="mt-2">
          <VerdictForm candidateId={candidate.id} revisionNumber={latest.number} />
        </div>
      ) : (
        <p className="mt-2 text-sm text-ink-soft" data-testid="no-verdict-reason">
          {reason}
        </p>
      )}
    </section>
  );
}
