import { and, asc, countDistinct, eq, ne } from 'drizzle-orm';
import type { ReviewVerdict } from '@shared/states.ts';
import { reviews } from '@server/db/schema/reviews.ts';
import { revisions } from '@server/db/schema/revisions.ts';
import { users } from '@server/db/schema/users.ts';
import { personColumns, type PersonRow } from '@server/candidates/candidates.repo.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

export type ReviewRow = typeof reviews.$inferSelect;

export interface ReviewListRow {
  review: ReviewRow;
  revisionNumber: number;
  reviewer: PersonRow;
}

function reviewRows(db: DbOrTx) {
  return db
    .select({ review: reviews, revisionNumber: revisions.number, reviewer: personColumns })
    .from(reviews)
    .innerJoin(revisions, eq(revisions.id, reviews.revisionId))
    .innerJoin(users, eq(users.id, reviews.reviewerId));
}

/** Every verdict on a candidate, oldest first. */
export async function reviewsOf(db: DbOrTx, candidateId: number): Promise<ReviewListRow[]> {
  return reviewRows(db)
    .where(eq(reviews.candidateId, candidateId))
    .orderBy(asc(reviews.createdAt), asc(reviews.id));
}

export async function findReview(db: DbOrTx, id: number): Promise<ReviewListRow | null> {
  const [row] = await reviewRows(db).where(eq(reviews.id, id)).limit(1);
  return row ?? null;
}

export async function insertReview(
  tx: DbOrTx,
  values: {
    candidateId: number;
    revisionId: number;
    reviewerId: number;
    verdict: ReviewVerdict;
    body: string;
  },
): Promise<ReviewRow> {
  const [row] = await tx.insert(reviews).values(values).returning();
  return row!;
}

/** Distinct reviewers, other than the author, who signed off this revision. */
export async function countSignOffs(
  db: DbOrTx,
  revisionId: number,
  authorId: number,
): Promise<number> {
  const [row] = await db
    .select({ n: countDistinct(reviews.reviewerId) })
    .from(reviews)
    .where(
      and(
        eq(reviews.revisionId, revisionId),
        eq(reviews.verdict, 'sign-off'),
        ne(reviews.reviewerId, authorId),
      ),
    );
  return row?.n ?? 0;
}

/** Whether this reviewer already signed off this revision. */
export async function hasSignedOff(
  db: DbOrTx,
  revisionId: number,
  reviewerId: number,
): Promise<boolean> {
  const [row] = await db
    .select({ id: reviews.id })
    .from(reviews)
    .where(
      and(
        eq(reviews.revisionId, revisionId),
        eq(reviews.reviewerId, reviewerId),
        eq(reviews.verdict, 'sign-off'),
      ),
    )
    .limit(1);
  return row !== undefined;
}
