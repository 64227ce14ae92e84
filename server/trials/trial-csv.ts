import type { KernelOutcome, MatrixReport } from '@shared/trial-report.ts';

/** Metric columns, in the order numerics.md lists them. */
const metricColumns = [
  'factorRatio',
  'componentwiseBoundRatio',
  'growthFactor',
  'orthogonalityRatio',
  'solveResidualRatio',
  'normwiseBackwardError',
  'componentwiseBackwardError',
  'forwardError',
  'forwardErrorOverBound',
] as const;

type Cell = string | number | boolean | null | undefined;

/**
 * One CSV field (RFC 4180): quoted when it holds a comma, quote or line break. Text that a
 * spreadsheet would run as a formula (a leading =, +, -, @, tab or carriage return; matrix ids
 * come from uploaded file names) gets a leading apostrophe; numbers are written as they are,
 * non-finite ones as Infinity, -Infinity and NaN.
 */
function field(value: Cell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number' || typeof value === 'boolean') return String(value);
  const text = /^[=+\-@\t\r]/.test(value) ? `'${value}` : value;
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

function side(prefix: string, outcome: KernelOutcome | null): Record<string, Cell> {
  const cells: Record<string, Cell> = {
    [`${prefix}_status`]: outcome?.status,
    [`${prefix}_ms`]: outcome?.ms,
  };
  for (const metric of metricColumns) cells[`${prefix}_${metric}`] = outcome?.metrics[metric];
  return cells;
}

function record(m: MatrixReport): Record<string, Cell> {
  return {
    matrix: m.id,
    family: m.family,
    m: m.m,
    n: m.n,
    condition: m.condition,
    condition_kind: m.conditionKind,
    expected: m.expected,
    reference_trusted: m.referenceTrusted,
    passed: m.passed,
    ...side('candidate', m.candidate),
    ...side('incumbent', m.incumbent),
    failures: m.failures.join('; '),
    note: m.note,
  };
}

/** The per-matrix table of a trial, one line per matrix, candidate columns next to incumbent. */
export function trialCsv(matrices: readonly MatrixReport[]): string {
  const header = Object.keys(record(emptyReport));
  const lines = [header.join(',')];
  for (const m of matrices) {
    const cells = record(m);
    lines.push(header.map((h) => field(cells[h])).join(','));
  }
  return `${lines.join('\r\n')}\r\n`;
}

/** Only its keys are used: the header comes from the same function as the rows. */
const emptyReport: MatrixReport = {
  id: '',
  family: '',
  m: 0,
  n: 0,
  condition: null,
  conditionKind: null,
  expected: 'factor',
  referenceGrowth: null,
  referenceTrusted: false,
  note: '',
  candidate: { status: 'ok', metrics: {}, ms: 0 },
  incumbent: null,
  passed: false,
  failures: [],
};
