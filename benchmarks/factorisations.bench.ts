import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { CholeskyDecomposition, LuDecomposition, Matrix, QrDecomposition } from 'ml-matrix';
import type * as MathJsModule from 'mathjs';
import numeric from 'numeric';
import type { RoutineSlug } from '@shared/routines.ts';
import { normInf, vectorNormInf } from '@sandbox/numerics/norms.ts';
import {
  solveLower,
  solveLowerTransposed,
  solveUpper,
} from '@sandbox/numerics/triangular-solve.ts';
import { UNIT_ROUNDOFF } from '@sandbox/numerics/unit-roundoff.ts';
import { choleskyFactor } from '@sandbox/reference/cholesky.ts';
import { luFactorPartialPivoting, luSolve } from '@sandbox/reference/gepp.ts';
import {
  householderQr,
  householderR,
  type HouseholderQr,
} from '@sandbox/reference/householder-qr.ts';
import { timingMatrix } from '@sandbox/matrices/timing-input.ts';
import { flopCount } from '@sandbox/timing/flops.ts';
import { goal, type Benchmark, type BenchmarkCheck } from './benchmark.ts';
import { fmt, median } from './measure.ts';

/**
 * The engine's reference factorisations (sandbox/reference) against the general-purpose
 * JavaScript libraries a user would otherwise reach for, on the same seeded inputs, in one
 * process, in rotating order. Every implementation's result is checked by a solve (or, for
 * mathjs's QR, a product) with a LAPACK-style residual ratio before its time counts.
 */

type Routine = 'lu' | 'cholesky' | 'qr';
const slugs: Record<Routine, RoutineSlug> = {
  lu: 'lu-partial-pivoting',
  cholesky: 'cholesky',
  qr: 'householder-qr',
};

/** Pass threshold of LAPACK's residual ratios (TESTING/dtest.in; numerics.md, Metrics). */
const RESIDUAL_THRESHOLD = 30;

/**
 * Wall and CPU milliseconds of one call of f. The CPU time (this process's user + system time)
 * leaves out the time the call waited while other processes had the core, which on a shared
 * machine dominates the wall time's noise; both are kept.
 */
function timeWallAndCpu(f: () => unknown): { wallMs: number; cpuMs: number } {
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  f();
  const wallMs = performance.now() - t0;
  const cpu = process.cpuUsage(cpu0);
  return { wallMs, cpuMs: (cpu.user + cpu.system) / 1000 };
}

interface Problem {
  n: number;
  a: Float64Array;
  rows: number[][];
  b: Float64Array;
}

/** One implementation of one routine: factor (timed), then a residual ratio from its result. */
interface Implementation {
  library: string;
  routine: Routine;
  /** Largest n it is timed at (mathjs is 20–50× slower and would take minutes at n = 1024). */
  maxN: number;
  factor(p: Problem): unknown;
  residual(p: Problem, factors: unknown): number;
}

/** ‖b − A x‖∞ / (n·‖A‖∞·‖x‖∞·u): LAPACK dget02's solve ratio in the ∞-norm, in plain double. */
function solveRatio(p: Problem, x: ArrayLike<number>): number {
  const { n, a, b } = p;
  let worst = 0;
  for (let i = 0; i < n; i++) {
    let s = b[i]!;
    for (let j = 0; j < n; j++) s -= a[i * n + j]! * x[j]!;
    worst = Math.max(worst, Math.abs(s));
  }
  const ratio = worst / (n * normInf(a, n, n) * vectorNormInf(x) * UNIT_ROUNDOFF);
  return Number.isNaN(ratio) ? Infinity : ratio;
}

/** Applies Qᵀ = H_{n−1} … H_0 to b, from the compact Householder result. */
function applyQt(f: HouseholderQr, b: Float64Array, n: number): Float64Array {
  const y = Float64Array.from(b);
  for (let k = 0; k < n; k++) {
    const t = f.tau[k]!;
    if (t === 0) continue;
    let s = y[k]!;
    for (let i = k + 1; i < n; i++) s += f.qr[i * n + k]! * y[i]!;
    s *= t;
    y[k] = y[k]! - s;
    for (let i = k + 1; i < n; i++) y[i] = y[i]! - f.qr[i * n + k]! * s;
  }
  return y;
}

const column = (b: Float64Array) => Matrix.columnVector(Array.from(b));

