/**
 * Every page's address in one place, so links and routes agree. Team pages live under
 * `/teams/:teamSlug/...`; ids are the API's numeric ids.
 */
export const paths = {
  home: () => '/',
  team: (teamSlug: string) => `/teams/${teamSlug}`,
  routines: (teamSlug: string) => `/teams/${teamSlug}/routines`,
  routine: (teamSlug: string, routineId: number) => `/teams/${teamSlug}/routines/${routineId}`,
  submit: (teamSlug: string, routineId: number) =>
    `/teams/${teamSlug}/routines/${routineId}/submit`,
  candidate: (teamSlug: string, candidateId: number) =>
    `/teams/${teamSlug}/candidates/${candidateId}`,
  revise: (teamSlug: string, candidateId: number) =>
    `/teams/${teamSlug}/candidates/${candidateId}/revise`,
  trial: (teamSlug: string, trialId: number) => `/teams/${teamSlug}/trials/${trialId}`,
  // Part B's pages (review, promotions, logbook, team admin, mailbox).
  logbook: (teamSlug: string) => `/teams/${teamSlug}/logbook`,
  routineLogbook: (teamSlug: string, routineId: number) =>
    `/teams/${teamSlug}/routines/${routineId}/logbook`,
  promotions: (teamSlug: string, routineId: number) =>
    `/teams/${teamSlug}/routines/${routineId}/promotions`,
  teamAdmin: (teamSlug: string) => `/teams/${teamSlug}/team`,
  mailbox: () => '/dev/mailbox',
  invitation: (token: string) => `/invitations/${encodeURIComponent(token)}`,
};
