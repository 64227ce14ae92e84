import { describe, expect, it } from 'vitest';
import { runBenchmark } from '../../../benchmarks/benchmark.ts';
import { benchmarks } from '../../../benchmarks/registry.ts';

// Every benchmark in smoke mode (tiny sizes, one repeat), in-process, so that the benchmarks
// cannot rot. Speeds are not asserted (they belong to `npm run bench`): only that each one
// runs, returns well-formed results, and that its correctness checks pass — a broken routine
// or a wrong result from an isolate fails here.
describe('benchmarks in smoke mode', () => {
  it('lists each benchmark once, by a kebab-case name', () => {
    const names = benchmarks.map((b) => b.name);
    expect(new Set(names).size).toBe(names.length);
    expect(names).toEqual(
      expect.arrayContaining([
        'factorisations',
        'sandbox-overhead',
        'timing-calibration',
        'trial-cost',
        'service',
      ]),
    );
    for (const name of names) expect(name).toMatch(/^[a-z]+(-[a-z]+)*$/);
  });

  for (const benchmark of benchmarks) {
    it(
      `${benchmark.name} runs, is well formed and passes its correctness checks`,
      { timeout: 240_000 },
      async () => {
        const result = await runBenchmark(benchmark, { smoke: true, log: () => {} });
        expect(result.name).toBe(benchmark.name);
        expect(result.smoke).toBe(true);
        expect(result.machine.cores).toBeGreaterThan(0);
        expect(result.loadAverage.start).toHaveLength(3);
        expect(result.wallMs).toBeGreaterThan(0);
        expect(result.checks.length).toBeGreaterThan(0);
        expect(result.checks.filter((c) => !c.passed)).toEqual([]);
        expect(result.goals.length).toBeGreaterThan(0);
        for (const g of result.goals) {
          expect(g.measured === null || Number.isFinite(g.measured)).toBe(true);
          expect(Number.isFinite(g.target)).toBe(true);
          expect(g.met).toBe(
            g.measured !== null &&
              (g.kind === 'min' ? g.measured >= g.target : g.measured <= g.target),
          );
        }
        expect(result.summary.length).toBeGreaterThan(0);
        for (const [label, value] of result.summary) {
          expect(label.length).toBeGreaterThan(0);
          expect(value.length).toBeGreaterThan(0);
        }
        // Results are written as JSON: they must survive a round trip.
        expect(JSON.parse(JSON.stringify(result)).name).toBe(benchmark.name);
      },
    );
  }
});
