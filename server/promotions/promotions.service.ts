import type { CandidatePage } from '@shared/api/candidates.ts';
import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { Promote, PromotionOutcome } from '@shared/api/promotions.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { candidateAccess, routineAccess } from '@server/candidates/candidate-access.ts';
import { toCandidateSummary } from '@server/candidates/candidate-mapping.ts';
import { candidateMailContext } from '@server/candidates/candidate-mail.ts';
import { moveCandidate } from '@server/candidates/candidate-moves.ts';
import {
  listCandidateRows,
  lockCandidate,
  lockRoutine,
} from '@server/candidates/candidates.repo.ts';
import { clearanceOf } from '@server/candidates/clearance.ts';
import { contactOf, teamAddresses } from '@server/candidates/team-recipients.repo.ts';
import { promotedEmail } from '@server/mail/messages/incumbent-emails.ts';
import { enqueueEmail } from '@server/mail/outbox.ts';
import { safetyCaution } from '@shared/safety-caution.ts';
import { toPromotion } from './promotion-mapping.ts';
import { changeIncumbent, snapshotOfTrial } from './promotion-record.ts';
import { requirePromote } from './promotions.policy.ts';
import { findPromotion } from './promotions.repo.ts';

/** The routine's cleared candidates, for a maintainer deciding what to promote. */
export async function listCleared(
  db: Db,
  user: CurrentUser,
  routineId: number,
  page: PaginationQuery,
): Promise<CandidatePage> {
  const { role } = await routineAccess(db, user, routineId);
  requirePromote(role, 'see the cleared candidates to promote');
  const { rows, total } = await listCandidateRows(db, routineId, { ...page, state: 'cleared' });
  return { items: rows.map(toCandidateSummary), total, limit: page.limit, offset: page.offset };
}

/**
 * A maintainer makes a cleared candidate's latest revision the routine's incumbent, in one
 * transaction: the incumbent, the promotion record with the metrics of the trial it rests on,
 * the candidate's move to promoted, the audit log and e-mail to the whole team.
 */
export async function promoteCandidate(
  db: Db,
  env: Env,
  user: CurrentUser,
  candidateId: number,
  input: Promote,
): Promise<PromotionOutcome> {
  const { role, routine: seen } = await candidateAccess(db, user, candidateId);
  requirePromote(role, 'promote candidates');
  const promotionId = await db.transaction(async (tx) => {
    const routine = (await lockRoutine(tx, seen.id))!;
    const candidate = await lockCandidate(tx, candidateId);
    if (candidate.state !== 'cleared') {
      throw new AppError(
        'conflict',
        `Only a cleared candidate can be promoted; this one is ${candidate.state.replace('-', ' ')}.`,
      );
    }
    const clearance = await clearanceOf(tx, candidate, routine);
    if (!clearance.cleared || !clearance.latestTrial) {
      throw new AppError(
        'conflict',
        `The candidate no longer meets the bar: it needs ${clearance.stillNeeded.join(' and ')}.`,
      );
    }
    const { latestRevision, latestTrial } = clearance;
    const promotion = await changeIncumbent(tx, {
      routine,
      kind: 'promote',
      revisionId: latestRevision.id,
      trialId: latestTrial.id,
      snapshot: await snapshotOfTrial(tx, latestTrial.id),
      actorId: user.id,
      note: input.note,
    });
    await moveCandidate(tx, {
      candidate,
      to: 'promoted',
      actorId: user.id,
      teamId: routine.teamId,
      action: 'candidate.promoted',
      details: { promotionId: promotion.id, revision: latestRevision.number },
    });
    const mail = await candidateMailContext(tx, routine, candidate, latestRevision.number);
    const email = promotedEmail(env, {
      teamSlug: mail.team.slug,
      routineId: routine.id,
      routineTitle: routine.title,
      teamName: mail.team.name,
      maintainerName: (await contactOf(tx, user.id)).name,
      note: input.note,
      candidateTitle: candidate.title,
      revisionNumber: latestRevision.number,
    });
    await enqueueEmail(tx, {
      kind: 'promoted',
      to: await teamAddresses(tx, routine.teamId),
      ...email,
    });
    return promotion.id;
  });
  return {
    promotion: toPromotion((await findPromotion(db, promotionId))!),
    caution: safetyCaution,
  };
}
