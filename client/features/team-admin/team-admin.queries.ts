import { queryOptions } from '@tanstack/react-query';
import { apiGet, apiSend } from '@client/api/api-client.ts';
import {
  invitationPageSchema,
  invitationSchema,
  type CreateInvitation,
} from '@shared/api/invitations.ts';
import {
  matrixSetDetailSchema,
  matrixSetPageSchema,
  type MatrixSetInput,
} from '@shared/api/matrix-sets.ts';
import { memberPageSchema, memberSchema } from '@shared/api/members.ts';
import { routineDetailSchema, type PolicyChanges } from '@shared/api/routines.ts';
import { apiTokenPageSchema, apiTokenSchema, createdApiTokenSchema } from '@shared/api/tokens.ts';
import { matrixMarketSummarySchema, uploadSchema } from '@shared/api/uploads.ts';
import type { TeamRole } from '@shared/roles.ts';

/** Query options for the team admin page, keyed under `['team-admin', teamId, ...]`. */
export const teamAdminQueries = {
  all: (teamId: number) => ['team-admin', teamId] as const,
  members: (teamId: number) =>
    queryOptions({
      queryKey: [...teamAdminQueries.all(teamId), 'members'],
      queryFn: ({ signal }) =>
        apiGet(`/api/teams/${teamId}/members?limit=100`, memberPageSchema, signal),
    }),
  invitations: (teamId: number) =>
    queryOptions({
      queryKey: [...teamAdminQueries.all(teamId), 'invitations'],
      queryFn: ({ signal }) =>
        apiGet(`/api/teams/${teamId}/invitations?limit=100`, invitationPageSchema, signal),
    }),
  matrixSets: (teamId: number) =>
    queryOptions({
      queryKey: [...teamAdminQueries.all(teamId), 'matrix-sets'],
      queryFn: ({ signal }) =>
        apiGet(`/api/teams/${teamId}/matrix-sets?limit=100`, matrixSetPageSchema, signal),
    }),
  matrixSet: (teamId: number, setId: number) =>
    queryOptions({
      queryKey: [...teamAdminQueries.all(teamId), 'matrix-sets', setId],
      queryFn: ({ signal }) => apiGet(`/api/matrix-sets/${setId}`, matrixSetDetailSchema, signal),
    }),
};

/** The caller's own API tokens (not a team's). */
export const tokenQueries = {
  all: () => ['tokens'] as const,
  list: () =>
    queryOptions({
      queryKey: tokenQueries.all(),
      queryFn: ({ signal }) => apiGet('/api/tokens?limit=100', apiTokenPageSchema, signal),
    }),
};

export const changeRole = (teamId: number, userId: number, role: TeamRole) =>
  apiSend('PATCH', `/api/teams/${teamId}/members/${userId}`, { role }, memberSchema);
export const removeMember = (teamId: number, userId: number) =>
  apiSend('DELETE', `/api/teams/${teamId}/members/${userId}`);
export const invite = (teamId: number, body: CreateInvitation) =>
  apiSend('POST', `/api/teams/${teamId}/invitations`, body, invitationSchema);
export const revokeInvitation = (teamId: number, id: number) =>
  apiSend('DELETE', `/api/teams/${teamId}/invitations/${id}`, undefined, invitationSchema);
export const createMatrixSet = (teamId: number, body: MatrixSetInput) =>
  apiSend('POST', `/api/teams/${teamId}/matrix-sets`, body, matrixSetDetailSchema);
export const replaceMatrixSet = (setId: number, body: MatrixSetInput) =>
  apiSend('PUT', `/api/matrix-sets/${setId}`, body, matrixSetDetailSchema);

function fileForm(file: File): FormData {
  const form = new FormData();
  form.append('file', file, file.name);
  return form;
}
export const previewUpload = (teamId: number, file: File) =>
  apiSend(
    'POST',
    `/api/teams/${teamId}/uploads/preview`,
    fileForm(file),
    matrixMarketSummarySchema,
  );
export const storeUpload = (teamId: number, file: File) =>
  apiSend('POST', `/api/teams/${teamId}/uploads`, fileForm(file), uploadSchema);
export const updatePolicy = (routineId: number, policy: PolicyChanges) =>
  apiSend('PATCH', `/api/routines/${routineId}`, { policy }, routineDetailSchema);
export const createToken = (name: string) =>
  apiSend('POST', '/api/tokens', { name }, createdApiTokenSchema);
export const revokeToken = (id: number) =>
  apiSend('DELETE', `/api/tokens/${id}`, undefined, apiTokenSchema);
