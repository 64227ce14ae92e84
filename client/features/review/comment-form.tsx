import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { createCommentSchema } from '@shared/api/comments.ts';
import { errorMessage } from './error-message.ts';
import { commentQueries, postComment } from './review.queries.ts';

type CommentInput = z.input<typeof createCommentSchema>;
type CommentOutput = z.output<typeof createCommentSchema>;

interface CommentFormProps {
  candidateId: number;
  /** A line comment names the revision and the line; a general comment neither. */
  target?: { revisionId: number; revisionNumber: number; line: number };
  label: string;
  submitLabel: string;
  onDone?: () => void;
  autoFocus?: boolean;
}

/** Writes a comment: on one line of a revision, or to the general thread. */
export function CommentForm({
  candidateId,
  target,
  label,
  submitLabel,
  onDone,
  autoFocus,
}: CommentFormProps) {
  const queryClient = useQueryClient();
  const form = useForm<CommentInput, unknown, CommentOutput>({
    resolver: zodResolver(createCommentSchema),
    values: { body: '', revisionId: target?.revisionId, line: target?.line },
    resetOptions: { keepDirtyValues: true },
  });
  const mutation = useMutation({
    mutationFn: (comment: CommentOutput) => postComment(candidateId, comment),
    onSuccess: async () => {
      toast.success(target ? `Comment added to line ${target.line}` : 'Comment added');
      form.reset({ body: '', revisionId: target?.revisionId, line: target?.line });
      await queryClient.invalidateQueries({ queryKey: commentQueries.all(candidateId) });
      onDone?.();
    },
    onError: (error) => toast.error(`The comment was not saved: ${errorMessage(error)}`),
  });
  const fieldId = target ? `line-comment-${target.line}` : 'general-comment';
  const bodyError = form.formState.errors.body?.message;
  return (
    <form
      noValidate
      onSubmit={form.handleSubmit((values) => mutation.mutate(values))}
      className="space-y-2"
    >
      <label htmlFor={fieldId} className="block text-sm font-medium">
        {label}
      </label>
      <textarea
        id={fieldId}
        rows={3}
        autoFocus={autoFocus}
        aria-invalid={bodyError ? true : undefined}
        aria-describedby={bodyError ? `${fieldId}-error` : undefined}
        className="w-full rounded border border-rule bg-white p-2 text-sm"
        {...form.register('body')}
      />
      {bodyError ? (
        <p id={`${fieldId}-error`} className="text-sm text-beyond">
          ✕ {bodyError}
        </p>
      ) : null}
      <div className="flex gap-2">
        <button
          type="submit"
          disabled={mutation.isPending}
          className="rounded border border-ink bg-ink px-3 py-1 text-sm font-medium text-paper disabled:opacity-60"
        >
          {mutation.isPending ? 'Saving…' : submitLabel}
        </button>
        {onDone ? (
          <button
            type="button"
            onClick={onDone}
            className="rounded border border-rule px-3 py-1 text-sm"
          >
            Cancel
          </button>
        ) : null}
      </div>
    </form>
  );
}
