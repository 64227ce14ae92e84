import os from 'node:os';
import { machineFingerprint, type MachineFingerprint } from '@sandbox/timing/machine.ts';

/**
 * What every benchmark module exports and returns. A benchmark measures ratios side by side in
 * one process; its correctness checks make sure that nothing broken is timed, and its goals say
 * what it set out to show (met or not, with the measured figure).
 */

export interface BenchmarkOptions {
  /** Tiny sizes, one repeat: proves the code runs and the checks pass, measures nothing. */
  smoke: boolean;
  /** Progress lines for the console (the runner prints them; tests pass a no-op). */
  log: (line: string) => void;
}

export interface BenchmarkCheck {
  name: string;
  passed: boolean;
  detail: string;
}

export interface BenchmarkGoal {
  goal: string;
  /** The measured figure, in the unit of the goal; null when it could not be measured. */
  measured: number | null;
  target: number;
  /** 'min': measured ≥ target; 'max': measured ≤ target. */
  kind: 'min' | 'max';
  met: boolean;
  /** How the figure was obtained, or why it is missing. */
  note?: string;
}

export interface BenchmarkOutcome {
  checks: BenchmarkCheck[];
  goals: BenchmarkGoal[];
  /** Lines for the summary table: label and value. */
  summary: [string, string][];
  /** The measurements themselves, in the benchmark's own shape. */
  data: unknown;
}

export interface BenchmarkResult extends BenchmarkOutcome {
  name: string;
  description: string;
  smoke: boolean;
  startedAt: string;
  wallMs: number;
  machine: MachineFingerprint;
  /** os.loadavg() at the start and the end: others share the machine (see README). */
  loadAverage: { start: number[]; end: number[] };
}

export interface Benchmark {
  name: string;
  description: string;
  run(options: BenchmarkOptions): Promise<BenchmarkOutcome>;
}

/** A goal with `met` worked out; a missing figure never counts as met. */
export function goal(
  text: string,
  measured: number | null,
  kind: 'min' | 'max',
  target: number,
  note?: string,
): BenchmarkGoal {
  const met =
    measured !== null &&
    Number.isFinite(measured) &&
    (kind === 'min' ? measured >= target : measured <= target);
  return { goal: text, measured, target, kind, met, ...(note ? { note } : {}) };
}

/** Runs one benchmark and wraps its outcome with the machine, the load and the wall time. */
export async function runBenchmark(
  benchmark: Benchmark,
  options: BenchmarkOptions,
): Promise<BenchmarkResult> {
  const startedAt = new Date().toISOString();
  const start = os.loadavg();
  const t0 = performance.now();
  const outcome = await benchmark.run(options);
  return {
    name: benchmark.name,
    description: benchmark.description,
    smoke: options.smoke,
    startedAt,
    wallMs: performance.now() - t0,
    machine: machineFingerprint(),
    loadAverage: { start, end: os.loadavg() },
    ...outcome,
  };
}
