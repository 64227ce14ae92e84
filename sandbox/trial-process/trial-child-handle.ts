import { type ChildProcess, fork } from 'node:child_process';
import { type TrialChildEntry } from './trial-child-entry.ts';
import { isChildMessage } from './trial-messages.ts';

const stderrTailChars = 2000;

/** A started trial process: whether it has loaded, the end of its stderr, how to kill it. */
export interface TrialChildHandle {
  process: ChildProcess;
  /** True once the process has sent `ready` (its modules are loaded). */
  isReady(): boolean;
  isAlive(): boolean;
  /** The last characters it wrote to stderr (also passed through to this process's stderr). */
  stderrTail(): string;
  /** SIGKILL to its whole process group. */
  kill(): void;
}

/**
 * Starts the trial process: its own process group (detached), so that one kill also reaches what
 * it started (esbuild's service, which compiles kernels); the structured clone algorithm on its
 * IPC channel; its JavaScript heap capped at `memoryMb`.
 */
export function spawnTrialChild(entry: TrialChildEntry, memoryMb: number): TrialChildHandle {
  const child = fork(entry.modulePath, [], {
    execArgv: [...entry.execArgv, `--max-old-space-size=${memoryMb}`],
    cwd: entry.cwd,
    serialization: 'advanced',
    detached: true,
    stdio: ['ignore', 'inherit', 'pipe', 'ipc'],
  });
  let ready = false;
  let tail = '';
  child.on('message', (message: unknown) => {
    if (isChildMessage(message) && message.kind === 'ready') ready = true;
  });
  child.stderr?.on('data', (chunk: Buffer) => {
    process.stderr.write(chunk);
    tail = (tail + chunk.toString()).slice(-stderrTailChars);
  });
  // Spawn failures also arrive as 'exit'; without a listener this event would be thrown.
  child.on('error', () => {});
  const isAlive = () => child.exitCode === null && child.signalCode === null;
  return {
    process: child,
    isReady: () => ready,
    isAlive,
    stderrTail: () => tail,
    kill() {
      if (child.pid === undefined || !isAlive()) return;
      try {
        process.kill(-child.pid, 'SIGKILL');
      } catch {
        // The group is gone already (ESRCH).
      }
    },
  };
}

/** Resolves when the process has exited (at once if it has), with its code and signal. */
export function childExited(
  child: ChildProcess,
): Promise<{ code: number | null; signal: NodeJS.Signals | null }> {
  if (child.exitCode !== null || child.signalCode !== null) {
    return Promise.resolve({ code: child.exitCode, signal: child.signalCode });
  }
  return new Promise((resolve) => child.once('exit', (code, signal) => resolve({ code, signal })));
}
