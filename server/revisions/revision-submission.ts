import { createHash } from 'node:crypto';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import { recordAudit } from '@server/audit/audit.ts';
import { assertMove } from '@server/candidates/candidate-transitions.ts';
import {
  setCandidateState,
  type CandidateRow,
  type RoutineRow,
} from '@server/candidates/candidates.repo.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { insertQueuedTrial, type TrialRow } from '@server/trials/trials.repo.ts';
import { insertNextRevision, type RevisionRow } from './revisions.repo.ts';

export interface RevisionSubmission {
  routine: RoutineRow;
  /** The candidate as read inside the transaction (locked, or just inserted). */
  candidate: CandidateRow;
  actorId: number;
  source: string;
  /** The type check's findings; any finding keeps the revision from running. */
  diagnostics: KernelDiagnostic[];
  /** The checker that found them (`TypeScript 5.9.3`). */
  checkedWith: string;
  /** What the audit log calls it: `candidate.submitted` or `candidate.revised`. */
  action: string;
}

export interface SubmittedRevision {
  candidate: CandidateRow;
  revision: RevisionRow;
  /** The queued trial, or null when type errors kept the revision from running. */
  trial: TrialRow | null;
}

export function sourceHash(source: string): string {
  return createHash('sha256').update(source, 'utf8').digest('hex');
}

/**
 * Inside the caller's transaction: stores the next revision and puts the candidate on trial,
 * with a queued trials row against the routine's incumbent and matrix set. The caller enqueues
 * the trial after commit. A source with type errors cannot run: no trial is created and the
 * candidate moves on to trial-failed, as the life cycle has it (on trial, then the trial could
 * not run).
 */
export async function recordRevision(
  tx: DbOrTx,
  input: RevisionSubmission,
): Promise<SubmittedRevision> {
  const { routine, candidate, diagnostics } = input;
  assertMove(candidate.state, 'on-trial');
  const revision = await insertNextRevision(tx, {
    candidateId: candidate.id,
    source: input.source,
    sourceHash: sourceHash(input.source),
    diagnostics,
    checkedWith: input.checkedWith,
    createdBy: input.actorId,
  });
  let trial: TrialRow | null = null;
  if (diagnostics.length === 0) {
    trial = await insertQueuedTrial(tx, {
      routineId: routine.id,
      revisionId: revision.id,
      incumbentRevisionId: routine.incumbentRevisionId,
      matrixSetId: routine.matrixSetId,
    });
  } else {
    assertMove('on-trial', 'trial-failed');
  }
  const state = trial ? 'on-trial' : 'trial-failed';
  const updated = await setCandidateState(tx, candidate.id, state);
  await recordAudit(tx, {
    actorId: input.actorId,
    teamId: routine.teamId,
    action: input.action,
    entity: 'candidate',
    entityId: candidate.id,
    details: {
      from: candidate.state,
      to: state,
      revision: revision.number,
      trialId: trial?.id ?? null,
      typeErrors: diagnostics.length,
    },
  });
  return { candidate: updated, revision, trial };
}
