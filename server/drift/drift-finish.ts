import type { DriftStatus } from '@shared/states.ts';
import type { Env } from '@server/config/env.ts';
import { teamAddresses, teamNames } from '@server/candidates/team-recipients.repo.ts';
import type { FinishedTrial } from '@server/jobs/finished-trial.ts';
import { driftAlertEmail } from '@server/mail/messages/drift-alert-email.ts';
import { enqueueEmail } from '@server/mail/outbox.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import { ACCURACY_DRIFT_FACTOR, TIME_DRIFT_FACTOR, driftFindings } from './drift-compare.ts';
import {
  findPromotion,
  findRoutine,
  lockDriftCheckOfTrial,
  recordDriftResult,
} from './drift-checks.repo.ts';

interface DriftResult {
  status: DriftStatus;
  findings: string[];
  summary: string;
  alertOpen: boolean;
}

async function judge(
  tx: DbOrTx,
  promotionId: number,
  finished: FinishedTrial,
): Promise<DriftResult> {
  if (finished.status === 'errored' || !finished.report) {
    return {
      status: 'failed',
      findings: [],
      summary: `The re-run of the incumbent did not finish: ${finished.message ?? 'no reason given'}`,
      alertOpen: false,
    };
  }
  if (finished.status === 'trial-failed') {
    // The incumbent, which ran at its promotion, could not run now: maintainers must look.
    const reason = finished.message ?? 'no reason given';
    return {
      status: 'failed',
      findings: [`The incumbent could not run: ${reason}`],
      summary: 'The re-run of the incumbent could not run.',
      alertOpen: true,
    };
  }
  const promotion = await findPromotion(tx, promotionId);
  const findings = promotion ? driftFindings(promotion.metricsSnapshot, finished.report) : [];
  return findings.length > 0
    ? {
        status: 'drifted',
        findings,
        summary: `The incumbent measured worse than at its promotion (${findings.length} finding${findings.length === 1 ? '' : 's'}).`,
        alertOpen: true,
      }
    : {
        status: 'steady',
        findings,
        summary: `The incumbent measured as at its promotion (accuracy within ${ACCURACY_DRIFT_FACTOR}×, median times within ${TIME_DRIFT_FACTOR}×).`,
        alertOpen: false,
      };
}

/**
 * Judges the drift check whose trial just finished, inside the trial's final transaction:
 * steady, drifted (findings in plain words, alert open) or failed. An open alert goes by e-mail
 * to the team's maintainers through the outbox, so it commits with the verdict or not at all.
 */
export async function finishDriftCheck(
  tx: DbOrTx,
  env: Env,
  finished: FinishedTrial,
): Promise<DriftStatus | null> {
  const check = await lockDriftCheckOfTrial(tx, finished.trial.id);
  if (!check || check.status !== null) return null;
  const result = await judge(tx, check.promotionId, finished);
  await recordDriftResult(tx, check.id, result);
  if (result.alertOpen) {
    const routine = await findRoutine(tx, check.routineId);
    if (routine) {
      const team = await teamNames(tx, routine.teamId);
      const maintainers = await teamAddresses(tx, routine.teamId, ['maintainer']);
      const email = driftAlertEmail(env, {
        teamSlug: team.slug,
        routineId: routine.id,
        routineTitle: routine.title,
        teamName: team.name,
        findings: result.findings,
        checkedAt: new Date(),
      });
      await enqueueEmail(tx, { kind: 'drift-alert', to: maintainers, ...email });
    }
  }
  return result.status;
}