type MathJs = typeof MathJsModule;

function implementations(mathjs: MathJs | null): Implementation[] {
  const list: Implementation[] = [
    {
      library: 'engine',
      routine: 'lu',
      maxN: Infinity,
      factor: (p) => luFactorPartialPivoting(p.a, p.n),
      residual: (p, f) => {
        const r = f as ReturnType<typeof luFactorPartialPivoting>;
        return r.ok ? solveRatio(p, luSolve(r.lu, r.perm, p.b, p.n)) : Infinity;
      },
    },
    {
      library: 'numeric',
      routine: 'lu',
      maxN: Infinity,
      factor: (p) => numeric.LU(p.rows),
      residual: (p, f) =>
        solveRatio(p, numeric.LUsolve(f as ReturnType<typeof numeric.LU>, Array.from(p.b))),
    },
    {
      library: 'ml-matrix',
      routine: 'lu',
      maxN: Infinity,
      factor: (p) => new LuDecomposition(new Matrix(p.rows)),
      residual: (p, f) => solveRatio(p, (f as LuDecomposition).solve(column(p.b)).getColumn(0)),
    },
    {
      library: 'engine',
      routine: 'cholesky',
      maxN: Infinity,
      factor: (p) => choleskyFactor(p.a, p.n),
      residual: (p, f) => {
        const r = f as ReturnType<typeof choleskyFactor>;
        if (!r.ok) return Infinity;
        return solveRatio(p, solveLowerTransposed(r.l, solveLower(r.l, p.b, p.n), p.n));
      },
    },
    {
      library: 'ml-matrix',
      routine: 'cholesky',
      maxN: Infinity,
      factor: (p) => new CholeskyDecomposition(new Matrix(p.rows)),
      residual: (p, f) =>
        solveRatio(p, (f as CholeskyDecomposition).solve(column(p.b)).getColumn(0)),
    },
    {
      library: 'engine',
      routine: 'qr',
      maxN: Infinity,
      factor: (p) => householderQr(p.a, p.n, p.n),
      residual: (p, f) => {
        const r = f as HouseholderQr;
        return solveRatio(p, solveUpper(householderR(r, p.n), applyQt(r, p.b, p.n), p.n));
      },
    },
    {
      library: 'ml-matrix',
      routine: 'qr',
      maxN: Infinity,
      factor: (p) => new QrDecomposition(new Matrix(p.rows)),
      residual: (p, f) => solveRatio(p, (f as QrDecomposition).solve(column(p.b)).getColumn(0)),
    },
  ];
  if (mathjs) {
    const m = mathjs;
    list.push(
      {
        library: 'mathjs',
        routine: 'lu',
        maxN: 256,
        factor: (p) => m.lup(p.rows),
        residual: (p, f) => {
          const raw = m.lusolve(f as ReturnType<typeof m.lup>, Array.from(p.b));
          const x = (m.isMatrix(raw) ? raw.toArray() : raw) as unknown as number[][];
          return solveRatio(
            p,
            x.map((row) => row[0]!),
          );
        },
      },
      {
        library: 'mathjs',
        routine: 'qr',
        maxN: 128,
        factor: (p) => m.qr(p.rows),
        // mathjs forms Q explicitly; check A·1 against Q·(R·1): ‖A·1 − QR·1‖∞/(n‖A‖∞u).
        residual: (p, f) => {
          const { Q, R } = f as { Q: number[][]; R: number[][] };
          const ones = new Array<number>(p.n).fill(1);
          const rx = R.map((row) => row.reduce((s, v, j) => s + v * ones[j]!, 0));
          let worst = 0;
          for (let i = 0; i < p.n; i++) {
            let s = 0;
            for (let j = 0; j < p.n; j++) s += p.a[i * p.n + j]! - Q[i]![j]! * rx[j]!;
            worst = Math.max(worst, Math.abs(s));
          }
          return worst / (p.n * normInf(p.a, p.n, p.n) * UNIT_ROUNDOFF);
        },
      },
    );
  }
  return list;
}

function problem(routine: Routine, n: number): Problem {
  const a = timingMatrix(slugs[routine], n, 20261202).data;
  const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
  // b = A·x with x = (1, −1, 1, …): any right-hand side does for a residual ratio.
  const b = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += a[i * n + j]! * (j % 2 === 0 ? 1 : -1);
    b[i] = s;
  }
  return { n, a, rows, b };
}

