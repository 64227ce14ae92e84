import { performance } from 'node:perf_hooks';
import type { AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { RoutineSlug } from '@shared/routines.ts';
import type { KernelOutcome, MatrixReport, PhaseTimes } from '@shared/trial-report.ts';
import type { KernelInstance } from '../isolate/kernel-instance.ts';
import { computeMetrics } from '../metrics/routine-metrics.ts';
import { judgeMatrix } from '../policy/judge-matrix.ts';
import type { PreparedCase } from './prepare-case.ts';

/**
 * After this many timeouts in a row a kernel is not called again in the trial: its remaining
 * matrices are recorded as timeouts, so a hung kernel cannot hold a worker for many minutes.
 */
export const MAX_CONSECUTIVE_TIMEOUTS = 3;

/** Per-kernel state across the matrices of one trial. */
export interface KernelTrack {
  kernel: KernelInstance;
  consecutiveTimeouts: number;
}

/** Runs one kernel on a fresh copy of the case's matrix and measures what it returned. */
async function runKernel(
  track: KernelTrack,
  prepared: PreparedCase,
  routine: RoutineSlug,
  phases: PhaseTimes,
): Promise<KernelOutcome> {
  if (track.consecutiveTimeouts >= MAX_CONSECUTIVE_TIMEOUTS) {
    return {
      status: 'timeout',
      message: `not run: the kernel timed out on ${MAX_CONSECUTIVE_TIMEOUTS} matrices in a row`,
      metrics: {},
      ms: 0,
    };
  }
  const { kernel } = track;
  const t0 = performance.now();
  const call = await kernel.call({
    a: Float64Array.from(prepared.a),
    m: prepared.m,
    n: prepared.n,
    ...(prepared.b ? { b: Float64Array.from(prepared.b) } : {}),
  });
  phases.kernelMs += performance.now() - t0;
  track.consecutiveTimeouts = call.status === 'timeout' ? track.consecutiveTimeouts + 1 : 0;
  const outcome: KernelOutcome = {
    status: call.status,
    ...(call.message ? { message: call.message } : {}),
    metrics: {},
    ms: call.ms,
  };
  if (call.status !== 'ok' || !call.result) return outcome;
  const t1 = performance.now();
  outcome.metrics = computeMetrics({
    routine,
    a: prepared.a,
    m: prepared.m,
    n: prepared.n,
    result: call.result,
    ...(prepared.b ? { b: prepared.b } : {}),
    ...(prepared.xRef ? { xRef: prepared.xRef } : {}),
    referenceTrusted: prepared.referenceTrusted,
    ...(prepared.conditionInf !== null ? { condition: prepared.conditionInf } : {}),
  });
  phases.metricsMs += performance.now() - t1;
  return outcome;
}

/** The candidate and the incumbent on one prepared matrix, judged by the policy. */
export async function evaluateCase(
  prepared: PreparedCase,
  routine: RoutineSlug,
  candidate: KernelTrack,
  incumbent: KernelTrack | null,
  policy: AcceptancePolicy,
  phases: PhaseTimes,
): Promise<MatrixReport> {
  const candidateOutcome = await runKernel(candidate, prepared, routine, phases);
  const incumbentOutcome = incumbent ? await runKernel(incumbent, prepared, routine, phases) : null;
  const { passed, failures } = judgeMatrix(
    routine,
    prepared.expected,
    candidateOutcome,
    policy,
    prepared.referenceGrowth,
  );
  const { matrix } = prepared;
  return {
    id: matrix.id,
    family: matrix.family,
    m: prepared.m,
    n: prepared.n,
    condition: prepared.condition,
    conditionKind: prepared.conditionKind,
    referenceGrowth: prepared.referenceGrowth,
    expected: prepared.expected,
    referenceTrusted: prepared.referenceTrusted,
    note: matrix.properties.note,
    candidate: candidateOutcome,
    incumbent: incumbentOutcome,
    passed,
    failures,
  };
}
