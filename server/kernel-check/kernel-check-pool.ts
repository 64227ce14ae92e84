import type { RoutineSlug } from '@shared/routines.ts';
import type { TypeCheckOutcome } from '@sandbox/isolate/type-check.ts';
import { createTypeCheckPool, type TypeCheckPool } from '@sandbox/isolate/type-check-pool.ts';

/**
 * The process's one pool of type-check threads, created on the first submission (or by
 * `warmKernelCheck` when the web server starts) and closed when the process shuts down.
 */
let shared: TypeCheckPool | null = null;

function pool(): TypeCheckPool {
  shared ??= createTypeCheckPool();
  return shared;
}

/**
 * Type-checks a submitted kernel against its routine's contract off the request's thread, so
 * other requests are answered while it runs (sandbox/isolate/type-check-pool.ts).
 */
export function checkSubmittedKernel(
  source: string,
  routine: RoutineSlug,
): Promise<TypeCheckOutcome> {
  return pool().check(source, routine);
}

/** Starts the threads and parses the lib files ahead of the first submission. */
export function warmKernelCheck(): Promise<void> {
  return pool().warm();
}

export async function closeKernelCheck(): Promise<void> {
  const closing = shared;
  shared = null;
  await closing?.close();
}
