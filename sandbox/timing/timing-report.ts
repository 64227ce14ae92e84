import type { TimingReport } from '@shared/trial-report.ts';
import type { KernelTiming, SizeTiming } from '@sandbox/timing/interleaved.ts';
import type { TimingFailure } from '@sandbox/timing/timed-kernel.ts';

/**
 * The shared report shape of one timed size (shared/trial-report.ts) from the engine's SizeTiming:
 * median times as plain numbers beside the detailed summaries, and a failed call as a message.
 */

function detail(side: KernelTiming | null): TimingReport['candidateDetail'] {
  if (side === null) return null;
  return { medianMs: side.medianMs, q1Ms: side.q1Ms, q3Ms: side.q3Ms, gflops: side.gflops };
}

function failureMessage(failure: TimingFailure): string {
  const where = failure.block === undefined ? '' : ` in block ${failure.block + 1}`;
  return `the ${failure.kernel} failed during ${failure.phase}${where} (${failure.status}): ${failure.message}`;
}

/** Map one size's timing to the shared TimingReport. Cost O(1). */
export function toTimingReport(size: SizeTiming): TimingReport {
  const { failure } = size;
  return {
    n: size.n,
    rounds: size.rounds,
    candidate: size.candidate?.medianMs ?? null,
    incumbent: size.incumbent?.medianMs ?? null,
    candidateDetail: detail(size.candidate),
    incumbentDetail: detail(size.incumbent),
    ratio: size.ratio,
    ci95: size.ci95,
    pValue: size.pValue,
    verdict: size.verdict,
    flags: [...size.flags],
    blocks: size.blocks,
    roundsPerBlock: [...size.roundsPerBlock],
    blockRatios: [...size.blockRatios],
    betweenBlockSpread: size.betweenBlockSpread,
    roundSpread: size.roundSpread,
    callMs: size.callMs,
    ...(failure === null ? {} : { message: failureMessage(failure) }),
  };
}
