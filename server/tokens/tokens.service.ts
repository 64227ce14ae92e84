import type { PaginationQuery } from '@shared/api/pagination.ts';
import type {
  ApiToken,
  ApiTokenPage,
  CreateApiToken,
  CreatedApiToken,
} from '@shared/api/tokens.ts';
import { generateApiToken } from '@server/auth/api-token-secret.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { mayRevokeToken } from './tokens.policy.ts';
import {
  findToken,
  insertToken,
  listTokensOf,
  revokeTokenRow,
  type ApiTokenRow,
} from './tokens.repo.ts';

function toApiToken(row: ApiTokenRow): ApiToken {
  return {
    id: row.id,
    name: row.name,
    prefix: row.prefix,
    createdAt: row.createdAt.toISOString(),
    lastUsedAt: row.lastUsedAt?.toISOString() ?? null,
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}

export async function listMyTokens(
  db: Db,
  user: CurrentUser,
  page: PaginationQuery,
): Promise<ApiTokenPage> {
  const { rows, total } = await listTokensOf(db, user.id, page);
  return { items: rows.map(toApiToken), total, limit: page.limit, offset: page.offset };
}

/** A new token for the caller. Only its hash is stored; the secret is in this answer alone. */
export async function createToken(
  db: Db,
  user: CurrentUser,
  input: CreateApiToken,
): Promise<CreatedApiToken> {
  const { token, hash, prefix } = generateApiToken();
  const row = await insertToken(db, { userId: user.id, name: input.name, tokenHash: hash, prefix });
  return { token, ...toApiToken(row) };
}

/** Revokes one of the caller's tokens; other people's tokens answer 404 like missing ones. */
export async function revokeToken(db: Db, user: CurrentUser, id: number): Promise<ApiToken> {
  const token = await findToken(db, id);
  if (!token || !mayRevokeToken(user, token)) {
    throw new AppError('not-found', 'No such API token.');
  }
  const revoked = await revokeTokenRow(db, id);
  return toApiToken(revoked ?? token);
}
