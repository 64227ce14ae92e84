import { loadEnv } from './config/env.ts';
import { createLogger } from './http/logger.ts';
import { startWorkerProcess } from './jobs/worker-process.ts';

// The trial worker: `npm run worker` (node --no-node-snapshot --no-concurrent-recompilation, see
// stack.md). Run one per quiet core; each runs one trial at a time.
const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL).child({ process: 'worker' });
const worker = await startWorkerProcess(env, logger);

// SIGTERM/SIGINT: finish the trial in hand if it ends within the grace period, else abandon it
// to pg-boss, which retries it after its retry delay (worker-process.ts). A worker killed
// outright (SIGKILL, power loss) keeps its job active until the job's expiry; pg-boss's
// maintenance then hands it to another worker, which starts the trial afresh.
let stopping = false;
function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'worker stopping');
  worker.stop().then(
    () => process.exit(0),
    (err: unknown) => {
      logger.error({ err }, 'worker did not stop cleanly');
      process.exit(1);
    },
  );
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
// pg-boss 10 reports a job's end to the database without awaiting it: when the database is gone
// at that moment the promise rejects with nobody to catch it, which on Node 20 would end the
// process. The job then stays active until its expiry, when pg-boss retries it; keep working.
process.on('unhandledRejection', (reason: unknown) => {
  logger.error({ err: reason }, 'unhandled rejection; the worker carries on');
});
