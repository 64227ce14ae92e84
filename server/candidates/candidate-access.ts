import type { TeamRole } from '@shared/roles.ts';
import type { CurrentUser } from '@server/auth/current-user.ts';
import type { Db } from '@server/db/client.ts';
import { AppError } from '@server/http/errors.ts';
import { teamRoleOf } from '@server/teams/team-access.ts';
import {
  findCandidate,
  findRoutine,
  type CandidateRow,
  type RoutineRow,
} from './candidates.repo.ts';

export interface RoutineAccess {
  routine: RoutineRow;
  /** The caller's role in the routine's team. */
  role: TeamRole;
}

export interface CandidateAccess extends RoutineAccess {
  candidate: CandidateRow;
}

/**
 * The routine and the caller's role in its team. People outside the team see nothing of it: a
 * routine of another team answers the same 404 as one that does not exist. An instance admin
 * is no exception; admins take part in a team's review process through a membership.
 */
export async function routineAccess(
  db: Db,
  user: CurrentUser,
  routineId: number,
  what = 'routine',
): Promise<RoutineAccess> {
  const routine = await findRoutine(db, routineId);
  const role = routine ? await teamRoleOf(db, routine.teamId, user.id) : null;
  if (!routine || !role) throw new AppError('not-found', `No such ${what}.`);
  return { routine, role };
}

/**
 * The candidate, its routine and the caller's role, with the same 404 rule as above. `what`
 * names the thing asked for in the 404 (a revision reached through its candidate, say).
 */
export async function candidateAccess(
  db: Db,
  user: CurrentUser,
  candidateId: number,
  what = 'candidate',
): Promise<CandidateAccess> {
  const candidate = await findCandidate(db, candidateId);
  const routine = candidate ? await findRoutine(db, candidate.routineId) : null;
  const role = routine ? await teamRoleOf(db, routine.teamId, user.id) : null;
  if (!candidate || !routine || !role) throw new AppError('not-found', `No such ${what}.`);
  return { candidate, routine, role };
}
