import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { runTrialTiming } from '@sandbox/trial/trial-timing.ts';

// The timing self-test of the engine with real kernels in real isolates (no timed assertion:
// only the verdicts are checked). numerics.md, "Timing": identical kernels must give
// `no clear difference`; a planted slowdown well above the 3 % margin must give `slower`.
const plain = readFileSync('tests/fixtures/kernels/lu-repeated-passes.ts', 'utf8');
const doubled = plain.replace('const PASSES = 1;', 'const PASSES = 2;');

async function load(source: string) {
  const loaded = await loadKernel({ source, routine: 'lu-partial-pivoting' });
  if (!loaded.ok) throw new Error(loaded.message);
  return loaded.kernel;
}

describe('timing verdicts on real kernels', () => {
  it('finds no clear difference between a kernel and itself in the large majority of repeats', async () => {
    const a = await load(plain);
    const b = await load(plain);
    const verdicts: string[] = [];
    for (let repeat = 0; repeat < 6; repeat++) {
      const sizes = await runTrialTiming({
        routine: 'lu-partial-pivoting',
        sizes: [48, 96],
        candidate: a,
        incumbent: b,
        seed: repeat + 1,
        budgetMs: 250,
        margin: 0.03,
      });
      verdicts.push(...sizes.map((s) => s.verdict ?? 'none'));
    }
    a.dispose();
    b.dispose();
    const clear = verdicts.filter((v) => v === 'no clear difference').length;
    expect(verdicts).toHaveLength(12);
    expect(clear).toBeGreaterThanOrEqual(10);
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
