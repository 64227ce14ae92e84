import { performance } from 'node:perf_hooks';
import type { TrialReport } from '@shared/trial-report.ts';
import type { TrialInput, TrialProgress } from '../trial.ts';
import { readResidentMb } from './resident-memory.ts';
import { stoppedTrialReport } from './stopped-trial-report.ts';
import { childExited, spawnTrialChild, type TrialChildHandle } from './trial-child-handle.ts';
import { type TrialChildEntry, resolveTrialChildEntry } from './trial-child-entry.ts';
import { isChildMessage, type ParentMessage } from './trial-messages.ts';
import { deathMessage, whereItStood } from './trial-stop-messages.ts';

/** The limits of the process trials run in (TRIAL_DEADLINE_SECONDS, TRIAL_PROCESS_MEMORY_MB). */
export interface TrialProcessLimits {
  /** Wall-clock limit for one trial, from handing it to the process to its report, in ms. */
  deadlineMs: number;
  /** The process's memory cap in MB: its resident set, and its JavaScript heap. */
  memoryMb: number;
}

export interface TrialProcessOptions extends TrialProcessLimits {
  /** Default: the entry next to this module (trial-child-entry.ts). */
  entry?: TrialChildEntry;
  /** How long a new process may take to load before it counts as a fault, in ms (default 120 s). */
  startupTimeoutMs?: number;
  /** How often the process's resident memory is read during a trial, in ms (default 500). */
  memoryCheckMs?: number;
  /** Told each new process's pid. */
  onSpawn?: (pid: number) => void;
  /**
   * Start a fresh process as soon as one has been killed or has died, so that the next trial
   * does not wait for it to load (a worker's choice; a single trial does without).
   */
  keepWarm?: boolean;
}

/**
 * A fault of the harness, not of a kernel: the trial process could not start, runTrial threw in
 * it, or the process was closed during the trial. The caller treats it as runTrial throwing (the
 * worker's job is retried).
 */
export class TrialProcessFault extends Error {
  override name = 'TrialProcessFault';
}

export interface TrialProcess {
  /** Runs one trial in the process (starting one if none is alive); one trial at a time. */
  run(input: TrialInput): Promise<TrialReport>;
  /** Starts the process now, so that the next trial does not wait for it to load. */
  warm(): void;
  /** Ends the process; a trial still running rejects with TrialProcessFault. */
  close(): Promise<void>;
}

/** How long a closed process may take to exit before it is killed. */
const exitGraceMs = 2000;
/** Loading the engine and TypeScript takes 1–2 s on a quiet machine; far more under load. */
const defaultStartupTimeoutMs = 120_000;

/**
 * Runs trials (runTrial) in a child process, so that a kernel which neither its call timeout nor
 * Isolate.dispose() can stop (isolated-vm 5.0.4, tests/hardening/isolate-hang.test.ts) costs one
 * process and not the worker. The process is kept from one trial to the next (it takes seconds
 * to load the engine and TypeScript) and replaced only after it was killed or died.
 *
 * The input goes over IPC whole, minus onProgress, with the structured clone algorithm, so its
 * Float64Arrays survive; progress comes back to `onProgress`. When a trial overruns `deadlineMs`,
 * the process grows past `memoryMb`, or it dies (a signal, out of memory, an exit without a
 * report), its process group is killed with SIGKILL and the trial ends as trial-failed with a
 * message saying what stopped it and where the trial stood. Like runTrial, `run` never rejects
 * for a kernel's sake; it rejects with TrialProcessFault for faults of the harness.
 */
export function createTrialProcess(options: TrialProcessOptions): TrialProcess {
  let entry = options.entry;
  let current: TrialChildHandle | null = null;
  let busy = false;
  let closing = false;

  const live = (): TrialChildHandle => {
    if (current?.isAlive()) return current;
    entry ??= resolveTrialChildEntry();
    const handle = spawnTrialChild(entry, options.memoryMb);
    handle.process.once('spawn', () => options.onSpawn?.(handle.process.pid!));
    handle.process.once('exit', () => {
      if (current === handle) current = null;
    });
    current = handle;
    return handle;
  };

  return {
    async run(input) {
      if (busy) throw new TrialProcessFault('the trial process runs one trial at a time');
      if (closing) throw new TrialProcessFault('the trial process was closed');
      busy = true;
      try {
        const handle = live();
        const report = await runOne(handle, input, options, () => closing);
        if (options.keepWarm && !closing) live();
        return report;
      } finally {
        busy = false;
      }
    },
    warm() {
      if (!closing) live();
    },
    async close() {
      closing = true;
      const handle = current;
      if (!handle) return;
      if (busy) handle.kill();
      else if (handle.process.connected) handle.process.disconnect();
      const timer = setTimeout(() => handle.kill(), exitGraceMs);
      await childExited(handle.process);
      clearTimeout(timer);
    },
  };
}

