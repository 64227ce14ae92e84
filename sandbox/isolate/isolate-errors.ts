import type { KernelLimits } from '@sandbox/isolate/limits.ts';
import { truncateMessage } from '@sandbox/isolate/limits.ts';

export type IsolateFailureStatus = 'threw' | 'timeout' | 'out-of-memory';

export interface IsolateFailure {
  status: IsolateFailureStatus;
  message: string;
}

/** What was running when the isolate stopped: a kernel call, or the module's top level. */
export type IsolatePhase = 'call' | 'load';

/**
 * Maps an error thrown by isolated-vm on the host (not by the kernel: the prelude catches those)
 * to a call status. isolated-vm 5.0.4 says "Script execution timed out." for a timeout and
 * "Isolate was disposed during execution due to memory limit" for a heap overflow, after which
 * the isolate is disposed (stack.md §6).
 */
export function classifyIsolateError(
  error: unknown,
  limits: KernelLimits,
  phase: IsolatePhase,
): IsolateFailure {
  const text = error instanceof Error ? error.message : String(error);
  const what = phase === 'call' ? 'The kernel' : "The kernel's module top level";
  if (/timed out/i.test(text)) {
    const ms = phase === 'call' ? limits.callTimeoutMs : limits.loadTimeoutMs;
    return {
      status: 'timeout',
      message: `${what} ran longer than the ${ms} ms limit and was stopped.`,
    };
  }
  if (/memory limit|isolate is disposed/i.test(text)) {
    return { status: 'out-of-memory', message: outOfMemoryMessage(limits, phase) };
  }
  return { status: 'threw', message: truncateMessage(`The sandbox stopped the kernel: ${text}`) };
}

/** The message for a kernel that went over the isolate's memory limit. */
export function outOfMemoryMessage(limits: KernelLimits, phase: IsolatePhase): string {
  const what = phase === 'call' ? 'The kernel' : "The kernel's module top level";
  return `${what} went over the isolate's ${limits.memoryMb} MB memory limit.`;
}
