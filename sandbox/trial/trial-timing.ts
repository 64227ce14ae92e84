import type { RoutineSlug } from '@shared/routines.ts';
import type { TimingReport } from '@shared/trial-report.ts';
import type { KernelInstance } from '../isolate/kernel-instance.ts';
import { timingMatrix } from '../matrices/timing-input.ts';
import { runInterleavedTiming, type TimedKernel } from '../timing/interleaved.ts';
import { toTimingReport } from '../timing/timing-report.ts';

export interface TrialTimingInput {
  routine: RoutineSlug;
  sizes: number[];
  candidate: KernelInstance;
  incumbent: KernelInstance | null;
  seed: number;
  budgetMs?: number | undefined;
  margin: number;
  onProgress?: (done: number, total: number, n: number) => void;
}

interface KernelArgs {
  a: Float64Array;
  m: number;
  n: number;
  b?: Float64Array;
}

const timed = (kernel: KernelInstance): TimedKernel<KernelArgs> => ({
  time: (args) => kernel.time(args),
});

/**
 * Times candidate and incumbent interleaved on the routine's timing input at each size; each
 * call gets a fresh copy of the same matrix (and right-hand side for back substitution).
 */
export async function runTrialTiming(input: TrialTimingInput): Promise<TimingReport[]> {
  const inputs = new Map<number, { a: Float64Array; m: number; b?: Float64Array }>();
  const makeInput = (n: number): KernelArgs => {
    let base = inputs.get(n);
    if (!base) {
      const matrix = timingMatrix(input.routine, n, input.seed);
      base = { a: matrix.data, m: matrix.m };
      if (input.routine === 'back-substitution') base.b = new Float64Array(n).fill(1);
      inputs.set(n, base);
    }
    return {
      a: Float64Array.from(base.a),
      m: base.m,
      n,
      ...(base.b ? { b: Float64Array.from(base.b) } : {}),
    };
  };
  const sizes = await runInterleavedTiming({
    routine: input.routine,
    sizes: input.sizes,
    candidate: timed(input.candidate),
    incumbent: input.incumbent ? timed(input.incumbent) : null,
    makeInput,
    ...(input.budgetMs !== undefined ? { budgetMs: input.budgetMs } : {}),
    margin: input.margin,
    onProgress: (p) => {
      if (p.phase !== 'timing' || p.round === 0) {
        input.onProgress?.(p.phase === 'done' ? p.sizeIndex + 1 : p.sizeIndex, p.sizeCount, p.n);
      }
    },
  });
  return sizes.map(toTimingReport);
}
