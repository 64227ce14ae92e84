import type { CallStatus, RoutineSlug } from '@shared/routines.ts';
import type { FamilySlug } from '@sandbox/matrices/reference-matrix.ts';
import type { MetricName } from '@sandbox/metrics/metric-names.ts';

/** What the engine must conclude about an example kernel after a trial. */
export type ExampleExpectation =
  /** Every check of its routine passes. */
  | { verdict: 'sound' }
  /** `metric` fails its threshold on matrices of `family`. */
  | { verdict: 'inaccurate'; metric: MetricName; family: FamilySlug }
  /** It returns numbers for a matrix of `family` that it must reject by throwing. */
  | { verdict: 'misses-rejection'; family: FamilySlug }
  /** Correct, but slower than the example `than` by at least `factor` at order `n`. */
  | { verdict: 'slower'; than: string; n: number; factor: number }
  /** Every call ends with `status`; the message contains `messageIncludes` when given. */
  | { verdict: 'call-fails'; status: Exclude<CallStatus, 'ok'>; messageIncludes?: string };

export interface ExampleKernel {
  routine: RoutineSlug;
  /** The source file, relative to `sandbox/kernels/` (read it with read-kernel-source.ts). */
  file: string;
  /** One line for a reader of the demo: what the kernel does, and its planted flaw if any. */
  summary: string;
  expected: ExampleExpectation;
}

/**
 * Example kernels for tests and the demo: a sound kernel per routine, and kernels with one
 * planted flaw each, from wrong numbers to hostile behaviour.
 */
export const exampleKernels = {
  'lu-partial-pivoting-right-looking': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-partial-pivoting-right-looking.ts',
    summary: 'Right-looking GEPP with contiguous row updates.',
    expected: { verdict: 'sound' },
  },
  'lu-no-pivoting-right-looking': {
    routine: 'lu-no-pivoting',
    file: 'examples/lu-no-pivoting-right-looking.ts',
    summary: 'Right-looking LU without pivoting, contiguous row updates.',
    expected: { verdict: 'sound' },
  },
  'cholesky-row-oriented': {
    routine: 'cholesky',
    file: 'examples/cholesky-row-oriented.ts',
    summary: 'In-place row-oriented Cholesky that throws on a non-positive pivot.',
    expected: { verdict: 'sound' },
  },
  'ldlt-row-oriented': {
    routine: 'ldlt',
    file: 'examples/ldlt-row-oriented.ts',
    summary: 'In-place row-oriented LDLᵀ without pivoting that throws on a zero pivot.',
    expected: { verdict: 'sound' },
  },
  'householder-qr-row-oriented': {
    routine: 'householder-qr',
    file: 'examples/householder-qr-row-oriented.ts',
    summary: 'Householder QR with reflectors applied along rows; Q formed backwards.',
    expected: { verdict: 'sound' },
  },
  'back-substitution-row-oriented': {
    routine: 'back-substitution',
    file: 'examples/back-substitution-row-oriented.ts',
    summary: 'Row-oriented back substitution that throws on a zero diagonal entry.',
    expected: { verdict: 'sound' },
  },
  'lu-no-pivoting-offered-as-pivoting': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-no-pivoting-offered-as-pivoting.ts',
    summary: 'LU without pivoting (identity perm) offered for the partial-pivoting routine.',
    expected: { verdict: 'inaccurate', metric: 'factorRatio', family: 'needs-row-exchange' },
  },
  'lu-single-precision-updates': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-single-precision-updates.ts',
    summary: 'GEPP whose multipliers and updates are rounded to binary32 with Math.fround.',
    expected: { verdict: 'inaccurate', metric: 'factorRatio', family: 'uniform' },
  },
  'lu-pivots-identity-perm': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-pivots-identity-perm.ts',
    summary: 'GEPP that exchanges rows but returns the identity permutation.',
    expected: { verdict: 'inaccurate', metric: 'factorRatio', family: 'uniform' },
  },
  'lu-column-stride': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-column-stride.ts',
    summary:
      'Correct GEPP whose update walks down columns (stride n): several times slower at n = 512.',
    // Measured through the runner on the 2-core machine (medians of interleaved runs): about
    // 9× at n = 512 and 2.6–2.9× at n = 256, but only 1.4–1.6× at n = 192, 320 and 384.
    expected: { verdict: 'slower', than: 'lu-partial-pivoting-right-looking', n: 512, factor: 2 },
  },
  'cholesky-no-definiteness-check': {
    routine: 'cholesky',
    file: 'examples/cholesky-no-definiteness-check.ts',
    summary: 'Cholesky taking √|pivot|, so an indefinite matrix is never reported.',
    expected: { verdict: 'misses-rejection', family: 'indefinite' },
  },
  'lu-endless-loop': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-endless-loop.ts',
    summary: 'GEPP whose pivot search counts down: never ends for n ≥ 2.',
    expected: { verdict: 'call-fails', status: 'timeout' },
  },
  'lu-memory-hog': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-memory-hog.ts',
    summary: 'GEPP that preallocates about 179 MB of scratch matrices on its first call.',
    expected: { verdict: 'call-fails', status: 'out-of-memory' },
  },
  'lu-host-probe': {
    routine: 'lu-partial-pivoting',
    file: 'examples/lu-host-probe.ts',
    summary: 'Looks for process, require, import() and host globals, then throws what it found.',
    expected: {
      verdict: 'call-fails',
      status: 'threw',
      messageIncludes: 'host probe found nothing',
    },
  },
} satisfies Record<string, ExampleKernel>;

export type ExampleName = keyof typeof exampleKernels;
