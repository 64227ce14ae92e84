import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnFiltersState,
  type SortingState,
} from '@tanstack/react-table';
import { useId, useMemo, useState } from 'react';
import { DecadesBar } from '@client/components/decades-bar.tsx';
import { formatError, formatRatio } from '@client/components/number-format.ts';
import { SignalBadge } from '@client/components/signal-badge.tsx';
import type { MatrixReport } from '@shared/trial-report.ts';
import { headlineRatio } from './accuracy-metric.ts';

const column = createColumnHelper<MatrixReport>();

/** Sorts numbers with NaN and missing values last whichever way. */
const numeric =
  (get: (m: MatrixReport) => number | null | undefined) =>
  (a: { original: MatrixReport }, b: { original: MatrixReport }) => {
    const x = get(a.original);
    const y = get(b.original);
    const bad = (v: number | null | undefined) => v === null || v === undefined || Number.isNaN(v);
    if (bad(x) && bad(y)) return 0;
    if (bad(x)) return 1;
    if (bad(y)) return -1;
    return x! < y! ? -1 : x! > y! ? 1 : 0;
  };

function Pair({
  candidate,
  incumbent,
}: {
  candidate: number | undefined;
  incumbent: number | undefined;
}) {
  return (
    <span className="block text-right font-mono text-xs leading-5 whitespace-nowrap">
      <span className="block" title="candidate">
        {formatError(candidate)}
      </span>
      <span className="block text-ink-soft" title="incumbent">
        {formatError(incumbent)}
      </span>
    </span>
  );
}

/**
 * Per-matrix results, candidate next to incumbent: sortable by any column, filterable by
 * family and by pass / fail. The decades bars put each error ratio on a log scale.
 */
