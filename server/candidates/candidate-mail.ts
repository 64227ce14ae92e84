import type { CandidateRef } from '@server/mail/messages/review-emails.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';
import type { CandidateRow, RoutineRow } from './candidates.repo.ts';
import { contactOf, teamNames, type Contact } from './team-recipients.repo.ts';

/** What the review messages say about a candidate, and where its author is reached. */
export interface CandidateMailContext {
  ref: CandidateRef;
  author: Contact;
  team: { name: string; slug: string };
}

export async function candidateMailContext(
  db: DbOrTx,
  routine: RoutineRow,
  candidate: CandidateRow,
  revisionNumber: number,
): Promise<CandidateMailContext> {
  const author = await contactOf(db, candidate.authorId);
  const team = await teamNames(db, routine.teamId);
  return {
    ref: {
      teamSlug: team.slug,
      candidateId: candidate.id,
      candidateTitle: candidate.title,
      routineTitle: routine.title,
      revisionNumber,
    },
    author,
    team,
  };
}
