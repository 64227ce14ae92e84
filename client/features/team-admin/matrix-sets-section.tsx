import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { toast } from 'sonner';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { errorMessage } from '@client/features/review/error-message.ts';
import { Section } from '@client/features/review/section.tsx';
import type {
  MatrixSetDetail,
  MatrixSetInput,
  MatrixSetItemInput,
} from '@shared/api/matrix-sets.ts';
import { GeneratedItemForm } from './generated-item-form.tsx';
import { withItem } from './matrix-set-input.ts';
import { MatrixUpload } from './matrix-upload.tsx';
import { createMatrixSet, replaceMatrixSet, teamAdminQueries } from './team-admin.queries.ts';

/** The team's matrix sets: their items, generated families added by size and seed, and uploads. */
export function MatrixSetsSection({ teamId }: { teamId: number }) {
  const sets = useQuery(teamAdminQueries.matrixSets(teamId));
  const [chosen, setChosen] = useState<number | null>(null);
  const setId = chosen ?? sets.data?.items[0]?.id ?? null;
  return (
    <Section title="Matrix sets" id="matrix-sets">
      {sets.isPending ? (
        <LoadingState label="Loading the matrix sets…" />
      ) : sets.isError ? (
        <ErrorState error={sets.error} onRetry={() => void sets.refetch()} />
      ) : (
        <div className="space-y-4">
          {setId === null ? (
            <EmptyState title="This team has no matrix set yet." />
          ) : (
            <>
              <label className="text-sm">
                <span className="mr-2 font-medium">Matrix set</span>
                <select
                  value={setId}
                  onChange={(e) => setChosen(Number(e.target.value))}
                  className="rounded border border-rule bg-white px-2 py-1"
                >
                  {sets.data.items.map((s) => (
                    <option key={s.id} value={s.id}>
                      {s.name} ({s.itemCount} matrices)
                    </option>
                  ))}
                </select>
              </label>
              <MatrixSetEditor key={setId} teamId={teamId} setId={setId} />
            </>
          )}
          <NewMatrixSet teamId={teamId} onCreated={setChosen} />
        </div>
      )}
    </Section>
  );
}

function MatrixSetEditor({ teamId, setId }: { teamId: number; setId: number }) {
  const queryClient = useQueryClient();
  const set = useQuery(teamAdminQueries.matrixSet(teamId, setId));
  const replace = useMutation({
    mutationFn: ({ current, extra }: { current: MatrixSetDetail; extra: MatrixSetItemInput }) =>
      replaceMatrixSet(current.id, withItem(current, extra)),
    onSuccess: async (updated) => {
      toast.success(`${updated.name} has ${updated.itemCount} matrices now`);
      await queryClient.invalidateQueries({ queryKey: teamAdminQueries.all(teamId) });
    },
    onError: (error) => toast.error(`The set did not change: ${errorMessage(error)}`),
  });
  if (set.isPending) return <LoadingState label="Loading the set…" />;
  if (set.isError) return <ErrorState error={set.error} onRetry={() => void set.refetch()} />;
  const s = set.data;
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        {s.description ? `${s.description} · ` : ''}timing at n ={' '}
        <span className="font-mono">{s.timingSizes.join(', ')}</span> · used by{' '}
        {s.routines.length === 0 ? 'no routine' : s.routines.map((r) => r.title).join(', ')}
      </p>
      <table className="w-full text-sm" data-testid="matrix-set-items">
        <thead className="border-b border-rule text-left text-ink-soft">
          <tr>
            <th className="py-1 pr-4 font-medium">#</th>
            <th className="py-1 pr-4 font-medium">Matrix</th>
            <th className="py-1 pr-4 font-medium">Kind</th>
            <th className="py-1 pr-4 text-right font-medium">Seed</th>
          </tr>
        </thead>
        <tbody>
          {s.items.length === 0 ? (
            <tr>
              <td colSpan={4} className="py-2 text-ink-soft">
                No matrices in this set yet; add a generated one or a file below.
              </td>
            </tr>
          ) : null}
          {s.items.map((item) => (
            <tr key={item.position} className="border-b border-rule/60">
              <td className="py-1 pr-4 font-mono text-ink-soft">{item.position + 1}</td>
              <td className="py-1 pr-4">{item.description}</td>
              <td className="py-1 pr-4">
                {item.kind === 'upload' ? 'uploaded file' : 'generated'}
              </td>
              <td className="py-1 pr-4 text-right font-mono">{item.seed ?? '—'}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div>
        <h3 className="mb-2 text-sm font-semibold">Add a generated matrix</h3>
        <GeneratedItemForm
          idPrefix={`set-${s.id}`}
          submitLabel="Add to the set"
          pending={replace.isPending}
          onAdd={(extra) => replace.mutate({ current: s, extra })}
        />
      </div>
      <div>
        <h3 className="mb-2 text-sm font-semibold">Add an uploaded matrix</h3>
        <MatrixUpload
          teamId={teamId}
          pending={replace.isPending}
          onStored={(upload) =>
            replace.mutate({ current: s, extra: { kind: 'upload', uploadId: upload.id } })
          }
        />
      </div>
    </div>
  );
}

function NewMatrixSet({ teamId, onCreated }: { teamId: number; onCreated: (id: number) => void }) {
  const queryClient = useQueryClient();
  const [open, setOpen] = useState(false);
  const [name, setName] = useState('');
  const [sizes, setSizes] = useState('64, 128');
  const create = useMutation({
    mutationFn: (body: MatrixSetInput) => createMatrixSet(teamId, body),
    onSuccess: async (set) => {
      toast.success(`Matrix set ${set.name} created`);
      setOpen(false);
      setName('');
      await queryClient.invalidateQueries({ queryKey: teamAdminQueries.all(teamId) });
      onCreated(set.id);
    },
    onError: (error) => toast.error(`No set was created: ${errorMessage(error)}`),
  });
  if (!open) {
    return (
      <button type="button" onClick={() => setOpen(true)} className="text-sm underline">
        New matrix set…
      </button>
    );
  }
  const timingSizes = sizes
    .split(/[\s,]+/)
    .filter(Boolean)
    .map(Number);
  return (
    <div className="rounded border border-rule p-3 text-sm">
      <h3 className="mb-2 font-semibold">New matrix set</h3>
      <div className="mb-3 flex flex-wrap gap-3">
        <label>
          <span className="block font-medium">Name</span>
          <input
            value={name}
            onChange={(e) => setName(e.target.value)}
            className="w-64 rounded border border-rule bg-white px-2 py-1"
          />
        </label>
        <label>
          <span className="block font-medium">Timing sizes</span>
          <input
            value={sizes}
            onChange={(e) => setSizes(e.target.value)}
            className="w-40 rounded border border-rule bg-white px-2 py-1 font-mono"
          />
        </label>
      </div>
      <p className="mb-1 text-ink-soft">Its first matrix:</p>
      <GeneratedItemForm
        idPrefix="new-set"
        submitLabel="Create the set"
        pending={create.isPending}
        onAdd={(item) => create.mutate({ name, description: '', timingSizes, items: [item] })}
      />
    </div>
  );
}
