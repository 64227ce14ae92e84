import { and, count, desc, eq, inArray } from 'drizzle-orm';
import type { MatrixMarketSummary } from '@shared/api/uploads.ts';
import type { Db } from '@server/db/client.ts';
import { uploads } from '@server/db/schema/uploads.ts';
import { users } from '@server/db/schema/users.ts';
import type { DbOrTx } from '@server/mail/outbox.repo.ts';

/** An upload without its content, with who uploaded it. */
export interface UploadRow {
  id: number;
  teamId: number;
  fileName: string;
  bytes: number;
  rows: number;
  cols: number;
  entries: number;
  symmetry: string;
  field: string;
  format: string;
  uploadedBy: number;
  uploaderLogin: string;
  createdAt: Date;
}

const listed = {
  id: uploads.id,
  teamId: uploads.teamId,
  fileName: uploads.fileName,
  bytes: uploads.bytes,
  rows: uploads.rows,
  cols: uploads.cols,
  entries: uploads.entries,
  symmetry: uploads.symmetry,
  field: uploads.field,
  format: uploads.format,
  uploadedBy: uploads.uploadedBy,
  uploaderLogin: users.login,
  createdAt: uploads.createdAt,
};

export async function insertUpload(
  tx: DbOrTx,
  values: { teamId: number; uploadedBy: number; content: string; summary: MatrixMarketSummary },
): Promise<number> {
  const { summary: s } = values;
  const [row] = await tx
    .insert(uploads)
    .values({
      teamId: values.teamId,
      uploadedBy: values.uploadedBy,
      content: values.content,
      fileName: s.fileName,
      bytes: s.bytes,
      rows: s.rows,
      cols: s.cols,
      entries: s.entries,
      symmetry: s.symmetry,
      field: s.field,
      format: s.format,
    })
    .returning({ id: uploads.id });
  return row!.id;
}

export async function findUpload(db: DbOrTx, id: number): Promise<UploadRow | null> {
  const [row] = await db
    .select(listed)
    .from(uploads)
    .innerJoin(users, eq(users.id, uploads.uploadedBy))
    .where(eq(uploads.id, id))
    .limit(1);
  return row ?? null;
}

/** The uploads of a team among `ids` (others', and missing ones, are left out). */
export async function findTeamUploads(db: DbOrTx, teamId: number, ids: number[]) {
  if (ids.length === 0) return [];
  return db
    .select(listed)
    .from(uploads)
    .innerJoin(users, eq(users.id, uploads.uploadedBy))
    .where(and(eq(uploads.teamId, teamId), inArray(uploads.id, ids)));
}

export async function readUploadContent(db: Db, id: number) {
  const [row] = await db
    .select({ teamId: uploads.teamId, content: uploads.content, fileName: uploads.fileName })
    .from(uploads)
    .where(eq(uploads.id, id))
    .limit(1);
  return row ?? null;
}

/** A page of a team's uploads, newest first, without content. */
export async function listTeamUploads(
  db: Db,
  teamId: number,
  page: { limit: number; offset: number },
): Promise<{ rows: UploadRow[]; total: number }> {
  const [rows, [totals]] = await Promise.all([
    db
      .select(listed)
      .from(uploads)
      .innerJoin(users, eq(users.id, uploads.uploadedBy))
      .where(eq(uploads.teamId, teamId))
      .orderBy(desc(uploads.createdAt), desc(uploads.id))
      .limit(page.limit)
      .offset(page.offset),
    db.select({ total: count() }).from(uploads).where(eq(uploads.teamId, teamId)),
  ]);
  return { rows, total: totals?.total ?? 0 };
}
