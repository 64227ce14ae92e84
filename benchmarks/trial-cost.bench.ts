import { materializeSet } from '@sandbox/trial/materialize-set.ts';
import { namedSet, type MatrixSet } from '@sandbox/matrices/sets.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { runTrial } from '@sandbox/trial.ts';
import type { TrialReport } from '@shared/trial-report.ts';
import { goal, type Benchmark, type BenchmarkCheck } from './benchmark.ts';
import { fitExponent, fmt } from './measure.ts';

/**
 * What a trial costs and where the time goes: the `standard` set for LU with partial pivoting,
 * candidate and incumbent, through runTrial as the worker calls it (database writes excluded:
 * see README). Then accuracy-only trials on single uniform matrices of growing n, to fit the
 * exponent of the cost over n.
 */

const ROUTINE = 'lu-partial-pivoting';
const CANDIDATE = 'examples/lu-partial-pivoting-right-looking.ts';
const INCUMBENT = 'starters/lu-partial-pivoting.ts';

/** Time inside the timed rounds only: rounds × the two medians. */
function roundMsInTiming(report: TrialReport): number {
  return report.timing.reduce(
    (sum, t) =>
      sum + t.rounds * ((t.candidateDetail?.medianMs ?? 0) + (t.incumbentDetail?.medianMs ?? 0)),
    0,
  );
}

/**
 * Time inside every kernel call of the timing phase, warm-up included, as the engine measured
 * each call (TimingReport.callMs); a report without it falls back to the timed rounds.
 */
function kernelMsInTiming(report: TrialReport): number {
  return report.timing.reduce((sum, t) => sum + (t.callMs ?? 0), 0) || roundMsInTiming(report);
}

async function trial(
  set: MatrixSet,
  timing: boolean,
): Promise<{ report: TrialReport; wallMs: number }> {
  const t0 = performance.now();
  const matrices = materializeSet(set, () => '');
  const matricesMs = performance.now() - t0;
  const report = await runTrial({
    routine: ROUTINE,
    candidateSource: readKernelSource(CANDIDATE),
    incumbentSource: readKernelSource(INCUMBENT),
    setName: set.name,
    matrices,
    timingSizes: set.timingSizes,
    matricesMs,
    timing,
  });
  return { report, wallMs: performance.now() - t0 };
}

export const trialCostBenchmark: Benchmark = {
  name: 'trial-cost',
  description:
    'Wall time of a standard-set LU trial with candidate and incumbent, its phases, the harness share, and the growth of the cost with n.',
  async run({ smoke, log }) {
    const checks: BenchmarkCheck[] = [];
    const set: MatrixSet = smoke
      ? { ...namedSet('quick'), timingSizes: [16] }
      : namedSet('standard');
    const { report, wallMs } = await trial(set, true);
    checks.push({
      name: `${set.name} trial completed`,
      passed: report.status === 'completed' && report.matrices.length > 0,
      detail: `${report.status}, ${report.matrices.length} matrices, ${report.timing.length} timing sizes`,
    });
    const p = report.phases;
    const kernelMs = p.kernelMs + kernelMsInTiming(report);
    const harnessShare = 1 - kernelMs / wallMs;
    // Counting only the timed rounds as kernel time (warm-up calls as harness): an upper bound.
    const harnessShareRoundsOnly = 1 - (p.kernelMs + roundMsInTiming(report)) / wallMs;
    const shares = {
      matrices: p.matricesMs / wallMs,
      compileTypeCheckIsolates: p.compileMs / wallMs,
      kernelCallsAccuracy: p.kernelMs / wallMs,
      referenceSolver: p.referenceMs / wallMs,
      metrics: p.metricsMs / wallMs,
      timingRounds: p.timingMs / wallMs,
      kernelInTimingCalls: kernelMsInTiming(report) / wallMs,
      kernelInTimedRounds: roundMsInTiming(report) / wallMs,
    };
    log(`  ${set.name}: ${fmt(wallMs / 1000)} s; phases ${JSON.stringify(p)}`);

    // Growth with n: accuracy only (timing has its own budget per size), one uniform matrix.
    const ns = smoke ? [16, 32] : [64, 128, 256, 512];
    const growth: { n: number; wallMs: number; phases: TrialReport['phases'] }[] = [];
    for (const n of ns) {
      const one: MatrixSet = {
        name: `uniform-${n}`,
        items: [{ kind: 'generated', spec: { family: 'uniform', n, seed: 1 } }],
        timingSizes: [],
      };
      const out = await trial(one, false);
      checks.push({
        name: `uniform n=${n} accuracy trial completed`,
        passed: out.report.status === 'completed',
        detail: out.report.status,
      });
      growth.push({ n, wallMs: out.wallMs, phases: out.report.phases });
      log(`  uniform n=${n}: ${fmt(out.wallMs)} ms ${JSON.stringify(out.report.phases)}`);
    }
    // The compile phase does not grow with n; fit the part that does.
    const variable = growth.map((g) => g.wallMs - g.phases.compileMs);
    const exponent = fitExponent(ns, variable);
    const exponentOf = (key: 'kernelMs' | 'referenceMs' | 'metricsMs') =>
      fitExponent(
        ns,
        growth.map((g) => Math.max(g.phases[key], 1e-3)),
      );
    return {
      checks,
      goals: [
        goal(`${set.name} trial wall time, s`, wallMs / 1000, 'max', 60),
        goal('harness share (all but kernel calls)', harnessShare, 'max', 0.25),
      ],
      summary: [
        [
          `${set.name} trial`,
          `${fmt(wallMs / 1000)} s, ${report.matrices.length} matrices, timing at n = ${set.timingSizes.join(', ')}`,
        ],
        [
          'shares',
          Object.entries(shares)
            .map(([k, v]) => `${k} ${fmt(100 * v)} %`)
            .join(', '),
        ],
        [
          'harness share',
          `${fmt(100 * harnessShare)} % (every kernel call counted as kernel time, warm-up included); ${fmt(100 * harnessShareRoundsOnly)} % with warm-up counted as harness`,
        ],
        [
          'cost exponent over n (accuracy, compile excluded)',
          `${fmt(exponent)}; kernel ${fmt(exponentOf('kernelMs'))}, reference ${fmt(exponentOf('referenceMs'))}, metrics ${fmt(exponentOf('metricsMs'))}`,
        ],
      ],
      data: {
        set: set.name,
        wallMs,
        phases: p,
        kernelMs,
        harnessShare,
        harnessShareRoundsOnly,
        shares,
        growth,
        exponent,
      },
    };
  },
};
