import { compileKernel } from '@sandbox/isolate/compile.ts';
import type { KernelInstance } from '@sandbox/isolate/kernel-instance.ts';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { timingMatrix } from '@sandbox/matrices/timing-input.ts';
import { goal, type Benchmark, type BenchmarkCheck } from './benchmark.ts';
import { fmt, median, timeCall } from './measure.ts';

/**
 * The same kernel source run natively (compiled by the same esbuild step, evaluated in the host
 * process) and inside the engine's isolate (sandbox/isolate): the kernel-time ratio per size,
 * the fixed cost of a fresh isolate with its context and compiled module, and what a call costs
 * beyond the kernel (copy in, copy out, the host's checks of the result).
 */

const ROUTINE = 'lu-partial-pivoting';
const SOURCE_FILE = 'examples/lu-partial-pivoting-right-looking.ts';

type Factor = (a: Float64Array, n: number) => { lu: Float64Array; perm: Int32Array };

/** The kernel's CommonJS output evaluated in the host (what "native" means here). */
async function nativeKernel(source: string): Promise<Factor> {
  const compiled = await compileKernel(source);
  if (!compiled.ok) throw new Error('the benchmark kernel does not compile');
  const module = { exports: {} as Record<string, unknown> };
  new Function('module', 'exports', compiled.js)(module, module.exports);
  return module.exports.factor as Factor;
}

async function load(source: string, typeCheck: 'skip' | 'block') {
  const loaded = await loadKernel({ source, routine: ROUTINE, typeCheck });
  if (!loaded.ok) throw new Error(`the benchmark kernel does not load: ${loaded.message}`);
  return loaded;
}

interface SizeRow {
  n: number;
  rounds: number;
  nativeMs: number;
  isolateKernelMs: number;
  /** Median over rounds of isolate/native kernel time. */
  kernelRatio: number;
  /** Host wall time of kernel.call(): copies in and out, kernel, result checks. */
  isolateCallMs: number;
  /** isolateCallMs − isolateKernelMs: copy in, copy out and the host's result checks. */
  callOverheadMs: number;
}

async function measureSize(
  n: number,
  rounds: number,
  warmup: number,
  native: Factor,
  kernel: KernelInstance,
): Promise<{ row: SizeRow; checks: BenchmarkCheck[] }> {
  const a = timingMatrix(ROUTINE, n, 7).data;
  const nativeMs: number[] = [];
  const isoMs: number[] = [];
  const callMs: number[] = [];
  const ratios: number[] = [];
  const checks: BenchmarkCheck[] = [];
  // Same result both ways: the isolate's factors must equal the native ones bit for bit.
  const first = await kernel.call({ a: Float64Array.from(a), m: n, n });
  const mine = native(Float64Array.from(a), n);
  const same =
    first.status === 'ok' &&
    first.result !== undefined &&
    'lu' in first.result &&
    (first.result.lu as Float64Array).every((v, k) => v === mine.lu[k]);
  checks.push({
    name: `n=${n} isolate result equals native`,
    passed: same,
    detail: `status ${first.status}`,
  });
  for (let r = -warmup; r < rounds; r++) {
    const copy = Float64Array.from(a);
    const t = await kernel.time({ a: Float64Array.from(a), m: n, n });
    const nat = timeCall(() => native(copy, n));
    const c = await kernel.call({ a: Float64Array.from(a), m: n, n });
    if (!t.ok || c.status !== 'ok') {
      checks.push({
        name: `n=${n} isolate call`,
        passed: false,
        detail: t.ok ? c.status : t.status,
      });
      break;
    }
    if (r < 0) continue;
    nativeMs.push(nat);
    isoMs.push(t.ms);
    callMs.push(c.ms);
    ratios.push(t.ms / nat);
  }
  const isolateKernelMs = median(isoMs);
  const isolateCallMs = median(callMs);
  return {
    row: {
      n,
      rounds: isoMs.length,
      nativeMs: median(nativeMs),
      isolateKernelMs,
      kernelRatio: median(ratios),
      isolateCallMs,
      callOverheadMs: isolateCallMs - isolateKernelMs,
    },
    checks,
  };
}