export function MatrixTable({
  matrices,
  threshold,
}: {
  matrices: readonly MatrixReport[];
  /** The policy's factor-ratio threshold (before growth scaling), drawn on the bars. */
  threshold?: number;
}) {
  const [sorting, setSorting] = useState<SortingState>([]);
  const [filters, setFilters] = useState<ColumnFiltersState>([]);
  const familyId = useId();
  const resultId = useId();
  const families = useMemo(() => [...new Set(matrices.map((m) => m.family))].sort(), [matrices]);

  const columns = useMemo(
    () => [
      column.accessor('id', {
        header: 'Matrix',
        cell: (c) => (
          <span className="font-mono text-xs">
            {c.getValue()}
            <span className="block text-ink-soft">
              {c.row.original.m}×{c.row.original.n} · {c.row.original.expected}
            </span>
          </span>
        ),
      }),
      column.accessor('family', {
        header: 'Family',
        filterFn: 'equalsString',
        cell: (c) => <span className="text-xs">{c.getValue()}</span>,
      }),
      column.accessor((m) => m.condition, {
        id: 'condition',
        header: 'κ₁',
        sortingFn: numeric((m) => m.condition),
        cell: (c) => (
          <span className="block text-right font-mono text-xs">
            {formatError(c.getValue())}
            {c.row.original.conditionKind === 'estimate' ? (
              <span className="block text-ink-soft">estimate</span>
            ) : null}
          </span>
        ),
      }),
      column.accessor((m) => headlineRatio(m.candidate), {
        id: 'factorRatio',
        header: 'Factor ratio (cand. / inc.)',
        sortingFn: numeric((m) => headlineRatio(m.candidate)),
        cell: (c) => {
          const m = c.row.original;
          const cand = headlineRatio(m.candidate);
          const inc = headlineRatio(m.incumbent);
          return (
            <span className="flex items-center justify-end gap-2">
              <span className="text-right font-mono text-xs leading-5 whitespace-nowrap">
                <span className="block">{formatRatio(cand)}</span>
                <span className="block text-ink-soft">{formatRatio(inc)}</span>
              </span>
              <DecadesBar
                label={`factor ratio of ${m.id}`}
                marks={[
                  { value: cand, who: 'candidate' },
                  { value: inc, who: 'incumbent' },
                ]}
                bound={threshold}
                decades={[-3, 3]}
              />
            </span>
          );
        },
      }),
      column.accessor((m) => m.candidate.metrics.forwardErrorOverBound, {
        id: 'forwardErrorOverBound',
        header: 'Forward error ÷ κ·u',
        sortingFn: numeric((m) => m.candidate.metrics.forwardErrorOverBound),
        cell: (c) => {
          const m = c.row.original;
          const cand = m.candidate.metrics.forwardErrorOverBound;
          const inc = m.incumbent?.metrics.forwardErrorOverBound;
          if (cand === undefined && inc === undefined) {
            return (
              <span className="block text-right text-xs text-ink-soft">
                {m.referenceTrusted ? '—' : 'reference not trusted'}
              </span>
            );
          }
          return (
            <span className="flex items-center justify-end gap-2">
              <span className="text-right font-mono text-xs leading-5 whitespace-nowrap">
                <span className="block">{formatRatio(cand)}</span>
                <span className="block text-ink-soft">{formatRatio(inc)}</span>
              </span>
              <DecadesBar
                label={`forward error over κ·u of ${m.id}`}
                marks={[
                  { value: cand, who: 'candidate' },
                  { value: inc, who: 'incumbent' },
                ]}
                decades={[-4, 2]}
              />
            </span>
          );
        },
      }),
      column.accessor((m) => m.candidate.metrics.normwiseBackwardError, {
        id: 'backwardError',
        header: 'Backward error',
        sortingFn: numeric((m) => m.candidate.metrics.normwiseBackwardError),
        cell: (c) => (
          <Pair
            candidate={c.row.original.candidate.metrics.normwiseBackwardError}
            incumbent={c.row.original.incumbent?.metrics.normwiseBackwardError}
          />
        ),
      }),
      column.accessor((m) => m.candidate.metrics.growthFactor, {
        id: 'growth',
        header: 'Growth',
        sortingFn: numeric((m) => m.candidate.metrics.growthFactor),
        cell: (c) => (
          <span className="block text-right font-mono text-xs leading-5 whitespace-nowrap">
            <span className="block">{formatRatio(c.getValue())}</span>
            <span className="block text-ink-soft">
              {formatRatio(c.row.original.incumbent?.metrics.growthFactor)}
            </span>
          </span>
        ),
      }),
      column.accessor((m) => (m.passed ? 'passed' : 'failed'), {
        id: 'result',
        header: 'Result',
        filterFn: 'equalsString',
        cell: (c) => {
          const m = c.row.original;
          return (
            <span className="flex flex-col items-start gap-1">
              <SignalBadge signal={m.passed ? 'within' : 'beyond'}>
                {m.passed ? 'passed' : 'failed'}
              </SignalBadge>
              {m.candidate.status !== 'ok' ? (
                <span className="font-mono text-xs text-ink-soft">{m.candidate.status}</span>
              ) : null}
            </span>
          );
        },
      }),
    ],
    [threshold],
  );

  const table = useReactTable({
    data: matrices as MatrixReport[],
    columns,
    state: { sorting, columnFilters: filters },
    onSortingChange: setSorting,
    onColumnFiltersChange: setFilters,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  const setFilter = (id: string, value: string) =>
    table.getColumn(id)?.setFilterValue(value === '' ? undefined : value);
  const rows = table.getRowModel().rows;

  return (
    <div>
      <div className="mb-3 flex flex-wrap items-end gap-4 text-sm">
        <div>
          <label htmlFor={familyId} className="block text-ink-soft">
            Family
          </label>
          <select
            id={familyId}
            data-testid="filter-family"
            className="rounded border border-rule bg-paper px-2 py-1"
            value={(table.getColumn('family')?.getFilterValue() as string | undefined) ?? ''}
            onChange={(e) => setFilter('family', e.target.value)}
          >
            <option value="">all families</option>
            {families.map((f) => (
              <option key={f} value={f}>
                {f}
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor={resultId} className="block text-ink-soft">
            Result
          </label>
          <select
            id={resultId}
            data-testid="filter-result"
            className="rounded border border-rule bg-paper px-2 py-1"
            value={(table.getColumn('result')?.getFilterValue() as string | undefined) ?? ''}
            onChange={(e) => setFilter('result', e.target.value)}
          >
            <option value="">passed and failed</option>
            <option value="passed">passed only</option>
            <option value="failed">failed only</option>
          </select>
        </div>
        <p className="text-ink-soft" aria-live="polite" data-testid="matrix-count">
          {rows.length} of {matrices.length} matrices
        </p>
        <p className="ml-auto flex items-center gap-3 text-xs text-ink-soft">
          <span>
            <span aria-hidden="true">●</span> candidate
          </span>
          <span>
            <span aria-hidden="true">○</span> incumbent (second line)
          </span>
          {threshold ? (
            <span>
              <span aria-hidden="true" className="text-beyond">
                |
              </span>{' '}
              policy threshold {threshold}
            </span>
          ) : null}
        </p>
      </div>
      <div className="overflow-x-auto">
        <table className="w-full border-collapse text-left text-sm" data-testid="matrix-table">
          <caption className="sr-only">
            Results per matrix; each cell shows the candidate above the incumbent
          </caption>
          <thead className="border-b border-ink/30">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={
                        sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : 'none'
                      }
                      className="px-2 py-2 align-bottom font-medium text-ink-soft"
                    >
                      <button
                        type="button"
                        onClick={header.column.getToggleSortingHandler()}
                        className="inline-flex items-center gap-1 text-left hover:text-ink"
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true" className="font-mono">
                          {sorted === 'asc' ? '↑' : sorted === 'desc' ? '↓' : '↕'}
                        </span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {rows.map((row) => (
              <tr
                key={row.id}
                data-matrix={row.original.id}
                className={`border-b border-rule align-middle ${row.original.passed ? '' : 'bg-beyond/5'}`}
              >
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-2 py-1.5">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {rows.length === 0 ? (
          <p className="py-4 text-center text-sm text-ink-soft">No matrix matches these filters.</p>
        ) : null}
      </div>
    </div>
  );
}
