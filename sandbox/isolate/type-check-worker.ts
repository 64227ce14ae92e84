import type { RoutineSlug } from '@shared/routines.ts';
import { typeCheckKernel, type TypeCheckOutcome } from '@sandbox/isolate/type-check.ts';

/** What the main thread sends a type-check thread: plain data, so it crosses postMessage. */
export interface TypeCheckTask {
  source: string;
  routine: RoutineSlug;
  maxSourceBytes?: number;
}

/**
 * The entry point of a type-check thread (type-check-pool.ts loads this file in a worker
 * thread). The lib files parsed by the first task stay cached in the thread for the next ones.
 */
export default function runTypeCheckTask(task: TypeCheckTask): TypeCheckOutcome {
  const options = task.maxSourceBytes === undefined ? {} : { maxSourceBytes: task.maxSourceBytes };
  return typeCheckKernel(task.source, task.routine, options);
}