interface LapackRow {
  routine: Routine;
  n: number;
  medianMs: number;
}

/** Debian's scipy (single-threaded LAPACK) if python3 has it; null with the reason otherwise. */
function lapackTimings(
  sizes: number[],
  rounds: Record<number, number>,
): { rows: LapackRow[]; version: string } | { rows: null; reason: string } {
  const script = fileURLToPath(new URL('./lapack-reference.py', import.meta.url));
  const threads = [
    'OMP_NUM_THREADS',
    'OPENBLAS_NUM_THREADS',
    'MKL_NUM_THREADS',
    'BLIS_NUM_THREADS',
  ];
  const env = { ...process.env, ...Object.fromEntries(threads.map((k) => [k, '1'])) };
  const run = spawnSync('python3', [script], {
    input: JSON.stringify({ sizes, rounds }),
    env,
    encoding: 'utf8',
    timeout: 600_000,
  });
  if (run.error || run.status !== 0)
    return { rows: null, reason: `python3 did not run: ${run.error?.message ?? run.stderr}` };
  const out = JSON.parse(run.stdout) as
    { available: true; scipy: string; results: LapackRow[] } | { available: false; reason: string };
  if (!out.available) return { rows: null, reason: `scipy not installed (${out.reason})` };
  return { rows: out.results, version: `scipy ${out.scipy}` };
}

interface Row {
  routine: Routine;
  n: number;
  library: string;
  rounds: number;
  medianMs: number;
  gflops: number;
  /** Median CPU time of the same calls, and the figures it gives (see timeWallAndCpu). */
  cpuMedianMs: number;
  cpuGflops: number;
  cpuSpeedupOverFastestLibrary: number | null;
  residualRatio: number;
  /** This implementation's speed over the fastest library's (time_library / time_this). */
  speedupOverFastestLibrary: number | null;
  lapackMs: number | null;
  /** Fraction of single-threaded LAPACK's speed (LAPACK time / this time). */
  fractionOfLapack: number | null;
}

