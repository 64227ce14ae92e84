import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { KernelInstance } from '@sandbox/isolate/kernel-instance.ts';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { runTrialTiming } from '@sandbox/trial/trial-timing.ts';
import { goal, type Benchmark, type BenchmarkCheck } from './benchmark.ts';
import { fmt, median } from './measure.ts';

/**
 * Calibration of the engine's timing verdicts (sandbox/timing through runTrialTiming, as a
 * trial runs it): A/A pairs (one source in two isolates) give the false `faster`/`slower`
 * rate; a kernel with planted extra work of 3 %, 10 % and 30 % of its flops against the plain
 * one gives the detection rate (`slower`). Each repeat is a fresh verdict with its own warm-up,
 * rounds and seed; the kernels stay loaded across repeats, as in a trial.
 */

const ROUTINE = 'lu-partial-pivoting';
const MARGIN = 0.03; // the default acceptance policy's practical margin (numerics.md, Timing)
const PLANTED = [0.03, 0.1, 0.3];

function source(fraction: number): string {
  const file = fileURLToPath(new URL('./kernels/lu-planted-work.ts', import.meta.url));
  const text = readFileSync(file, 'utf8');
  return text.replace('const EXTRA_FRACTION = 0;', `const EXTRA_FRACTION = ${fraction};`);
}

async function load(fraction: number): Promise<KernelInstance> {
  const loaded = await loadKernel({
    source: source(fraction),
    routine: ROUTINE,
    typeCheck: 'skip',
  });
  if (!loaded.ok) throw new Error(`planted kernel ${fraction} does not load: ${loaded.message}`);
  return loaded.kernel;
}

interface Series {
  n: number;
  planted: number;
  repeats: number;
  verdicts: Record<string, number>;
  ratios: number[];
  rounds: number[];
  verdictMs: number[];
}

async function series(
  n: number,
  planted: number,
  repeats: number,
  budgetMs: number,
  candidate: KernelInstance,
  incumbent: KernelInstance,
): Promise<Series> {
  const out: Series = { n, planted, repeats, verdicts: {}, ratios: [], rounds: [], verdictMs: [] };
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    const [size] = await runTrialTiming({
      routine: ROUTINE,
      sizes: [n],
      candidate,
      incumbent,
      seed: 1000 * n + 100 * Math.round(planted * 100) + r,
      budgetMs,
      margin: MARGIN,
    });
    out.verdictMs.push(performance.now() - t0);
    const verdict = size?.verdict ?? 'none';
    out.verdicts[verdict] = (out.verdicts[verdict] ?? 0) + 1;
    if (size?.ratio != null) out.ratios.push(size.ratio);
    out.rounds.push(size?.rounds ?? 0);
  }
  return out;
}

const rate = (s: Series, verdicts: string[]) =>
  verdicts.reduce((sum, v) => sum + (s.verdicts[v] ?? 0), 0) / s.repeats;

export const timingCalibrationBenchmark: Benchmark = {
  name: 'timing-calibration',
  description:
    "False-alarm rate of the timing verdict on A/A pairs and its detection rate for planted slowdowns of 3 %, 10 % and 30 % of an LU kernel's work.",
  async run({ smoke, log }) {
    const sizes = smoke ? [16] : [64, 128];
    const aaRepeats = smoke ? 2 : 100;
    const plantedRepeats = smoke ? 1 : 30;
    // A shorter budget than a trial's default 1 s per size keeps the run to minutes; the
    // rounds it buys are reported beside the rates.
    const budgetMs = smoke ? 20 : 200;
    const plain = await load(0);
    const twin = await load(0);
    const planted = new Map<number, KernelInstance>();
    for (const f of PLANTED) planted.set(f, await load(f));
    const all: Series[] = [];
    const checks: BenchmarkCheck[] = [];
    try {
      for (const n of sizes) {
        const aa = await series(n, 0, aaRepeats, budgetMs, twin, plain);
        all.push(aa);
        log(
          `  n=${n} A/A: ${JSON.stringify(aa.verdicts)}, rounds ${median(aa.rounds)}, verdict ${fmt(median(aa.verdictMs))} ms`,
        );
        for (const f of PLANTED) {
          const s = await series(n, f, plantedRepeats, budgetMs, planted.get(f)!, plain);
          all.push(s);
          log(
            `  n=${n} +${f * 100} %: ${JSON.stringify(s.verdicts)}, median ratio ${fmt(median(s.ratios))}`,
          );
        }
      }
    } finally {
      for (const k of [plain, twin, ...planted.values()]) k.dispose();
    }
    for (const s of all)
      checks.push({
        name: `n=${s.n} planted ${s.planted}: every repeat produced a verdict`,
        passed: (s.verdicts.none ?? 0) === 0 && s.ratios.length === s.repeats,
        detail: JSON.stringify(s.verdicts),
      });
    const pooled = (f: number, verdicts: string[]) => {
      const ss = all.filter((s) => s.planted === f);
      const hits = ss.reduce((sum, s) => sum + rate(s, verdicts) * s.repeats, 0);
      return hits / ss.reduce((sum, s) => sum + s.repeats, 0);
    };
    const worstPerSize = (f: number, verdicts: string[], worst: 'max' | 'min') => {
      const rates = all.filter((s) => s.planted === f).map((s) => rate(s, verdicts));
      return worst === 'max' ? Math.max(...rates) : Math.min(...rates);
    };
    return {
      checks,
      goals: [
        goal(
          'A/A false faster/slower rate, worst size',
          worstPerSize(0, ['faster', 'slower'], 'max'),
          'max',
          0.01,
        ),
        goal(
          'planted +3 % detected (slower), worst size',
          worstPerSize(0.03, ['slower'], 'min'),
          'min',
          0.5,
        ),
        goal(
          'planted +10 % detected, worst size',
          worstPerSize(0.1, ['slower'], 'min'),
          'min',
          0.95,
        ),
        goal('planted +30 % detected, worst size', worstPerSize(0.3, ['slower'], 'min'), 'min', 1),
      ],
      summary: [
        ...all.map((s): [string, string] => [
          `n=${s.n} ${s.planted === 0 ? 'A/A' : `+${s.planted * 100} % work`}`,
          `${Object.entries(s.verdicts)
            .map(([v, c]) => `${v} ${c}`)
            .join(
              ', ',
            )} of ${s.repeats}; ratio ${fmt(median(s.ratios))}; ${median(s.rounds)} rounds; ${fmt(median(s.verdictMs))} ms per verdict`,
        ]),
        ['pooled A/A false rate', fmt(pooled(0, ['faster', 'slower']))],
      ],
      data: { budgetMs, margin: MARGIN, series: all },
    };
  },
};
