import { availableParallelism } from 'node:os';
import { Tinypool } from 'tinypool';
import type { RoutineSlug } from '@shared/routines.ts';
import type { KernelDiagnostic } from '@shared/contracts/kernel-diagnostic.ts';
import type { TypeCheckOutcome } from '@sandbox/isolate/type-check.ts';
import { typeCheckerName } from '@sandbox/isolate/type-check-version.ts';
import type { TypeCheckTask } from '@sandbox/isolate/type-check-worker.ts';

export interface TypeCheckPoolOptions {
  /** Worker threads; default one fewer than the cores, at least 1 and at most 2. */
  threads?: number;
  /** A check still running after this long (queueing included) is cut off; default 30 s. */
  timeoutMs?: number;
  /** Heap limit of each thread in MB; a check that needs more is cut off; default 512. */
  heapMb?: number;
}

export interface TypeCheckPool {
  /** Type-checks a kernel in a worker thread; the calling thread's event loop stays free. */
  check(
    source: string,
    routine: RoutineSlug,
    options?: { maxSourceBytes?: number },
  ): Promise<TypeCheckOutcome>;
  /** Starts every thread and has each parse the lib files (the first check's ~800 ms). */
  warm(): Promise<void>;
  /** Ends the threads; checks still waiting are refused. */
  close(): Promise<void>;
}

/** A well-typed kernel is checked in 30–80 ms once warm (stack.md §6); 30 s is far above it. */
export const defaultTypeCheckTimeoutMs = 30_000;
const defaultHeapMb = 512;

/**
 * The thread's entry file. From source (tsx, vitest) this module is a `.ts` file and the
 * thread loads the TypeScript entry through a small tsx bootstrap; in the built server this
 * code is bundled into dist/server/*.js, beside the bundled type-check-worker.js.
 */
export function typeCheckWorkerUrl(moduleUrl: string = import.meta.url): URL {
  return moduleUrl.endsWith('.ts')
    ? new URL('./type-check-worker-tsx.mjs', moduleUrl)
    : new URL('./type-check-worker.js', moduleUrl);
}

function defaultThreads(): number {
  return Math.min(2, Math.max(1, availableParallelism() - 1));
}

/** The answer when the check was cut off: one diagnostic at the top of the kernel. */
function cutOff(reason: string, started: number): TypeCheckOutcome {
  const diagnostic: KernelDiagnostic = {
    line: 1,
    column: 1,
    code: 'type-check-cut-off',
    message: reason,
    file: 'kernel',
  };
  return {
    diagnostics: [diagnostic],
    ms: performance.now() - started,
    checkedWith: typeCheckerName,
  };
}

function errorCode(error: unknown): string | undefined {
  if (!(error instanceof Error)) return undefined;
  return error.name === 'AbortError' ? 'AbortError' : (error as Error & { code?: string }).code;
}

/**
 * A small pool of worker threads (tinypool) that run `typeCheckKernel`. Threads start on the
 * first check (or `warm`) and keep their parsed lib files; an idle thread does not keep the
 * process alive. A check that runs past the time limit or the heap limit ends its thread and
 * answers with a diagnostic, never a hung or failed request.
 */
export function createTypeCheckPool(options: TypeCheckPoolOptions = {}): TypeCheckPool {
  const threads = options.threads ?? defaultThreads();
  const timeoutMs = options.timeoutMs ?? defaultTypeCheckTimeoutMs;
  const pool = new Tinypool({
    filename: typeCheckWorkerUrl().href,
    minThreads: threads,
    maxThreads: threads,
    resourceLimits: { maxOldGenerationSizeMb: options.heapMb ?? defaultHeapMb },
  });

  async function check(
    source: string,
    routine: RoutineSlug,
    limits: { maxSourceBytes?: number } = {},
  ): Promise<TypeCheckOutcome> {
    const started = performance.now();
    const task: TypeCheckTask = { source, routine, ...limits };
    try {
      return (await pool.run(task, {
        signal: AbortSignal.timeout(timeoutMs),
      })) as TypeCheckOutcome;
    } catch (error) {
      const code = errorCode(error);
      if (code === 'AbortError') {
        return cutOff(
          `The type check did not finish within ${timeoutMs / 1000} s and was stopped; ` +
            'deeply nested or recursive types can keep the checker busy that long.',
          started,
        );
      }
      if (code === 'ERR_WORKER_OUT_OF_MEMORY') {
        return cutOff(
          'The type check ran out of memory and was stopped; ' +
            'deeply nested or recursive types can make the checker need that much.',
          started,
        );
      }
      throw error;
    }
  }

  return {
    check,
    async warm() {
      const tiny = 'export {};';
      await Promise.all(Array.from({ length: threads }, () => check(tiny, 'back-substitution')));
    },
    close: () => pool.destroy(),
  };
}
