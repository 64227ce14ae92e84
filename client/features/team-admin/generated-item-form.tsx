import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { generatedItemInputSchema } from '@shared/api/matrix-sets.ts';
import { suggestedFamilies } from './matrix-families.ts';

type ItemInput = z.input<typeof generatedItemInputSchema>;
type ItemOutput = z.output<typeof generatedItemInputSchema>;

/** A generated family with its size and seed (the seed is optional: the engine has a default). */
export function GeneratedItemForm({
  idPrefix,
  submitLabel,
  pending,
  onAdd,
}: {
  idPrefix: string;
  submitLabel: string;
  pending: boolean;
  onAdd: (item: ItemOutput) => void;
}) {
  const form = useForm<ItemInput, unknown, ItemOutput>({
    resolver: zodResolver(generatedItemInputSchema),
    defaultValues: { kind: 'generated', family: 'hilbert', n: 8 },
  });
  const errors = form.formState.errors;
  const setValueAsOptional = (v: unknown) => (v === '' || v === null ? undefined : Number(v));
  return (
    <form
      noValidate
      onSubmit={form.handleSubmit((v) => onAdd(v))}
      className="flex flex-wrap items-end gap-3 text-sm"
    >
      <label>
        <span className="block font-medium">Family</span>
        <input
          list={`${idPrefix}-families`}
          className="w-48 rounded border border-rule bg-white px-2 py-1 font-mono"
          {...form.register('family')}
        />
        <datalist id={`${idPrefix}-families`}>
          {suggestedFamilies.map((f) => (
            <option key={f} value={f} />
          ))}
        </datalist>
      </label>
      <label>
        <span className="block font-medium">Size n</span>
        <input
          type="number"
          min={1}
          className="w-24 rounded border border-rule bg-white px-2 py-1 font-mono"
          {...form.register('n', { valueAsNumber: true })}
        />
      </label>
      <label>
        <span className="block font-medium">
          Seed <span className="font-normal text-ink-soft">(optional)</span>
        </span>
        <input
          type="number"
          min={0}
          className="w-28 rounded border border-rule bg-white px-2 py-1 font-mono"
          {...form.register('seed', { setValueAs: setValueAsOptional })}
        />
      </label>
      <button
        type="submit"
        disabled={pending}
        className="rounded border border-ink px-3 py-1.5 font-medium disabled:opacity-60"
      >
        {submitLabel}
      </button>
      {errors.family || errors.n || errors.seed ? (
        <p className="w-full text-beyond">
          ✕ {errors.family?.message ?? errors.n?.message ?? errors.seed?.message}
        </p>
      ) : null}
    </form>
  );
}
