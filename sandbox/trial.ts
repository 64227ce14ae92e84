import { performance } from 'node:perf_hooks';
import { defaultAcceptancePolicy, type AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { RoutineSlug } from '@shared/routines.ts';
import type { MatrixReport, PhaseTimes, TimingReport, TrialReport } from '@shared/trial-report.ts';
import type { KernelInstance } from './isolate/kernel-instance.ts';
import { loadKernel } from './isolate/kernel-runner.ts';
import type { ReferenceMatrix } from './matrices/reference-matrix.ts';
import { machineFingerprint } from './timing/machine.ts';
import { evaluatePolicy } from './policy/evaluate-policy.ts';
import { evaluateCase } from './trial/evaluate-case.ts';
import { prepareCase } from './trial/prepare-case.ts';
import { runTrialTiming } from './trial/trial-timing.ts';
import { couldNotRunVerdict } from './trial/could-not-run-verdict.ts';

export interface TrialProgress {
  phase: 'compile' | 'accuracy' | 'timing' | 'verdict';
  done: number;
  total: number;
  label?: string;
}

export interface TrialInput {
  routine: RoutineSlug;
  candidateSource: string;
  incumbentSource?: string | null;
  /**
   * The candidate's source passed the type check when it was submitted, with the checker this
   * engine uses (server/jobs/trial-inputs.ts): the trial does not check it again. Otherwise
   * the trial checks it, and a type error fails the trial.
   */
  candidateTypeChecked?: boolean;
  /** The same for the incumbent's source. */
  incumbentTypeChecked?: boolean;
  setName: string;
  matrices: ReferenceMatrix[];
  timingSizes: number[];
  policy?: AcceptancePolicy;
  /** Time spent generating the matrices before the trial (reported with the phases). */
  matricesMs?: number;
  /** Skip the timing rounds (accuracy only). */
  timing?: boolean;
  /** Time budget per timing size in ms (both kernels together). */
  timingBudgetMs?: number;
  callTimeoutMs?: number;
  memoryLimitMb?: number;
  seed?: number;
  onProgress?: (progress: TrialProgress) => void;
}

const emptyPhases = (): PhaseTimes => ({
  compileMs: 0,
  matricesMs: 0,
  kernelMs: 0,
  referenceMs: 0,
  metricsMs: 0,
  timingMs: 0,
  totalMs: 0,
});

/**
 * Runs one trial: compile and type-check both kernels, run every applicable matrix in the
 * candidate's and the incumbent's isolates, measure against the reference solver, time the two
 * interleaved, and judge the result by the acceptance policy. Never throws for a kernel's sake:
 * every failure of a kernel ends as a status in the report.
 */
export async function runTrial(input: TrialInput): Promise<TrialReport> {
  const started = performance.now();
  const policy = input.policy ?? defaultAcceptancePolicy;
  const phases = emptyPhases();
  phases.matricesMs = input.matricesMs ?? 0;
  const progress = input.onProgress ?? (() => {});
  const base = {
    routine: input.routine,
    set: input.setName,
    machine: machineFingerprint(),
    startedAt: new Date().toISOString(),
  };
  // KernelLimits calls the heap limit memoryMb: the trial's memoryLimitMb must reach it (it
  // used to be passed under its own name and ignored). Unset, the runner's default applies.
  const limits = {
    callTimeoutMs: input.callTimeoutMs ?? 10_000,
    ...(input.memoryLimitMb !== undefined ? { memoryMb: input.memoryLimitMb } : {}),
  };

  progress({ phase: 'compile', done: 0, total: input.incumbentSource ? 2 : 1 });
  const t0 = performance.now();
  const candidateLoad = await loadKernel({
    source: input.candidateSource,
    routine: input.routine,
    limits,
    typeCheck: input.candidateTypeChecked ? 'skip' : 'block',
  });
  const incumbentLoad = input.incumbentSource
    ? await loadKernel({
        source: input.incumbentSource,
        routine: input.routine,
        limits,
        typeCheck: input.incumbentTypeChecked ? 'skip' : 'block',
      })
    : null;
  phases.compileMs = performance.now() - t0;
  const diagnostics = {
    candidate: candidateLoad.diagnostics,
    incumbent: incumbentLoad?.diagnostics ?? [],
  };
  const kernels: KernelInstance[] = [];
  try {
    if (!candidateLoad.ok) {
      return failedReport(
        base,
        phases,
        started,
        diagnostics,
        `the candidate did not compile: ${candidateLoad.message}`,
      );
    }
    kernels.push(candidateLoad.kernel);
    const incumbent = incumbentLoad?.ok ? incumbentLoad.kernel : null;
    if (incumbent) kernels.push(incumbent);

    const matrices = await runAccuracy(
      input,
      candidateLoad.kernel,
      incumbent,
      policy,
      phases,
      progress,
    );
    if (matrices.length > 0 && !matrices.some((m) => m.candidate.status === 'ok')) {
      const first = matrices[0]!.candidate;
      return {
        ...failedReport(
          base,
          phases,
          started,
          diagnostics,
          `the kernel produced no result on any matrix (first: ${first.status}${first.message ? `: ${first.message}` : ''})`,
        ),
        matrices,
      };
    }

    let timing: TimingReport[] = [];
    if (input.timing !== false && input.timingSizes.length > 0) {
      const t1 = performance.now();
      timing = await runTrialTiming({
        routine: input.routine,
        sizes: input.timingSizes,
        // Each block of the timing loads both kernels afresh from their checked sources.
        candidateSource: input.candidateSource,
        incumbentSource: incumbent && input.incumbentSource ? input.incumbentSource : null,
        limits,
        seed: input.seed ?? 1,
        budgetMs: input.timingBudgetMs,
        margin: policy.timingMargin,
        onProgress: (done, total, n) =>
          progress({ phase: 'timing', done, total, label: `n = ${n}` }),
      });
      phases.timingMs = performance.now() - t1;
    }

    progress({ phase: 'verdict', done: 1, total: 1 });
    phases.totalMs = performance.now() - started;
    const message =
      incumbentLoad && !incumbentLoad.ok
        ? `The incumbent could not be loaded: ${incumbentLoad.message}`
        : undefined;
    return {
      ...base,
      status: 'completed',
      ...(message ? { message } : {}),
      phases,
      diagnostics,
      matrices,
      timing,
      verdict: evaluatePolicy(matrices, timing, policy),
    };
  } finally {
    for (const k of kernels) k.dispose();
  }
}

async function runAccuracy(
  input: TrialInput,
  candidate: KernelInstance,
  incumbent: KernelInstance | null,
  policy: AcceptancePolicy,
  phases: PhaseTimes,
  progress: (p: TrialProgress) => void,
): Promise<MatrixReport[]> {
  const applicable = input.matrices.filter(
    (m) => m.properties.expectations[input.routine] !== undefined,
  );
  const reports: MatrixReport[] = [];
  const candidateTrack = { kernel: candidate, consecutiveTimeouts: 0 };
  const incumbentTrack = incumbent ? { kernel: incumbent, consecutiveTimeouts: 0 } : null;
  for (const [index, matrix] of applicable.entries()) {
    progress({ phase: 'accuracy', done: index, total: applicable.length, label: matrix.id });
    const t0 = performance.now();
    const prepared = prepareCase(matrix, input.routine, (input.seed ?? 1) + index);
    phases.referenceMs += performance.now() - t0;
    if (!prepared) continue;
    reports.push(
      await evaluateCase(prepared, input.routine, candidateTrack, incumbentTrack, policy, phases),
    );
  }
  progress({ phase: 'accuracy', done: applicable.length, total: applicable.length });
  return reports;
}

function failedReport(
  base: Pick<TrialReport, 'routine' | 'set' | 'machine' | 'startedAt'>,
  phases: PhaseTimes,
  started: number,
  diagnostics: TrialReport['diagnostics'],
  message: string,
): TrialReport {
  phases.totalMs = performance.now() - started;
  return {
    ...base,
    status: 'trial-failed',
    message,
    phases,
    diagnostics,
    matrices: [],
    timing: [],
    verdict: couldNotRunVerdict(message),
  };
}
