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

/** A kernel that holds resources (an isolate) to free after its block. */
export interface DisposableTimedKernel<TInput> extends TimedKernel<TInput> {
  dispose(): void;
}

/** A fresh kernel (a new isolate of the same code), or why it could not be started. */
export type FreshKernel<TInput> =
  | { ok: true; kernel: DisposableTimedKernel<TInput> }
  | { ok: false; status: CallStatus; message: string };

/** A source of fresh kernels: each block of a timing run times a new one (interleaved.ts). */
export interface FreshKernels<TInput> {
  fresh(): Promise<FreshKernel<TInput>>;
}

/** One kernel used by every block, or a fresh kernel per block. */
export type KernelSupply<TInput> = TimedKernel<TInput> | FreshKernels<TInput>;

/** The first failed call at one size; timing of that size stops there (in every later block). */
export interface TimingFailure {
  kernel: KernelRole;
  phase: 'warm-up' | 'timing';
  status: CallStatus;
  message: string;
  /** 0-based block in which it failed (absent: not known). */
  block?: number;
}