export const sandboxOverheadBenchmark: Benchmark = {
  name: 'sandbox-overhead',
  description:
    'One LU kernel source natively and in the isolate: kernel-time ratio, fixed cost of isolate + context + compile, per-call copy cost.',
  async run({ smoke, log }) {
    const source = readKernelSource(SOURCE_FILE);
    const sizes = smoke ? [16, 32] : [64, 128, 256, 512];
    const roundsFor = (n: number) =>
      smoke ? 1 : n <= 64 ? 61 : n <= 128 ? 41 : n <= 256 ? 21 : 11;
    const warmupFor = (n: number) => (smoke ? 1 : n <= 128 ? 20 : 5);

    // Fixed cost: esbuild + isolate + context + module, without and with the type check.
    // Thirty starts: on a shared machine single starts vary several-fold with the scheduler.
    // The CPU time (this process's user + system time, all its threads) leaves out the waits
    // for a core, so it shows the work itself.
    const starts = smoke ? 2 : 31;
    const fixed: { compileMs: number; loadMs: number; cpuMs: number }[] = [];
    for (let i = 0; i < starts; i++) {
      const cpu0 = process.cpuUsage();
      const loaded = await load(source, 'skip');
      const cpu = process.cpuUsage(cpu0);
      fixed.push({
        compileMs: loaded.compileMs,
        loadMs: loaded.loadMs,
        cpuMs: (cpu.user + cpu.system) / 1000,
      });
      loaded.kernel.dispose();
    }
    const checked = await load(source, 'block');
    const typeCheckMs = checked.compileMs;
    checked.kernel.dispose();
    const warmFixed = fixed.slice(1);
    const compileMs = median(warmFixed.map((f) => f.compileMs));
    const loadMs = median(warmFixed.map((f) => f.loadMs));
    const fixedCpuMs = median(warmFixed.map((f) => f.cpuMs));
    log(
      `  fixed cost: esbuild ${fmt(compileMs)} ms + isolate/context/module ${fmt(loadMs)} ms (CPU time ${fmt(fixedCpuMs)} ms); with type check ${fmt(typeCheckMs)} ms`,
    );

    const native = await nativeKernel(source);
    const kernel = (await load(source, 'skip')).kernel;
    const rows: SizeRow[] = [];
    const checks: BenchmarkCheck[] = [];
    try {
      for (const n of sizes) {
        const out = await measureSize(n, roundsFor(n), warmupFor(n), native, kernel);
        rows.push(out.row);
        checks.push(...out.checks);
        log(
          `  n=${n}: native ${fmt(out.row.nativeMs)} ms, isolate ${fmt(out.row.isolateKernelMs)} ms (ratio ${fmt(out.row.kernelRatio)}), call overhead ${fmt(out.row.callOverheadMs)} ms`,
        );
      }
    } finally {
      kernel.dispose();
    }
    const large = rows.filter((r) => r.n >= (smoke ? 32 : 256));
    const worstLarge = large.length > 0 ? Math.max(...large.map((r) => r.kernelRatio)) : null;
    return {
      checks,
      goals: [
        goal(
          `kernel-time ratio isolate/native, worst at n ≥ ${smoke ? 32 : 256}`,
          worstLarge,
          'max',
          1.05,
        ),
        goal(
          'isolate + context + compile (esbuild), ms',
          compileMs + loadMs,
          'max',
          20,
          'type check excluded; reported separately',
        ),
      ],
      summary: [
        ...rows.map((r): [string, string] => [
          `n=${r.n}`,
          `isolate/native ${fmt(r.kernelRatio)}, copy+checks ${fmt(r.callOverheadMs)} ms per call (${r.rounds} rounds)`,
        ]),
        [
          'fixed cost',
          `esbuild ${fmt(compileMs)} ms + isolate ${fmt(loadMs)} ms (CPU time of both ${fmt(fixedCpuMs)} ms); type check adds ${fmt(typeCheckMs - compileMs)} ms`,
        ],
      ],
      data: { kernel: SOURCE_FILE, fixed, fixedCpuMs, typeCheckMs, rows },
    };
  },
};
