import { queryOptions } from '@tanstack/react-query';
import { apiGet, apiSend } from '@client/api/api-client.ts';
import { candidatePageSchema } from '@shared/api/candidates.ts';
import { logbookSchema } from '@shared/api/logbook.ts';
import { promotionOutcomeSchema, type Promote, type Reinstate } from '@shared/api/promotions.ts';

export const promotionQueries = {
  cleared: (routineId: number) =>
    queryOptions({
      queryKey: ['candidates', 'cleared', routineId],
      queryFn: ({ signal }) =>
        apiGet(`/api/routines/${routineId}/cleared?limit=100`, candidatePageSchema, signal),
    }),
  /** The routine's history: its promotions (for reinstating), tenures and drift checks. */
  logbook: (routineId: number) =>
    queryOptions({
      queryKey: ['routines', 'logbook', routineId],
      queryFn: ({ signal }) => apiGet(`/api/routines/${routineId}/logbook`, logbookSchema, signal),
    }),
};

export const promoteCandidate = (candidateId: number, body: Promote) =>
  apiSend('POST', `/api/candidates/${candidateId}/promote`, body, promotionOutcomeSchema);

export const reinstatePromotion = (routineId: number, body: Reinstate) =>
  apiSend('POST', `/api/routines/${routineId}/reinstate`, body, promotionOutcomeSchema);
