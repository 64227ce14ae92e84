import type { PromotionOutcome, Reinstate } from '@shared/api/promotions.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Env } from '@server/config/env.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { routineAccess } from '@server/candidates/candidate-access.ts';
import { lockRoutine } from '@server/candidates/candidates.repo.ts';
import { contactOf, teamAddresses, teamNames } from '@server/candidates/team-recipients.repo.ts';
import { reinstatedEmail } from '@server/mail/messages/incumbent-emails.ts';
import { enqueueEmail } from '@server/mail/outbox.ts';
import { safetyCaution } from '@shared/safety-caution.ts';
import { toPromotion } from './promotion-mapping.ts';
import { changeIncumbent } from './promotion-record.ts';
import { requirePromote } from './promotions.policy.ts';
import { findPromotion } from './promotions.repo.ts';

/**
 * A maintainer restores an earlier incumbent: the revision of one of the routine's earlier
 * promotions becomes the incumbent again, recorded as a promotion of kind `reinstate` that
 * rests on the same trial and metrics, with audit and e-mail to the team in one transaction.
 */
export async function reinstateIncumbent(
  db: Db,
  env: Env,
  user: CurrentUser,
  routineId: number,
  input: Reinstate,
): Promise<PromotionOutcome> {
  const { role } = await routineAccess(db, user, routineId);
  requirePromote(role, 'reinstate an earlier incumbent');
  const promotionId = await db.transaction(async (tx) => {
    const routine = (await lockRoutine(tx, routineId))!;
    const earlier = await findPromotion(tx, input.promotionId);
    if (!earlier || earlier.promotion.routineId !== routineId) {
      throw new AppError('not-found', 'No such promotion of this routine.');
    }
    if (routine.incumbentRevisionId === earlier.promotion.revisionId) {
      throw new AppError('conflict', 'That revision is already the incumbent.');
    }
    const promotion = await changeIncumbent(tx, {
      routine,
      kind: 'reinstate',
      revisionId: earlier.promotion.revisionId,
      trialId: earlier.promotion.trialId,
      snapshot: earlier.promotion.metricsSnapshot,
      actorId: user.id,
      note: input.note,
    });
    const team = await teamNames(tx, routine.teamId);
    const email = reinstatedEmail(env, {
      teamSlug: team.slug,
      routineId: routine.id,
      routineTitle: routine.title,
      teamName: team.name,
      maintainerName: (await contactOf(tx, user.id)).name,
      note: input.note,
      revisionLabel: `"${earlier.candidateTitle}" (revision ${earlier.revisionNumber})`,
    });
    await enqueueEmail(tx, {
      kind: 'reinstated',
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
