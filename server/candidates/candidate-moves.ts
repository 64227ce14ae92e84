import type { CandidateState } from '@shared/states.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { assertMove } from './candidate-transitions.ts';
import { setCandidateState, type CandidateRow } from './candidates.repo.ts';

export interface CandidateMove {
  /** The candidate as read (locked) in this transaction. */
  candidate: CandidateRow;
  to: CandidateState;
  actorId: number;
  teamId: number;
  /** The audit log's name for it, e.g. `candidate.sent-back`. */
  action: string;
  details?: Record<string, unknown>;
}

/** Moves a candidate along its life cycle (409 when the move is not part of it) and audits it. */
export async function moveCandidate(tx: DbOrTx, move: CandidateMove): Promise<CandidateRow> {
  const { candidate, to } = move;
  assertMove(candidate.state, to);
  const moved = await setCandidateState(tx, candidate.id, to);
  await recordAudit(tx, {
    actorId: move.actorId,
    teamId: move.teamId,
    action: move.action,
    entity: 'candidate',
    entityId: candidate.id,
    details: { from: candidate.state, to, ...move.details },
  });
  return moved;
}
