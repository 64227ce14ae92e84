import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { DEFAULT_SIZE_BUDGET_MS } from '@sandbox/timing/interleaved.ts';
import { DEFAULT_BLOCKS } from '@sandbox/timing/rounds.ts';
import { runTrialTiming } from '@sandbox/trial/trial-timing.ts';
import { goal, type Benchmark, type BenchmarkCheck } from './benchmark.ts';
import { fmt, median } from './measure.ts';

/**
 * Calibration of the engine's timing verdicts (sandbox/timing through runTrialTiming, exactly as
 * a trial runs it: blocks of fresh isolates loaded from the source, both sizes in each block):
 * A/A pairs (one source as candidate and incumbent, so every block holds two different isolates
 * of it) give the false `faster`/`slower` rate; a kernel with planted extra work of 3 %, 10 % and
 * 30 % of its flops against the plain one gives the detection rate (`slower`). Each repeat is a
 * fresh verdict with its own isolates, warm-up, rounds and seed. Beside the rates: the spread of
 * the blocks' estimates and of single rounds, to tell where a false alarm comes from.
 */

const ROUTINE = 'lu-partial-pivoting';
const MARGIN = 0.03; // the default acceptance policy's practical margin (numerics.md, Timing)
const PLANTED = [0.03, 0.1, 0.3];

function source(fraction: number): string {
  const file = fileURLToPath(new URL('./kernels/lu-planted-work.ts', import.meta.url));
  const text = readFileSync(file, 'utf8');
  return text.replace('const EXTRA_FRACTION = 0;', `const EXTRA_FRACTION = ${fraction};`);
}

interface Series {
  n: number;
  planted: number;
  repeats: number;
  verdicts: Record<string, number>;
  ratios: number[];
  rounds: number[];
  /** Robust sd of the blocks' log-ratio estimates, per verdict. */
  betweenBlock: number[];
  /** Robust sd of single rounds' log-ratios within a block, over √(rounds per block), per verdict. */
  roundShare: number[];
  blockRatios: number[][];
}

const emptySeries = (n: number, planted: number): Series => ({
  n,
  planted,
  repeats: 0,
  verdicts: {},
  ratios: [],
  rounds: [],
  betweenBlock: [],
  roundShare: [],
  blockRatios: [],
});

/** Repeats of one trial timing (all sizes at once, as a trial does); one series per size. */
async function series(
  sizes: number[],
  planted: number,
  repeats: number,
  budgetMs: number,
  verdictMs: number[],
): Promise<Series[]> {
  const out = sizes.map((n) => emptySeries(n, planted));
  const candidateSource = source(planted);
  const incumbentSource = source(0);
  for (let r = 0; r < repeats; r++) {
    const t0 = performance.now();
    const timing = await runTrialTiming({
      routine: ROUTINE,
      sizes,
      candidateSource,
      incumbentSource,
      seed: 100 * Math.round(planted * 100) + r + 1,
      budgetMs,
      margin: MARGIN,
    });
    verdictMs.push(performance.now() - t0);
    for (const [i, s] of out.entries()) {
      const size = timing[i];
      s.repeats += 1;
      const verdict = size?.verdict ?? 'none';
      s.verdicts[verdict] = (s.verdicts[verdict] ?? 0) + 1;
      if (size?.ratio != null) s.ratios.push(size.ratio);
      s.rounds.push(size?.rounds ?? 0);
      if (size?.betweenBlockSpread != null) s.betweenBlock.push(size.betweenBlockSpread);
      const perBlock = size?.roundsPerBlock ?? [];
      if (size?.roundSpread != null && perBlock.length > 0)
        s.roundShare.push(size.roundSpread / Math.sqrt(median(perBlock)));
      s.blockRatios.push(size?.blockRatios ?? []);
    }
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
    // A trial's own budget per size (TRIAL_TIMING_BUDGET_MS unset), so the rates are a trial's;
    // the rounds it buys are reported beside them.
    const budgetMs = smoke ? 20 : DEFAULT_SIZE_BUDGET_MS;
    const all: Series[] = [];
    const checks: BenchmarkCheck[] = [];
    const verdictMs: number[] = [];
    for (const planted of [0, ...PLANTED]) {
      const repeats = planted === 0 ? aaRepeats : plantedRepeats;
      const got = await series(sizes, planted, repeats, budgetMs, verdictMs);
      all.push(...got);
      for (const s of got)
        log(
          `  n=${s.n} ${planted === 0 ? 'A/A' : `+${planted * 100} %`}: ${JSON.stringify(s.verdicts)}, median ratio ${fmt(median(s.ratios))}, between-block ${fmt(median(s.betweenBlock))}, round share ${fmt(median(s.roundShare))}`,
        );
    }
    for (const s of all)
      checks.push({
        name: `n=${s.n} planted ${s.planted}: every repeat produced a verdict over ${DEFAULT_BLOCKS} blocks`,
        passed:
          (s.verdicts.none ?? 0) === 0 &&
          s.ratios.length === s.repeats &&
          s.blockRatios.every((b) => b.length === DEFAULT_BLOCKS),
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
            )} of ${s.repeats}; ratio ${fmt(median(s.ratios))}; ${median(s.rounds)} rounds in ${DEFAULT_BLOCKS} blocks; spread between blocks ${fmt(median(s.betweenBlock))}, from rounds alone ${fmt(median(s.roundShare))}`,
        ]),
        ['pooled A/A false rate', fmt(pooled(0, ['faster', 'slower']))],
        [
          `one trial timing (n = ${sizes.join(', ')})`,
          `${fmt(median(verdictMs))} ms (median of ${verdictMs.length})`,
        ],
      ],
      data: { budgetMs, margin: MARGIN, blocks: DEFAULT_BLOCKS, verdictMs, series: all },
    };
  },
};
