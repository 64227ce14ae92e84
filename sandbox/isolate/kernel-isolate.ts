import ivm from 'isolated-vm';
import type { CallPlan, Envelope } from '@sandbox/isolate/in-isolate-prelude.ts';
import { inIsolatePrelude } from '@sandbox/isolate/in-isolate-prelude.ts';
import {
  classifyIsolateError,
  outOfMemoryMessage,
  type IsolateFailure,
} from '@sandbox/isolate/isolate-errors.ts';
import type { KernelLimits } from '@sandbox/isolate/limits.ts';
import { truncateMessage } from '@sandbox/isolate/limits.ts';

type Fn = (...args: unknown[]) => Envelope;

/** One isolate holding one loaded kernel. Its methods reject with isolated-vm's errors. */
export interface KernelSession {
  readonly isolate: ivm.Isolate;
  /** Copies the inputs in, calls the kernel, copies the envelope out. */
  call(inputs: unknown[], plan: CallPlan): Promise<Envelope>;
  /** Copies the inputs in and keeps `repeat` fresh copies of them inside, for `runStaged`. */
  stage(inputs: unknown[], repeat: number): Promise<Envelope>;
  /**
   * Calls the kernel on each staged copy; only the status comes out, with the isolate's wall
   * time for the whole step (isolated-vm's `wallTime` delta, ns).
   */
  runStaged(timeoutMs: number): Promise<Envelope & { wallNs: bigint }>;
  /** Copies out the result of timed call `k` of the last `runStaged`, checked like a call's. */
  stagedResult(plan: CallPlan, k: number): Promise<Envelope>;
  dispose(): void;
}

export type SessionStart =
  | { ok: true; session: KernelSession }
  | { ok: false; status: IsolateFailure['status'] | 'invalid-output'; message: string };

/** The envelope as copied out, with its message made safe to show. */
function checked(envelope: Envelope): Envelope {
  return typeof envelope.m === 'string'
    ? { ...envelope, m: truncateMessage(envelope.m) }
    : envelope;
}

function disposeQuietly(isolate: ivm.Isolate): void {
  if (!isolate.isDisposed) isolate.dispose();
}

/**
 * Starts a fresh isolate with the given limits, runs the prelude, then the kernel's compiled
 * CommonJS module wrapped as a function of (module, exports), all under the load timeout.
 * The isolate gets no host function, no Reference into the host and no module loader:
 * only ES2022 built-ins. A failure of the module (it throws, loops, runs out of memory or
 * lacks the export) comes back as a failure, with the isolate disposed.
 */
export async function startKernelSession(
  js: string,
  exportName: string,
  limits: KernelLimits,
): Promise<SessionStart> {
  const isolate = new ivm.Isolate({ memoryLimit: limits.memoryMb });
  const timeout = limits.loadTimeoutMs;
  try {
    // Everything before the module's body runs only the engine's own code (the prelude, and a
    // function expression wrapping the kernel), so it runs synchronously on this thread: each
    // asynchronous step is a hand-over to isolated-vm's thread pool and back, which on a busy
    // machine cost more than the work itself (benchmarks/README.md, sandbox-overhead).
    const context = isolate.createContextSync();
    const api = context.evalSync(inIsolatePrelude, { reference: true, timeout }) as ivm.Reference<
      Fn[]
    >;
    const [load, call, stage, runStaged, stagedResult] = [0, 1, 2, 3, 4].map((i) =>
      api.getSync(i, { reference: true }),
    ) as ivm.Reference<Fn>[];
    const script = isolate.compileScriptSync(
      `(function (module, exports) { "use strict";\n${js}\n})`,
      { filename: 'kernel.js' },
    );
    const factory = script.runSync(context, { reference: true, timeout }) as ivm.Reference<Fn>;
    // The module's body is the kernel's code: it runs asynchronously under the load timeout.
    const loaded: Envelope = await load!.apply(undefined, [factory.derefInto(), exportName], {
      timeout,
      result: { copy: true },
    });
    if (loaded.s !== 'ok') {
      disposeQuietly(isolate);
      if (loaded.s === 'oom')
        return { ok: false, status: 'out-of-memory', message: outOfMemoryMessage(limits, 'load') };
      if (loaded.s === 'missing')
        return { ok: false, status: 'invalid-output', message: `${loaded.m ?? ''}.` };
      const message = truncateMessage(`The kernel's module threw while loading: ${loaded.m ?? ''}`);
      return { ok: false, status: 'threw', message };
    }
    const session: KernelSession = {
      isolate,
      call: (inputs, plan) =>
        call!
          .apply(
            undefined,
            [
              new ivm.ExternalCopy(inputs).copyInto({ release: true }),
              new ivm.ExternalCopy(plan).copyInto({ release: true }),
            ],
            {
              timeout: limits.callTimeoutMs,
              result: { copy: true },
            },
          )
          .then(checked),
      stage: (inputs, repeat) =>
        stage!.apply(
          undefined,
          [new ivm.ExternalCopy(inputs).copyInto({ release: true }), repeat],
          {
            timeout: limits.callTimeoutMs,
            result: { copy: true },
          },
        ),
      runStaged: async (timeoutMs) => {
        const before = isolate.wallTime;
        const hostBefore = process.hrtime.bigint();
        const envelope: Envelope = await runStaged!.apply(undefined, [], {
          timeout: timeoutMs,
          result: { copy: true },
        });
        const hostNs = process.hrtime.bigint() - hostBefore;
        // On a busy machine the host can resume before the isolate's thread has added the call
        // to its wall-time account, so the difference reads 0 (seen a few times in a hundred
        // trials at load ≈ 12). The host's own measurement, which also counts the hand-over to
        // the isolate's thread, is the honest fallback then.
        const isolateNs = isolate.wallTime - before;
        return { ...checked(envelope), wallNs: isolateNs > 0n ? isolateNs : hostNs };
      },
      stagedResult: (plan, k) =>
        stagedResult!
          .apply(undefined, [new ivm.ExternalCopy(plan).copyInto({ release: true }), k], {
            timeout: limits.callTimeoutMs,
            result: { copy: true },
          })
          .then(checked),
      dispose: () => disposeQuietly(isolate),
    };
    return { ok: true, session };
  } catch (e) {
    disposeQuietly(isolate);
    return { ok: false, ...classifyIsolateError(e, limits, 'load') };
  }
}
