import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { createReviewSchema } from '@shared/api/reviews.ts';
import { candidateStateLabels } from '@shared/states.ts';
import { errorMessage } from './error-message.ts';
import { postReview } from './review.queries.ts';

type ReviewInput = z.input<typeof createReviewSchema>;
type ReviewOutput = z.output<typeof createReviewSchema>;

/**
 * The reviewer's two verdicts on the latest revision: sign off (a remark is optional) or send
 * back (a reason is required, checked with the shared schema before anything is sent).
 */
export function VerdictForm({
  candidateId,
  revisionNumber,
}: {
  candidateId: number;
  revisionNumber: number;
}) {
  const queryClient = useQueryClient();
  const form = useForm<ReviewInput, unknown, ReviewOutput>({
    resolver: zodResolver(createReviewSchema),
    defaultValues: { verdict: 'sign-off', body: '' },
  });
  const mutation = useMutation({
    mutationFn: (review: ReviewOutput) => postReview(candidateId, review),
    onSuccess: async (outcome) => {
      const state = candidateStateLabels[outcome.candidateState];
      toast.success(
        outcome.review.verdict === 'sign-off'
          ? `Signed off revision ${outcome.review.revisionNumber} (${outcome.signOffs} of ${outcome.signOffsRequired}); the candidate is ${state}`
          : `Sent back; the candidate is ${state}`,
      );
      form.reset({ verdict: 'sign-off', body: '' });
      await queryClient.invalidateQueries({ queryKey: ['candidates'] });
    },
    onError: (error) => toast.error(`The verdict was not recorded: ${errorMessage(error)}`),
  });
  const bodyError = form.formState.errors.body?.message;
  const submitAs = (verdict: ReviewOutput['verdict']) => {
    form.setValue('verdict', verdict);
    void form.handleSubmit((values) => mutation.mutate(values))();
  };
  return (
    <form noValidate onSubmit={(e) => e.preventDefault()} className="space-y-2">
      <label htmlFor="verdict-body" className="block text-sm font-medium">
        Reason or remark on revision {revisionNumber}
        <span className="font-normal text-ink-soft"> (required to send back)</span>
      </label>
      <textarea
        id="verdict-body"
        rows={3}
        aria-invalid={bodyError ? true : undefined}
        aria-describedby={bodyError ? 'verdict-body-error' : undefined}
        className="w-full rounded border border-rule bg-white p-2 text-sm"
        {...form.register('body')}
      />
      {bodyError ? (
        <p id="verdict-body-error" className="text-sm text-beyond">
          ✕ {bodyError}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          disabled={mutation.isPending}
          onClick={() => submitAs('sign-off')}
          className="rounded border border-within bg-within px-3 py-1.5 text-sm font-medium text-white disabled:opacity-60"
        >
          ✓ Sign off
        </button>
        <button
          type="button"
          disabled={mutation.isPending}
          onClick={() => submitAs('send-back')}
          className="rounded border border-beyond px-3 py-1.5 text-sm font-medium text-beyond disabled:opacity-60"
        >
          ↩ Send back
        </button>
      </div>
    </form>
  );
}
