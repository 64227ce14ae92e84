import type { Benchmark } from './benchmark.ts';
import { factorisationsBenchmark } from './factorisations.bench.ts';
import { sandboxOverheadBenchmark } from './sandbox-overhead.bench.ts';
import { serviceBenchmark } from './service.bench.ts';
import { timingCalibrationBenchmark } from './timing-calibration.bench.ts';
import { trialCostBenchmark } from './trial-cost.bench.ts';

/** Every benchmark, in the order `npm run bench` runs them. */
export const benchmarks: Benchmark[] = [
  factorisationsBenchmark,
  sandboxOverheadBenchmark,
  timingCalibrationBenchmark,
  trialCostBenchmark,
  serviceBenchmark,
];