export const factorisationsBenchmark: Benchmark = {
  name: 'factorisations',
  description:
    "The engine's reference LU (partial pivoting), Cholesky and Householder QR against mathjs, ml-matrix and numeric, and single-threaded LAPACK through scipy when present.",
  async run({ smoke, log }) {
    const sizes = smoke ? [20, 40] : [128, 256, 512, 1024];
    const roundsFor = (n: number) => (smoke ? 1 : n <= 128 ? 9 : n <= 256 ? 7 : n <= 512 ? 5 : 3);
    // mathjs costs about 1 s to load (stack.md), so it is imported here, not at the top.
    const mathjs = await import('mathjs');
    const impls = implementations(mathjs);
    const checks: BenchmarkCheck[] = [];
    const rows: Row[] = [];
    for (const routine of ['lu', 'cholesky', 'qr'] as Routine[]) {
      for (const n of sizes) {
        const p = problem(routine, n);
        const here = impls.filter((i) => i.routine === routine && n <= i.maxN);
        const times = new Map<string, number[]>(here.map((i) => [i.library, []]));
        const cpuTimes = new Map<string, number[]>(here.map((i) => [i.library, []]));
        // Correctness first (also the warm-up call): a wrong result is never timed.
        const valid = here.filter((impl) => {
          const ratio = impl.residual(p, impl.factor(p));
          const passed = ratio < RESIDUAL_THRESHOLD;
          checks.push({
            name: `${impl.library} ${routine} n=${n} residual`,
            passed,
            detail: `solve residual ratio ${fmt(ratio)} (pass < ${RESIDUAL_THRESHOLD})`,
          });
          rows.push({
            routine,
            n,
            library: impl.library,
            rounds: 0,
            medianMs: NaN,
            gflops: NaN,
            cpuMedianMs: NaN,
            cpuGflops: NaN,
            cpuSpeedupOverFastestLibrary: null,
            residualRatio: ratio,
            speedupOverFastestLibrary: null,
            lapackMs: null,
            fractionOfLapack: null,
          });
          return passed;
        });
        const rounds = roundsFor(n);
        for (let r = 0; r < rounds; r++) {
          // Rotate the order each round so that no implementation always runs first.
          for (let k = 0; k < valid.length; k++) {
            const impl = valid[(k + r) % valid.length]!;
            const t = timeWallAndCpu(() => impl.factor(p));
            times.get(impl.library)!.push(t.wallMs);
            cpuTimes.get(impl.library)!.push(t.cpuMs);
          }
        }
        const flops = flopCount(slugs[routine], n, n);
        for (const impl of valid) {
          const row = rows.find(
            (x) => x.routine === routine && x.n === n && x.library === impl.library,
          )!;
          row.rounds = rounds;
          row.medianMs = median(times.get(impl.library)!);
          row.gflops = flops / (row.medianMs * 1e6);
          row.cpuMedianMs = median(cpuTimes.get(impl.library)!);
          row.cpuGflops = flops / (row.cpuMedianMs * 1e6);
        }
        const here2 = rows.filter((x) => x.routine === routine && x.n === n);
        const libs = here2.filter((x) => x.library !== 'engine' && Number.isFinite(x.medianMs));
        const fastest = Math.min(...libs.map((x) => x.medianMs));
        for (const row of here2)
          row.speedupOverFastestLibrary = Number.isFinite(fastest) ? fastest / row.medianMs : null;
        const fastestCpu = Math.min(...libs.map((x) => x.cpuMedianMs));
        for (const row of here2)
          row.cpuSpeedupOverFastestLibrary = Number.isFinite(fastestCpu)
            ? fastestCpu / row.cpuMedianMs
            : null;
        const engine = here2.find((x) => x.library === 'engine');
        log(
          `  ${routine} n=${n}: ` +
            here2.map((x) => `${x.library} ${fmt(x.gflops)} GF/s`).join(', ') +
            (engine
              ? ` — engine ${fmt(engine.speedupOverFastestLibrary)}× fastest library` +
                ` (CPU time: ${fmt(engine.cpuGflops)} GF/s, ${fmt(engine.cpuSpeedupOverFastestLibrary)}×)`
              : ''),
        );
      }
    }
    const lapack = smoke
      ? { rows: null, reason: 'skipped in smoke mode' }
      : lapackTimings(sizes, Object.fromEntries(sizes.map((n) => [n, roundsFor(n)])));
    if (lapack.rows) {
      for (const row of rows) {
        const l = lapack.rows.find((x) => x.routine === row.routine && x.n === row.n);
        if (!l) continue;
        row.lapackMs = l.medianMs;
        row.fractionOfLapack = l.medianMs / row.medianMs;
      }
    }
    const engineAt = (routine: Routine, n: number) =>
      rows.find((x) => x.routine === routine && x.n === n && x.library === 'engine');
    const goalN = smoke ? 40 : 512;
    const lu = engineAt('lu', goalN);
    const chol = engineAt('cholesky', goalN);
    const qr = engineAt('qr', goalN);
    const goals = [
      goal(
        `engine LU at n=${goalN}: × fastest library`,
        lu?.speedupOverFastestLibrary ?? null,
        'min',
        2.5,
      ),
      goal(`engine LU at n=${goalN}: GFLOP/s`, lu?.gflops ?? null, 'min', 3),
      goal(
        `engine Cholesky at n=${goalN}: × fastest library`,
        chol?.speedupOverFastestLibrary ?? null,
        'min',
        4,
      ),
      goal(
        `engine QR at n=${goalN}: × fastest library`,
        qr?.speedupOverFastestLibrary ?? null,
        'min',
        4,
      ),
    ];
    const summary: [string, string][] = [];
    for (const routine of ['lu', 'cholesky', 'qr'] as Routine[])
      for (const n of sizes) {
        const e = engineAt(routine, n);
        if (!e) continue;
        const lapackPart =
          e.fractionOfLapack === null ? '' : `, ${fmt(100 * e.fractionOfLapack)} % of LAPACK`;
        summary.push([
          `${routine} n=${n}`,
          `engine ${fmt(e.gflops)} GF/s, ${fmt(e.speedupOverFastestLibrary)}× fastest library${lapackPart}` +
            ` (CPU time: ${fmt(e.cpuGflops)} GF/s, ${fmt(e.cpuSpeedupOverFastestLibrary)}×)`,
        ]);
      }
    if (!lapack.rows) summary.push(['LAPACK (scipy)', `skipped: ${lapack.reason}`]);
    return {
      checks,
      goals,
      summary,
      data: {
        rows,
        lapack: lapack.rows ? { version: lapack.version } : { skipped: lapack.reason },
      },
    };
  },
};
