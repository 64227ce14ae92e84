import { publicUrl, type Env } from '@server/config/env.ts';

// Links in e-mail lead to the client's pages; these paths must match client/app/router.tsx.

export function invitationLink(env: Env, token: string): string {
  return `${publicUrl(env)}/invitations/${encodeURIComponent(token)}`;
}

export function candidateLink(env: Env, candidateId: number): string {
  return `${publicUrl(env)}/candidates/${candidateId}`;
}

export interface RoutineRef {
  teamSlug: string;
  routineSlug: string;
}

export function logbookLink(env: Env, routine: RoutineRef): string {
  const team = encodeURIComponent(routine.teamSlug);
  const slug = encodeURIComponent(routine.routineSlug);
  return `${publicUrl(env)}/teams/${team}/routines/${slug}/logbook`;
}
