import type { Me } from '@shared/api/me.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { findProfile, listTeamsOf } from './me.repo.ts';

/** Who the caller is and the teams they belong to, with their role in each. */
export async function describeMe(db: Db, user: CurrentUser): Promise<Me> {
  const [profile, teams] = await Promise.all([findProfile(db, user.id), listTeamsOf(db, user.id)]);
  if (!profile) throw new AppError('unauthenticated', 'Sign in first.');
  return { user: profile, teams };
}
