import { useMutation, useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { apiSend } from '@client/api/api-client.ts';
import { submissionSchema, type CreateCandidate } from '@shared/api/candidates.ts';
import type { CreateRevision } from '@shared/api/revisions.ts';

function useInvalidateAfterSubmit() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: ['candidates'] }),
      queryClient.invalidateQueries({ queryKey: ['routines'] }),
      queryClient.invalidateQueries({ queryKey: ['revisions'] }),
    ]);
}

/** `POST /api/routines/:id/candidates`: a new candidate with its first revision. */
export function useSubmitCandidate(routineId: number) {
  const invalidate = useInvalidateAfterSubmit();
  return useMutation({
    mutationFn: (body: CreateCandidate) =>
      apiSend('POST', `/api/routines/${routineId}/candidates`, body, submissionSchema),
    onSuccess: async (result) => {
      await invalidate();
      if (result.trial) toast.success('Submitted: the trial is queued.');
      else toast.error('Submitted, but type errors keep the trial from running.');
    },
    onError: (error) => toast.error(`Could not submit: ${error.message}`),
  });
}

/** `POST /api/candidates/:id/revisions`: a new revision of my candidate. */
export function useSubmitRevision(candidateId: number) {
  const invalidate = useInvalidateAfterSubmit();
  return useMutation({
    mutationFn: (body: CreateRevision) =>
      apiSend('POST', `/api/candidates/${candidateId}/revisions`, body, submissionSchema),
    onSuccess: async (result) => {
      await invalidate();
      if (result.trial)
        toast.success(`Revision ${result.revision.number} submitted: the trial is queued.`);
      else toast.error(`Revision ${result.revision.number} has type errors; no trial runs.`);
    },
    onError: (error) => toast.error(`Could not submit the revision: ${error.message}`),
  });
}
