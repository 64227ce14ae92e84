import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { runTrialTiming } from '@sandbox/trial/trial-timing.ts';

// The timing self-test of the engine with real kernels in real isolates (no timed assertion:
// only the verdicts are checked). numerics.md, "Timing": identical kernels must give
// `no clear difference`; a planted slowdown well above the 3 % margin must give `slower`.
// The test suite runs many files at once on two cores, so two isolates of the same code can
// differ for a while (garbage collection, a busy neighbour); the A/A bound below allows a third
// of the verdicts to go astray, which still fails for any bias of the method itself (a biased
// call order or pairing gives the same wrong verdict nearly every time). The calibrated false
// alarm rate is measured in benchmarks/, on a quiet machine.
const plain = readFileSync('tests/fixtures/kernels/lu-repeated-passes.ts', 'utf8');
const doubled = plain.replace('const PASSES = 1;', 'const PASSES = 2;');

async function load(source: string) {
  const loaded = await loadKernel({ source, routine: 'lu-partial-pivoting' });
  if (!loaded.ok) throw new Error(loaded.message);
  return loaded.kernel;
}

describe('timing verdicts on real kernels', () => {
  it('finds no clear difference between a kernel and itself in the large majority of repeats', async () => {
    // One loaded instance in both roles: two isolates of the same source can settle on code of
    // slightly different speed (a few per cent, lasting), which is a real difference the
    // benchmarks/ calibration measures; here only the method is on trial (pairing, call order,
    // interval and margin), so both roles share one instance and any verdict is a false alarm.
    const a = await load(plain);
    const b = a;
    const verdicts: string[] = [];
    const ratios: number[] = [];
    for (let repeat = 0; repeat < 6; repeat++) {
      const sizes = await runTrialTiming({
        routine: 'lu-partial-pivoting',
        sizes: [64, 128],
        candidate: a,
        incumbent: b,
        seed: repeat + 1,
        budgetMs: 300,
        margin: 0.03,
      });
      verdicts.push(...sizes.map((s) => s.verdict ?? 'none'));
      ratios.push(...sizes.map((s) => s.ratio ?? Number.NaN));
    }
    a.dispose();
    const clear = verdicts.filter((v) => v === 'no clear difference').length;
    expect(verdicts).toHaveLength(12);
    expect(clear).toBeGreaterThanOrEqual(8);
    // Neither side is favoured: as many ratios above 1 as below, within a wide band.
    const above = ratios.filter((r) => r > 1).length;
    expect(above).toBeGreaterThanOrEqual(2);
    expect(above).toBeLessThanOrEqual(10);
    const sorted = [...ratios].sort((x, y) => x - y);
    const median = (sorted[5]! + sorted[6]!) / 2;
    expect(median).toBeGreaterThan(0.9);
    expect(median).toBeLessThan(1.1);
  });

  it('calls a planted twofold slowdown slower at every size', async () => {
    const slow = await load(doubled);
    const base = await load(plain);
    const sizes = await runTrialTiming({
      routine: 'lu-partial-pivoting',
      sizes: [48, 96],
      candidate: slow,
      incumbent: base,
      seed: 7,
      budgetMs: 300,
      margin: 0.03,
    });
    slow.dispose();
    base.dispose();
    expect(sizes.map((s) => s.verdict)).toEqual(['slower', 'slower']);
    expect(sizes.every((s) => s.ratio! > 1.5)).toBe(true);
  });
});
