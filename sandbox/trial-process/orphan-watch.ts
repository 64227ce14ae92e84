import { Worker } from 'node:worker_threads';

/**
 * The watch runs on a thread of its own because a kernel stuck at its isolate's heap limit can
 * hold up the main thread too (tests/hardening/isolate-hang.test.ts): every `everyMs` it reads the
 * parent's pid and, once the parent has gone (the process was handed to another parent), kills
 * the whole process. Plain JavaScript, since the thread starts from source text.
 */
const watchSource = `
const { workerData } = require('node:worker_threads');
const timer = setInterval(() => {
  if (process.ppid !== workerData.parentPid) process.kill(process.pid, 'SIGKILL');
}, workerData.everyMs);
`;

/**
 * Ends this process when its parent dies, even if the main thread is stuck: a worker killed
 * outright must not leave a trial process spinning with no one to stop it. The thread is
 * unref'd, so it never keeps the process alive by itself.
 */
export function watchForOrphaning(everyMs = 1000): void {
  const parentPid = process.ppid;
  const watch = new Worker(watchSource, { eval: true, workerData: { parentPid, everyMs } });
  watch.unref();
}
