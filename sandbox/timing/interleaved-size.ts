import { chooseRounds } from '@sandbox/timing/rounds.ts';
import type { KernelRole, TimedKernel, TimingFailure } from '@sandbox/timing/timed-kernel.ts';

/**
 * Timing of one size in one block: warm-up calls (discarded), then R interleaved rounds, each call
 * on a fresh input from makeInput(n) (numerics.md, "Timing"; numerics-references §8.4: interleave
 * so that drift hits both kernels alike, warm up and discard first calls).
 */

export interface SizeTimingPlan<TInput> {
  n: number;
  candidate: TimedKernel<TInput>;
  incumbent: TimedKernel<TInput> | null;
  makeInput: (n: number) => TInput;
  /** Time for this size's timed rounds in this block, in ms. */
  budgetMs: number;
  /** Warm-up calls per kernel, from the time of the first (slower) call of the two. */
  warmup: (firstCallMs: number) => number;
  /** Added to the round number before choosing the call order (the block's index). */
  orderOffset: number;
  minRounds: number | undefined;
  maxRounds: number | undefined;
  onRound: (round: number, rounds: number) => void;
}

export interface RawSizeTiming {
  /** Warm-up times per kernel, in call order (the first includes compilation). */
  warmMs: Record<KernelRole, number[]>;
  /** Times of the completed rounds; round r's pair is roundMs.candidate[r], roundMs.incumbent[r]. */
  roundMs: Record<KernelRole, number[]>;
  plannedRounds: number;
  failure: TimingFailure | null;
}

/**
 * The call order of round (or warm-up call) r, 0-based: candidate first when r is even,
 * incumbent first when r is odd, so that neither kernel always runs right after the other.
 */
export function roundOrder(r: number, withIncumbent: boolean): KernelRole[] {
  if (!withIncumbent) return ['candidate'];
  return r % 2 === 0 ? ['candidate', 'incumbent'] : ['incumbent', 'candidate'];
}

/** Run warm-up and rounds for one size; stops at the first failed call. */
export async function timeOneSize<TInput>(plan: SizeTimingPlan<TInput>): Promise<RawSizeTiming> {
  const { n, makeInput, incumbent } = plan;
  const kernels: Record<KernelRole, TimedKernel<TInput> | null> = {
    candidate: plan.candidate,
    incumbent,
  };
  const raw: RawSizeTiming = {
    warmMs: { candidate: [], incumbent: [] },
    roundMs: { candidate: [], incumbent: [] },
    plannedRounds: 0,
    failure: null,
  };
  // One pass of calls in the order of r; returns the times, or null after recording a failure.
  const pass = async (r: number, phase: TimingFailure['phase']) => {
    const times: Partial<Record<KernelRole, number>> = {};
    for (const role of roundOrder(r, incumbent !== null)) {
      const call = await kernels[role]!.time(makeInput(n));
      if (!call.ok) {
        raw.failure = { kernel: role, phase, status: call.status, message: call.message };
        return null;
      }
      if (!(call.ms > 0 && Number.isFinite(call.ms))) {
        throw new RangeError(
          `${role}.time returned ms = ${call.ms}; it must be positive and finite`,
        );
      }
      times[role] = call.ms;
    }
    return times;
  };
  let warmup: number | undefined;
  for (let w = 0; w < (warmup ?? 1); w++) {
    const times = await pass(plan.orderOffset + w, 'warm-up');
    if (times === null) return raw;
    for (const [role, ms] of Object.entries(times)) raw.warmMs[role as KernelRole].push(ms);
    warmup ??= plan.warmup(Math.max(...Object.values(times)));
  }
  // One round costs about the sum of each kernel's fastest warm-up call: the minimum is the
  // robust location under positive timing noise (Chen & Revels, arXiv:1608.04295, 2016), so a
  // warm-up call that a busy machine delayed does not cut the rounds (one round per block leaves
  // the block's estimate at the mercy of a single delayed call).
  const fastest = (ms: number[]) => (ms.length === 0 ? 0 : Math.min(...ms));
  const roundMs = fastest(raw.warmMs.candidate) + fastest(raw.warmMs.incumbent);
  raw.plannedRounds = chooseRounds({
    budgetMs: plan.budgetMs,
    roundMs,
    ...(plan.minRounds === undefined ? {} : { minRounds: plan.minRounds }),
    ...(plan.maxRounds === undefined ? {} : { maxRounds: plan.maxRounds }),
  });
  for (let r = 0; r < raw.plannedRounds; r++) {
    const times = await pass(plan.orderOffset + r, 'timing');
    if (times === null) return raw;
    for (const [role, ms] of Object.entries(times)) raw.roundMs[role as KernelRole].push(ms);
    plan.onRound(r + 1, raw.plannedRounds);
  }
  return raw;
}
