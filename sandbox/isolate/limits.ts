import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';

/** The limits one loaded kernel runs under. */
export interface KernelLimits {
  /** The isolate's heap limit in MB (isolated-vm's `memoryLimit`; its minimum is 8). */
  memoryMb: number;
  /** Wall-clock limit for one kernel call, in ms. */
  callTimeoutMs: number;
  /** Limit for the module's top level (and each scripted set-up step), in ms. */
  loadTimeoutMs: number;
  /** The largest kernel source accepted, in UTF-8 bytes. */
  maxSourceBytes: number;
}

/**
 * Defaults: 128 MB holds a few copies of a 2048×2048 matrix (32 MB each); 10 s is far above
 * any sound kernel at the sizes a trial uses, yet ends an endless loop quickly (common practice).
 */
export const defaultKernelLimits: Readonly<KernelLimits> = {
  memoryMb: 128,
  callTimeoutMs: 10_000,
  loadTimeoutMs: 2_000,
  maxSourceBytes: 200_000,
};

/** Messages from inside the isolate (thrown values) are cut to this many characters. */
export const maxMessageChars = 500;

/** Fills in defaults; throws RangeError naming a limit that is not a positive number. */
export function resolveLimits(limits: Partial<KernelLimits> = {}): KernelLimits {
  const resolved = { ...defaultKernelLimits, ...limits };
  for (const [name, value] of Object.entries(resolved)) {
    if (!Number.isFinite(value) || value <= 0) {
      throw new RangeError(`limits.${name} must be a positive number, got ${value}`);
    }
  }
  if (resolved.memoryMb < 8) {
    throw new RangeError(`limits.memoryMb must be at least 8, got ${resolved.memoryMb}`);
  }
  return resolved;
}

/** A diagnostic refusing a source above `maxBytes` UTF-8 bytes, or null when it fits. */
export function sourceSizeDiagnostic(source: string, maxBytes: number): KernelDiagnostic | null {
  const bytes = new TextEncoder().encode(source).length;
  if (bytes <= maxBytes) return null;
  return {
    line: 1,
    column: 1,
    code: 'source-too-large',
    message: `The kernel source is ${bytes} bytes; the limit is ${maxBytes} bytes.`,
    file: 'kernel',
  };
}

/** Cuts a message to `maxMessageChars`, marking the cut. */
export function truncateMessage(message: string): string {
  return message.length <= maxMessageChars ? message : `${message.slice(0, maxMessageChars)}…`;
}
