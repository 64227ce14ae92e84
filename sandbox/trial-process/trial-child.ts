import { runTrial } from '../trial.ts';
import { type ChildMessage, isParentMessage } from './trial-messages.ts';
import { watchForOrphaning } from './orphan-watch.ts';

/**
 * The trial process's entry point, started by trial-process.ts with an IPC channel. It runs
 * the trials it is sent, one at a time, and reports each one's progress and report; the parent
 * owns its life: it kills the process (and its group) when a trial overruns its deadline, and
 * otherwise keeps it for the next trial (trial-process.ts).
 */
if (!process.send) {
  throw new Error(
    'trial-child.ts runs as a child process with an IPC channel (see trial-process.ts)',
  );
}
const send = (message: ChildMessage) => process.send!(message);

watchForOrphaning();
// The parent closed the channel: it has the report, or it is stopping. Nothing is left to do.
process.on('disconnect', () => process.exit(0));

let queue: Promise<void> = Promise.resolve();
process.on('message', (message: unknown) => {
  if (!isParentMessage(message)) return;
  queue = queue.then(async () => {
    send({ kind: 'started' });
    try {
      const report = await runTrial({
        ...message.input,
        onProgress: (progress) => send({ kind: 'progress', progress }),
      });
      send({ kind: 'report', report });
    } catch (err) {
      const error = err instanceof Error ? err : new Error(String(err));
      send({
        kind: 'error',
        message: error.message,
        ...(error.stack ? { stack: error.stack } : {}),
      });
    }
  });
});
// Loaded: the parent may send a trial now.
send({ kind: 'ready' });
