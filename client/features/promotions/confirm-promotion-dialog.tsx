import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { promoteSchema } from '@shared/api/promotions.ts';
import { safetyCaution } from '@shared/safety-caution.ts';

type NoteInput = z.input<typeof promoteSchema>;
type NoteOutput = z.output<typeof promoteSchema>;

interface ConfirmPromotionDialogProps {
  /** What is about to happen, e.g. "Promote “Blocked LU” (revision 2)". */
  title: string;
  /** One line on what changes. */
  summary: string;
  confirmLabel: string;
  pending: boolean;
  onConfirm: (note: string) => void;
  onCancel: () => void;
}

/**
 * A modal confirmation (the browser's own <dialog>, which keeps focus inside it and closes on
 * Escape) that shows the safety caution and takes an optional note.
 */
export function ConfirmPromotionDialog({
  title,
  summary,
  confirmLabel,
  pending,
  onConfirm,
  onCancel,
}: ConfirmPromotionDialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const form = useForm<NoteInput, unknown, NoteOutput>({
    resolver: zodResolver(promoteSchema),
    defaultValues: { note: '' },
  });
  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);
  const noteError = form.formState.errors.note?.message;
  return (
    <dialog
      ref={ref}
      aria-labelledby="confirm-promotion-title"
      aria-describedby="safety-caution"
      onCancel={(e) => {
        e.preventDefault();
        onCancel();
      }}
      className="m-auto w-full max-w-xl rounded border border-rule bg-paper p-6 text-ink shadow-xl backdrop:bg-ink/40"
    >
      <form noValidate onSubmit={form.handleSubmit((values) => onConfirm(values.note))}>
        <h2 id="confirm-promotion-title" className="text-xl font-semibold">
          {title}
        </h2>
        <p className="mt-2 text-sm text-ink-soft">{summary}</p>
        <div
          id="safety-caution"
          role="note"
          aria-label="Safety caution"
          className="mt-4 rounded border-l-4 border-near bg-near/10 p-3 text-sm"
        >
          <p className="mb-1 font-semibold">
            <span aria-hidden="true">⚠ </span>Safety caution
          </p>
          <p data-testid="safety-caution">{safetyCaution}</p>
        </div>
        <label htmlFor="promotion-note" className="mt-4 block text-sm font-medium">
          Note for the record <span className="font-normal text-ink-soft">(optional)</span>
        </label>
        <textarea
          id="promotion-note"
          rows={3}
          aria-invalid={noteError ? true : undefined}
          className="mt-1 w-full rounded border border-rule bg-white p-2 text-sm"
          {...form.register('note')}
        />
        {noteError ? <p className="text-sm text-beyond">✕ {noteError}</p> : null}
        <div className="mt-4 flex justify-end gap-2">
          <button
            type="button"
            onClick={onCancel}
            className="rounded border border-rule px-3 py-1.5 text-sm"
          >
            Cancel
          </button>
          <button
            type="submit"
            disabled={pending}
            className="rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper disabled:opacity-60"
          >
            {pending ? 'Working…' : confirmLabel}
          </button>
        </div>
      </form>
    </dialog>
  );
}
