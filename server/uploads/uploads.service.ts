import type { PaginationQuery } from '@shared/api/pagination.ts';
import type { MatrixMarketSummary, Upload, UploadPage } from '@shared/api/uploads.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import { recordAudit } from '@server/audit/audit.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { requireTeamRole, teamRoleOf } from '@server/teams/team-access.ts';
import type { ReceivedFile } from './matrix-market-file.ts';
import { readMatrixMarket } from './read-matrix-market.ts';
import { uploaders } from './uploads.policy.ts';
import {
  findUpload,
  insertUpload,
  listTeamUploads,
  readUploadContent,
  type UploadRow,
} from './uploads.repo.ts';

export function toUpload(row: UploadRow): Upload {
  return {
    id: row.id,
    teamId: row.teamId,
    fileName: row.fileName,
    bytes: row.bytes,
    rows: row.rows,
    cols: row.cols,
    entries: row.entries,
    // Only values the engine's reader produced are ever stored.
    symmetry: row.symmetry as Upload['symmetry'],
    field: row.field as Upload['field'],
    format: row.format as Upload['format'],
    uploadedBy: { id: row.uploadedBy, login: row.uploaderLogin },
    createdAt: row.createdAt.toISOString(),
  };
}

/** Refuses anyone who may not upload to the team, before the file is read. */
export async function checkMayUpload(db: Db, user: CurrentUser, teamId: number): Promise<void> {
  await requireTeamRole(db, user, teamId, uploaders);
}

/** What parsing finds in a file, storing nothing (maintainers). */
export async function previewUpload(
  db: Db,
  user: CurrentUser,
  teamId: number,
  file: ReceivedFile,
): Promise<MatrixMarketSummary> {
  await checkMayUpload(db, user, teamId);
  return readMatrixMarket(file).summary;
}

/** Stores a file that parses, with what parsing found (maintainers); a bad file stores nothing. */
export async function storeUpload(
  db: Db,
  user: CurrentUser,
  teamId: number,
  file: ReceivedFile,
): Promise<Upload> {
  await checkMayUpload(db, user, teamId);
  const { summary, text } = readMatrixMarket(file);
  const id = await db.transaction(async (tx) => {
    const uploadId = await insertUpload(tx, {
      teamId,
      uploadedBy: user.id,
      content: text,
      summary,
    });
    await recordAudit(tx, {
      actorId: user.id,
      teamId,
      action: 'upload.created',
      entity: 'upload',
      entityId: uploadId,
      details: { fileName: summary.fileName, rows: summary.rows, cols: summary.cols },
    });
    return uploadId;
  });
  return toUpload((await findUpload(db, id))!);
}

/** The team's uploads, newest first, without content (members). */
export async function listUploads(
  db: Db,
  user: CurrentUser,
  teamId: number,
  page: PaginationQuery,
): Promise<UploadPage> {
  await requireTeamRole(db, user, teamId);
  const { rows, total } = await listTeamUploads(db, teamId, page);
  return { items: rows.map(toUpload), total, limit: page.limit, offset: page.offset };
}

/** The file's text as uploaded (members of its team; 404 for everyone else). */
export async function uploadContent(
  db: Db,
  user: CurrentUser,
  id: number,
): Promise<{ fileName: string; content: string }> {
  const row = await readUploadContent(db, id);
  const role = row ? await teamRoleOf(db, row.teamId, user.id) : null;
  if (!row || !role) throw new AppError('not-found', 'No such upload.');
  return { fileName: row.fileName, content: row.content };
}
