import type { CallStatus } from '@shared/routines.ts';

/**
 * What the timing code needs from a kernel runner: one timed call on one input. The runner (for
 * example an isolate holding the compiled kernel) measures the call itself and reports how it
 * ended; the timing code never sees the kernel's output.
 */

/** One timed call: its duration in ms (positive), or how it failed. */
export type TimedCall =
  { ok: true; ms: number } | { ok: false; status: CallStatus; message: string };

/** A kernel that can be called and timed on an input of type TInput (opaque to the timing code). */
export interface TimedKernel<TInput> {
  time(input: TInput): Promise<TimedCall>;
}

/** The two sides of a comparison. */
export type KernelRole = 'candidate' | 'incumbent';

/** The first failed call at one size; timing of that size stops there. */
export interface TimingFailure {
  kernel: KernelRole;
  phase: 'warm-up' | 'timing';
  status: CallStatus;
  message: string;
}
