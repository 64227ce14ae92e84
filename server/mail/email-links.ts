import { publicUrl, type Env } from '@server/config/env.ts';

// Links in e-mail lead to the client's pages; these paths must match client/app/paths.ts.

export function invitationLink(env: Env, token: string): string {
  return `${publicUrl(env)}/invitations/${encodeURIComponent(token)}`;
}

export interface CandidateLinkRef {
  teamSlug: string;
  candidateId: number;
}

export function candidateLink(env: Env, ref: CandidateLinkRef): string {
  return `${publicUrl(env)}/teams/${encodeURIComponent(ref.teamSlug)}/candidates/${ref.candidateId}`;
}

export interface RoutineRef {
  teamSlug: string;
  routineId: number;
}

export function logbookLink(env: Env, routine: RoutineRef): string {
  const team = encodeURIComponent(routine.teamSlug);
  return `${publicUrl(env)}/teams/${team}/routines/${routine.routineId}/logbook`;
}
