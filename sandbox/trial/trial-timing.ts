import type { RoutineSlug } from '@shared/routines.ts';
import type { TimingReport } from '@shared/trial-report.ts';
import { routineSignatures } from '../contracts/routine-signatures.ts';
import { compileKernel } from '../isolate/compile.ts';
import { createKernelInstance } from '../isolate/kernel-instance.ts';
import { startKernelSession } from '../isolate/kernel-isolate.ts';
import { resolveLimits, type KernelLimits } from '../isolate/limits.ts';
import { timingMatrix } from '../matrices/timing-input.ts';
import { runInterleavedTiming, type FreshKernels } from '../timing/interleaved.ts';
import { toTimingReport } from '../timing/timing-report.ts';

export interface TrialTimingInput {
  routine: RoutineSlug;
  sizes: number[];
  /** The kernels' TypeScript sources; each block loads them afresh (type check skipped). */
  candidateSource: string;
  incumbentSource: string | null;
  limits?: Partial<KernelLimits> | undefined;
  seed: number;
  /** Time for the timed rounds of each size, all blocks together, in ms. */
  budgetMs?: number | undefined;
  /** Blocks of fresh isolates (default DEFAULT_BLOCKS, sandbox/timing/rounds.ts). */
  blocks?: number | undefined;
  /** Most timed rounds per block and size (default MAX_BLOCK_ROUNDS, sandbox/timing/rounds.ts). */
  maxRoundsPerBlock?: number | undefined;
  margin: number;
  /** Called as each block starts and finishes a size: done of total (blocks × sizes) steps, at size n. */
  onProgress?: (done: number, total: number, n: number) => void;
}

interface KernelArgs {
  a: Float64Array;
  m: number;
  n: number;
  b?: Float64Array;
}

/**
 * Fresh isolates of one kernel: esbuild once, then per block a new isolate running the compiled
 * module (about 4 ms on a quiet machine, stack.md), with the trial's limits. The type check is
 * not repeated: the trial has checked the source already.
 */
function freshKernels(
  routine: RoutineSlug,
  source: string,
  limits: KernelLimits,
): FreshKernels<KernelArgs> {
  let compiled: Promise<Awaited<ReturnType<typeof compileKernel>>> | null = null;
  return {
    async fresh() {
      compiled ??= compileKernel(source, limits);
      const js = await compiled;
      if (!js.ok) {
        return { ok: false, status: 'threw', message: 'The kernel no longer compiles.' };
      }
      const started = await startKernelSession(
        js.js,
        routineSignatures[routine].exportName,
        limits,
      );
      if (!started.ok) {
        return {
          ok: false,
          status: started.status,
          message: `In a fresh isolate: ${started.message}`,
        };
      }
      const kernel = createKernelInstance(routine, js.js, limits, started.session);
      return {
        ok: true,
        kernel: { time: (args) => kernel.time(args), dispose: () => kernel.dispose() },
      };
    },
  };
}

/**
 * Times candidate and incumbent interleaved on the routine's timing input at each size, in
 * blocks of fresh isolates (sandbox/timing/interleaved.ts); each call gets a fresh copy of the
 * same matrix (and right-hand side for back substitution).
 */
export async function runTrialTiming(input: TrialTimingInput): Promise<TimingReport[]> {
  const limits = resolveLimits(input.limits);
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
    candidate: freshKernels(input.routine, input.candidateSource, limits),
    incumbent:
      input.incumbentSource === null
        ? null
        : freshKernels(input.routine, input.incumbentSource, limits),
    makeInput,
    ...(input.budgetMs !== undefined ? { budgetMs: input.budgetMs } : {}),
    ...(input.blocks !== undefined ? { blocks: input.blocks } : {}),
    ...(input.maxRoundsPerBlock !== undefined ? { maxRounds: input.maxRoundsPerBlock } : {}),
    margin: input.margin,
    onProgress: (p) => {
      if (p.phase === 'timing') return;
      const step = p.block * p.sizeCount + p.sizeIndex + (p.phase === 'done' ? 1 : 0);
      input.onProgress?.(step, p.blockCount * p.sizeCount, p.n);
    },
  });
  return sizes.map(toTimingReport);
}
