import type { Env } from '@server/config/env.ts';
import { composeEmail, type EmailContent } from '../compose-email.ts';
import { logbookLink, type RoutineRef } from '../email-links.ts';
import { safetyCaution } from '@shared/safety-caution.ts';

export interface IncumbentChange extends RoutineRef {
  routineTitle: string;
  teamName: string;
  /** Who made the change. */
  maintainerName: string;
  /** The maintainer's note, or empty. */
  note: string;
}

function noteParagraphs(note: string): string[] {
  return note.trim() === '' ? [] : [`Note: ${note.trim()}`];
}

/** To the team: a cleared revision is now the routine's incumbent. */
export function promotedEmail(
  env: Env,
  input: IncumbentChange & { candidateTitle: string; revisionNumber: number },
): EmailContent {
  return composeEmail({
    subject: `Promoted: ${input.candidateTitle} is the incumbent for ${input.routineTitle}`,
    paragraphs: [
      `${input.maintainerName} promoted "${input.candidateTitle}" (revision ${input.revisionNumber}) to be the incumbent for ${input.routineTitle} in ${input.teamName}.`,
      ...noteParagraphs(input.note),
      'The logbook keeps the promotion with its trial and metrics.',
    ],
    action: { label: 'Open the logbook', url: logbookLink(env, input) },
    caution: safetyCaution,
  });
}

/** To the team: an earlier incumbent was restored. */
export function reinstatedEmail(
  env: Env,
  input: IncumbentChange & { revisionLabel: string },
): EmailContent {
  return composeEmail({
    subject: `Reinstated: ${input.revisionLabel} is again the incumbent for ${input.routineTitle}`,
    paragraphs: [
      `${input.maintainerName} reinstated ${input.revisionLabel} as the incumbent for ${input.routineTitle} in ${input.teamName}.`,
      ...noteParagraphs(input.note),
    ],
    action: { label: 'Open the logbook', url: logbookLink(env, input) },
    caution: safetyCaution,
  });
}
