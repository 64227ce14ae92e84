import type { Env } from '@server/config/env.ts';
import { composeEmail, type EmailContent } from '../compose-email.ts';
import { candidateLink } from '../email-links.ts';

/** The candidate a review message is about. */
export interface CandidateRef {
  teamSlug: string;
  candidateId: number;
  candidateTitle: string;
  routineTitle: string;
  revisionNumber: number;
}

function openCandidate(env: Env, c: CandidateRef) {
  return { label: 'Open the candidate', url: candidateLink(env, c) };
}

function named(c: CandidateRef): string {
  return `"${c.candidateTitle}" (revision ${c.revisionNumber}) for ${c.routineTitle}`;
}

/** To the team's reviewers: a trial finished and the candidate needs their verdict. */
export function awaitsReviewEmail(
  env: Env,
  input: CandidateRef & { authorName: string },
): EmailContent {
  return composeEmail({
    subject: `Awaits review: ${input.candidateTitle} (${input.routineTitle})`,
    paragraphs: [
      `${input.authorName}'s candidate ${named(input)} has finished its trial and awaits review.`,
      'The report shows its accuracy and timing next to the incumbent, and the source diff.',
    ],
    action: openCandidate(env, input),
  });
}

/** To the author: a reviewer sent the candidate back, with the reviewer's reason. */
export function sentBackEmail(
  env: Env,
  input: CandidateRef & { reviewerName: string; reason: string },
): EmailContent {
  return composeEmail({
    subject: `Sent back: ${input.candidateTitle} (${input.routineTitle})`,
    paragraphs: [
      `${input.reviewerName} sent back your candidate ${named(input)}.`,
      `Reason: ${input.reason}`,
      'A new revision puts it on trial again.',
    ],
    action: openCandidate(env, input),
  });
}

/** To the author: one reviewer signed off; more may still be needed. */
export function signedOffEmail(
  env: Env,
  input: CandidateRef & { reviewerName: string; signOffs: number; signOffsNeeded: number },
): EmailContent {
  return composeEmail({
    subject: `Signed off: ${input.candidateTitle} (${input.routineTitle})`,
    paragraphs: [
      `${input.reviewerName} signed off your candidate ${named(input)}.`,
      `It has ${input.signOffs} of the ${input.signOffsNeeded} sign-offs the acceptance policy asks for.`,
    ],
    action: openCandidate(env, input),
  });
}

/** To the team's maintainers: the candidate is cleared and can be promoted. */
export function clearedEmail(env: Env, input: CandidateRef & { authorName: string }): EmailContent {
  return composeEmail({
    subject: `Cleared: ${input.candidateTitle} (${input.routineTitle})`,
    paragraphs: [
      `${input.authorName}'s candidate ${named(input)} is cleared: it meets the acceptance policy and has its sign-offs.`,
      'A maintainer can now promote it to be the incumbent.',
    ],
    action: openCandidate(env, input),
  });
}
