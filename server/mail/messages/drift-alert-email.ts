import type { Env } from '@server/config/env.ts';
import { composeEmail, type EmailContent } from '../compose-email.ts';
import { logbookLink, type RoutineRef } from '../email-links.ts';

export interface DriftAlertInput extends RoutineRef {
  routineTitle: string;
  teamName: string;
  /** Plain-words findings: which size or metric moved, by how much. */
  findings: readonly string[];
  checkedAt: Date;
}

/** To the team's maintainers: a scheduled re-run of the incumbent came out significantly worse. */
export function driftAlertEmail(env: Env, input: DriftAlertInput): EmailContent {
  return composeEmail({
    subject: `Drift on ${input.routineTitle}: the incumbent measured worse`,
    paragraphs: [
      `The scheduled re-run of the incumbent for ${input.routineTitle} in ${input.teamName} on ${input.checkedAt.toISOString().slice(0, 10)} differs significantly from the measurements at its promotion.`,
      input.findings.length > 0 ? 'What drifted:' : 'The drift check gave no details.',
    ],
    list: input.findings,
    action: { label: 'Open the logbook', url: logbookLink(env, input) },
  });
}