/**
 * One trial in `handle`'s process: waits for the process to load (startupTimeoutMs), sends the
 * input, and ends with the report or the process's end. The deadline and the memory watch run
 * from sending the input, so loading the engine does not count against the trial.
 */
function runOne(
  handle: TrialChildHandle,
  input: TrialInput,
  options: TrialProcessOptions,
  isClosing: () => boolean,
): Promise<TrialReport> {
  const { onProgress, ...data } = input;
  const child = handle.process;
  let startedAt = new Date();
  let t0 = performance.now();

  return new Promise<TrialReport>((resolve, reject) => {
    let began = false;
    let lastProgress: TrialProgress | null = null;
    let stoppedBecause: string | null = null;
    let deadline: NodeJS.Timeout | undefined;
    let memoryWatch: NodeJS.Timeout | undefined;

    const stop = (reason: string) => {
      stoppedBecause ??= reason;
      handle.kill();
    };
    const startup = setTimeout(() => {
      if (!handle.isReady()) stop('start-up');
    }, options.startupTimeoutMs ?? defaultStartupTimeoutMs);
    const send = () => {
      if (deadline) return;
      clearTimeout(startup);
      startedAt = new Date();
      t0 = performance.now();
      deadline = setTimeout(() => {
        const seconds = Math.round(options.deadlineMs / 1000);
        stop(
          `the trial was stopped after ${seconds} s, its time limit: a kernel did not return and could not be interrupted`,
        );
      }, options.deadlineMs);
      memoryWatch = setInterval(() => {
        const mb = child.pid === undefined ? null : readResidentMb(child.pid);
        if (mb !== null && mb > options.memoryMb) {
          stop(
            `the trial was stopped when its process held ${Math.round(mb)} MB, above its ${options.memoryMb} MB cap: a kernel's memory grew past what its isolate's limit could stop`,
          );
        }
      }, options.memoryCheckMs ?? 500);
      const message: ParentMessage = { kind: 'run', input: data };
      // A failed send shows up as the process's exit, handled below.
      child.send(message, () => {});
    };

    const settle = (end: () => void) => {
      clearTimeout(startup);
      clearTimeout(deadline);
      clearInterval(memoryWatch);
      child.off('message', onMessage);
      child.off('exit', onExit);
      child.off('error', onError);
      end();
    };
    function onMessage(message: unknown) {
      if (!isChildMessage(message)) return;
      if (message.kind === 'ready') send();
      else if (message.kind === 'started') began = true;
      else if (message.kind === 'progress') {
        lastProgress = message.progress;
        onProgress?.(message.progress);
      } else if (message.kind === 'report') settle(() => resolve(message.report));
      else {
        const fault = new TrialProcessFault(`the trial threw in its process: ${message.message}`);
        if (message.stack) fault.stack = message.stack;
        settle(() => reject(fault));
      }
    }
    function onExit(code: number | null, signal: NodeJS.Signals | null) {
      const fault = (message: string) => settle(() => reject(new TrialProcessFault(message)));
      if (isClosing()) return fault('the trial process was closed during the trial');
      if (!began) {
        const tail = handle.stderrTail().trim();
        const how =
          stoppedBecause === 'start-up'
            ? `it did not load within ${options.startupTimeoutMs ?? defaultStartupTimeoutMs} ms`
            : (signal ?? `code ${code}`);
        return fault(
          `the trial process ended before the trial began (${how})${tail ? `: ${tail}` : ''}`,
        );
      }
      const why =
        stoppedBecause ?? deathMessage(code, signal, handle.stderrTail(), options.memoryMb);
      const message = `${why}${whereItStood(lastProgress)}`;
      const elapsedMs = performance.now() - t0;
      settle(() => resolve(stoppedTrialReport(data, startedAt, elapsedMs, message)));
    }
    function onError(err: Error) {
      if (child.pid !== undefined) return;
      settle(() =>
        reject(new TrialProcessFault(`the trial process could not start: ${err.message}`)),
      );
    }

    child.on('message', onMessage);
    child.on('exit', onExit);
    child.on('error', onError);
    if (handle.isReady()) send();
  });
}
