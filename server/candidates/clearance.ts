import type { Clearance } from '@shared/api/candidates.ts';
import { finalTrialStatuses } from '@shared/api/trials.ts';
import { countSignOffs } from '@server/reviews/reviews.repo.ts';
import { latestRevisionOf, type RevisionRow } from '@server/revisions/revisions.repo.ts';
import { latestTrialOf, type TrialRow } from '@server/trials/trials.repo.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import type { CandidateRow, RoutineRow } from './candidates.repo.ts';

export interface ClearanceFacts extends Clearance {
  cleared: boolean;
  latestRevision: RevisionRow;
  /** The latest revision's newest trial, or null when type errors kept it from running. */
  latestTrial: TrialRow | null;
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function trialNeed(revision: RevisionRow, trial: TrialRow | null): string | null {
  const r = `revision ${revision.number}`;
  if (!trial) return `a revision without type errors (${r} has some), and its trial`;
  if (!(finalTrialStatuses as readonly string[]).includes(trial.status)) {
    return `the trial of ${r} to finish`;
  }
  if (trial.status !== 'completed') return `a trial that runs (the trial of ${r} could not)`;
  if (trial.passed !== true) return `a trial that passes the acceptance policy (${r} did not)`;
  return null;
}

/**
 * Whether a candidate meets the bar for `cleared`, judged on its latest revision alone: that
 * revision's latest trial completed and passed the acceptance policy, and distinct reviewers
 * signed off that revision as often as the routine's policy asks. Sign-offs on older revisions
 * do not count. Pass the transaction that is about to act on the answer.
 */
export async function clearanceOf(
  db: DbOrTx,
  candidate: CandidateRow,
  routine: RoutineRow,
): Promise<ClearanceFacts> {
  const latestRevision = await latestRevisionOf(db, candidate.id);
  // One query at a time: `db` may be a transaction, whose one connection takes no overlap.
  const latestTrial = await latestTrialOf(db, latestRevision.id);
  const signOffs = await countSignOffs(db, latestRevision.id, candidate.authorId);
  const signOffsRequired = routine.policy.signOffsRequired ?? 1;
  const trialMissing = trialNeed(latestRevision, latestTrial);
  const trialPassed = trialMissing === null;
  const stillNeeded: string[] = [];
  const over = candidate.state === 'promoted' || candidate.state === 'withdrawn';
  if (!over && trialMissing) stillNeeded.push(trialMissing);
  if (!over && signOffs < signOffsRequired) {
    stillNeeded.push(
      `${plural(signOffsRequired - signOffs, 'more sign-off')} on revision ${latestRevision.number}`,
    );
  }
  return {
    trialPassed,
    signOffs,
    signOffsRequired,
    stillNeeded,
    cleared: trialPassed && signOffs >= signOffsRequired,
    latestRevision,
    latestTrial,
  };
}
