import type { CallStatus, RoutineSlug } from '@shared/routines.ts';
import type { RoutineResult } from '@sandbox/contracts/routine-results.ts';
import { routineSignatures } from '@sandbox/contracts/routine-signatures.ts';
import { validateResult } from '@sandbox/contracts/validate-result.ts';
import type { Envelope } from '@sandbox/isolate/in-isolate-prelude.ts';
import { classifyIsolateError, outOfMemoryMessage } from '@sandbox/isolate/isolate-errors.ts';
import { startKernelSession, type KernelSession } from '@sandbox/isolate/kernel-isolate.ts';
import type { KernelLimits } from '@sandbox/isolate/limits.ts';
import {
  callPlan,
  kernelArguments,
  returnedValue,
  type CallArgs,
} from '@sandbox/isolate/transfer.ts';

export interface CallOutcome<T> {
  status: CallStatus;
  message?: string;
  /** Present, validated on the host, when status is 'ok'. */
  result?: T;
  /** Host wall-clock time of the whole call, copies in and out included. */
  ms: number;
}

type Failure = {
  status: 'threw' | 'timeout' | 'out-of-memory' | 'invalid-output' | 'non-finite';
  message: string;
};

export type TimeOutcome = { ok: true; ms: number } | ({ ok: false } & Failure);

export interface KernelInstance<R extends RoutineSlug = RoutineSlug> {
  readonly routine: R;
  /** Isolates started so far: 1 after loading, one more after each timeout or memory overflow. */
  readonly isolatesStarted: number;
  /** Runs the kernel once; every failure of the kernel is a status, never a rejection. */
  call(args: CallArgs): Promise<CallOutcome<RoutineResult<R>>>;
  /** Times `repeat` back-to-back calls on fresh copies; ms is per call. Results are not checked. */
  time(args: CallArgs, options?: { repeat?: number }): Promise<TimeOutcome>;
  /** Frees the isolate; later calls reject. */
  dispose(): void;
}

/** Maps an envelope's non-ok status to a call status and message. */
function envelopeFailure(envelope: Envelope, limits: KernelLimits): Failure {
  if (envelope.s === 'oom') {
    return { status: 'out-of-memory', message: outOfMemoryMessage(limits, 'call') };
  }
  if (envelope.s === 'threw') return { status: 'threw', message: envelope.m ?? '' };
  return { status: 'invalid-output', message: envelope.m ?? '' };
}

/**
 * Wraps a loaded session as a KernelInstance. Calls run one at a time (timing stages its
 * inputs and then runs them, with nothing in between). After a timeout or a memory overflow
 * the isolate is discarded and the next call starts a fresh one, reloading the module.
 */
export function createKernelInstance<R extends RoutineSlug>(
  routine: R,
  js: string,
  limits: KernelLimits,
  first: KernelSession,
): KernelInstance<R> {
  let session: KernelSession | null = first;
  let isolatesStarted = 1;
  let disposed = false;
  let queue: Promise<unknown> = Promise.resolve();
  const exportName = routineSignatures[routine].exportName;

  function serially<T>(task: () => Promise<T>): Promise<T> {
    if (disposed) return Promise.reject(new Error('This kernel instance has been disposed.'));
    const run = queue.then(task, task);
    queue = run.catch(() => undefined);
    return run;
  }

  function discard(): void {
    session?.dispose();
    session = null;
  }

  async function current(): Promise<KernelSession | Failure> {
    if (session) return session;
    isolatesStarted += 1;
    const started = await startKernelSession(js, exportName, limits);
    if (!started.ok) {
      return { status: started.status, message: `In a fresh isolate: ${started.message}` };
    }
    session = started.session;
    return session;
  }

  /** Runs one step in the current isolate, discarding it after a timeout or memory overflow. */
  async function guarded<T extends Envelope>(
    step: (s: KernelSession) => Promise<T>,
  ): Promise<T | Failure> {
    const s = await current();
    if ('status' in s) return s;
    try {
      const envelope = await step(s);
      if (envelope.s === 'oom') discard();
      return envelope;
    } catch (e) {
      discard();
      return classifyIsolateError(e, limits, 'call');
    }
  }

  async function runCall(
    args: CallArgs,
    inputs: unknown[],
  ): Promise<CallOutcome<RoutineResult<R>>> {
    const start = performance.now();
    const out = await guarded((s) => s.call(inputs, callPlan(routine, args.m, args.n)));
    const ms = performance.now() - start;
    if ('status' in out) return { ...out, ms };
    if (out.s !== 'ok') return { ...envelopeFailure(out, limits), ms };
    const valid = validateResult(routine, returnedValue(routine, out, args.m, args.n), args);
    if (!valid.ok) return { status: valid.status, message: valid.message, ms };
    return { status: 'ok', result: valid.result, ms };
  }

  // Timing uses the isolate's own wall clock (isolated-vm's `wallTime`): it counts only time
  // spent executing in the isolate, so the host's thread hand-over and promise scheduling stay
  // out, and `stage` has copied the inputs in beforehand. What remains besides the kernel is
  // entering the isolate (tens of µs), the same for every kernel; `repeat` spreads it when one
  // call is that short. The isolate itself has no high-resolution clock, only Date.now.
  async function runTimed(args: CallArgs, inputs: unknown[], repeat: number): Promise<TimeOutcome> {
    const staged = await guarded((s) => s.stage(inputs, repeat));
    if ('status' in staged) return { ok: false, ...staged };
    if (staged.s !== 'ok') return { ok: false, ...envelopeFailure(staged, limits) };
    const out = await guarded((s) => s.runStaged(limits.callTimeoutMs * repeat));
    if ('status' in out) return { ok: false, ...out };
    if (out.s !== 'ok') return { ok: false, ...envelopeFailure(out, limits) };
    const cheated = await checkTimedResults(args, repeat);
    if (cheated) return { ok: false, ...cheated };
    return { ok: true, ms: Number(out.wallNs) / 1e6 / repeat };
  }

  // A kernel can tell a timed call from a checked one (by the clock, or by counting calls) and
  // skip its work while timed; so each timed call's result is copied out after the timed step
  // and checked on the host like a call's. It catches a wrong shape, type or non-finite value,
  // not a well-formed but wrong factorisation.
  async function checkTimedResults(args: CallArgs, repeat: number): Promise<Failure | null> {
    const plan = callPlan(routine, args.m, args.n);
    for (let k = 0; k < repeat; k++) {
      const out = await guarded((s) => s.stagedResult(plan, k));
      let failure: Failure | null = null;
      if ('status' in out) failure = out;
      else if (out.s !== 'ok') failure = envelopeFailure(out, limits);
      else {
        const valid = validateResult(routine, returnedValue(routine, out, args.m, args.n), args);
        if (!valid.ok) failure = valid;
      }
      if (failure) return { status: failure.status, message: `While timed: ${failure.message}` };
    }
    return null;
  }

  return {
    routine,
    get isolatesStarted() {
      return isolatesStarted;
    },
    call(args) {
      const inputs = kernelArguments(routine, args);
      return serially(() => runCall(args, inputs));
    },
    time(args, options = {}) {
      const inputs = kernelArguments(routine, args);
      const repeat = options.repeat ?? 1;
      if (!Number.isInteger(repeat) || repeat < 1) {
        throw new RangeError(`options.repeat must be a positive integer, got ${repeat}`);
      }
      return serially(() => runTimed(args, inputs, repeat));
    },
    dispose() {
      disposed = true;
      discard();
    },
  };
}
