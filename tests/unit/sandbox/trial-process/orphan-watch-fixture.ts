import { spawn } from 'node:child_process';
import { watchForOrphaning } from '@sandbox/trial-process/orphan-watch.ts';

/**
 * Run by orphan-watch.test.ts. As `parent`: starts itself as `child` and waits to be killed. As
 * `child`: starts the orphan watch, prints its pid, then blocks its main thread for good, as a
 * kernel stuck at its heap limit can, so that only the watch's own thread can end it.
 */
if (process.argv[2] === 'child') {
  watchForOrphaning(200);
  process.stdout.write(`${process.pid}\n`, () => {
    for (;;) {
      // Blocks the main thread: no timer, no signal handler, no IPC runs here any more.
    }
  });
} else {
  spawn(process.execPath, [...process.execArgv, process.argv[1]!, 'child'], {
    stdio: ['ignore', 'inherit', 'inherit'],
  });
  setInterval(() => {}, 1000);
}
