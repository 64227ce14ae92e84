import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { fileURLToPath } from 'node:url';
import { loadResultSchema, type LoadResult, type LoadSpec } from './load-spec.ts';

/**
 * The processes the service benchmark starts: the app (server/main.ts), trial workers
 * (server/worker.ts, as `npm run worker` runs them) and the load client. Each is one Node
 * process (`node --import tsx`, no npm or shell in between) so that its pid is the one stopped.
 */

const root = fileURLToPath(new URL('../../', import.meta.url));
/** The flags of `npm run worker` (isolated-vm on Node 20, and steady optimisation in isolates). */
const engineFlags = ['--no-node-snapshot', '--no-concurrent-recompilation'];

export interface StartedProcess {
  name: string;
  pid: number;
  /** Last lines of stderr (and stdout, when piped), for error messages. */
  tail(): string;
  /** CPU time (user + system) the process has used so far, ms; null where /proc is missing. */
  cpuMs(): number | null;
  /** SIGTERM, then SIGKILL after `graceMs`; resolves once the process has exited. */
  stop(graceMs?: number): Promise<void>;
}

/** Linux's USER_HZ, the unit of /proc/<pid>/stat's times: 100 on every common build (proc(5)). */
const TICKS_PER_SECOND = 100;

function cpuMsOf(pid: number): number | null {
  try {
    // proc(5): fields 14 and 15 are utime and stime; the name (field 2) may hold spaces, so
    // count from the closing parenthesis.
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return ((Number(fields[11]) + Number(fields[12])) / TICKS_PER_SECOND) * 1000;
  } catch {
    return null;
  }
}

function startNode(
  name: string,
  args: string[],
  env: Record<string, string>,
  onLine?: (line: string) => void,
): StartedProcess & { child: ChildProcess; exited: Promise<number | null> } {
  const child = spawn(process.execPath, args, {
    cwd: root,
    env: { ...process.env, ...env },
    // stdout is read only when someone needs its lines; otherwise it goes nowhere, so that the
    // app's request log costs the app what it costs in production and nothing here.
    stdio: ['ignore', onLine ? 'pipe' : 'ignore', 'pipe'],
  });
  const lines: string[] = [];
  const keep = (chunk: Buffer) => {
    for (const line of chunk.toString('utf8').split('\n')) {
      if (line.trim() === '') continue;
      lines.push(line);
      if (lines.length > 40) lines.shift();
      onLine?.(line);
    }
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  const exited = new Promise<number | null>((resolve) => {
    if (child.exitCode !== null) resolve(child.exitCode);
    else child.once('exit', (code) => resolve(code));
  });
  return {
    name,
    child,
    pid: child.pid ?? -1,
    exited,
    tail: () => lines.join('\n'),
    cpuMs: () => cpuMsOf(child.pid ?? -1),
    async stop(graceMs = 15_000) {
      if (child.exitCode !== null || child.signalCode !== null) return;
      child.kill('SIGTERM');
      const timer = setTimeout(() => child.kill('SIGKILL'), graceMs);
      await exited;
      clearTimeout(timer);
    },
  };
}

/** The first port of the range on which 127.0.0.1 accepts a listener now. */
export async function freePort(from: number, to: number): Promise<number> {
  for (let port = from; port <= to; port++) {
    const free = await new Promise<boolean>((resolve) => {
      const probe = createServer();
      probe.once('error', () => resolve(false));
      probe.listen(port, '127.0.0.1', () => probe.close(() => resolve(true)));
    });
    if (free) return port;
  }
  throw new Error(`no free port in ${from}–${to}`);
}

async function waitFor(
  what: string,
  ready: () => Promise<boolean>,
  exited: Promise<number | null>,
  tail: () => string,
  timeoutMs: number,
): Promise<void> {
  let gone: number | null | undefined;
  void exited.then((code) => (gone = code));
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (gone !== undefined) throw new Error(`${what} exited (${gone}):\n${tail()}`);
    if (await ready()) return;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`${what} was not ready after ${timeoutMs} ms:\n${tail()}`);
}

/** Settings shared by the app and the workers: the benchmark's database, no rate limits. */
function serviceEnv(databaseUrl: string): Record<string, string> {
  return {
    // Not `production`: that would serve the built client from dist/, which the API does not
    // need; NODE_ENV changes nothing else on the API's paths (server/main.ts, config/env.ts).
    NODE_ENV: 'development',
    DATABASE_URL: databaseUrl,
    RATE_LIMIT_SIGN_IN: '0',
    RATE_LIMIT_TOKEN_FAILURES: '0',
    RATE_LIMIT_SUBMISSIONS: '0',
    MAILBOX: 'off',
    WORKER_SENDS_EMAIL: 'false',
  };
}

/** The app (server/main.ts) on 127.0.0.1:`port`; resolves once /api/health answers 200. */
export async function startApp(databaseUrl: string, port: number): Promise<StartedProcess> {
  const url = `http://127.0.0.1:${port}`;
  const app = startNode('app', ['--import', 'tsx', 'server/main.ts'], {
    ...serviceEnv(databaseUrl),
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: url,
    LOG_LEVEL: 'info',
  });
  try {
    await waitFor(
      'the app',
      async () => {
        try {
          return (await fetch(`${url}/api/health`)).status === 200;
        } catch {
          return false;
        }
      },
      app.exited,
      app.tail,
      60_000,
    );
  } catch (err) {
    await app.stop();
    throw err;
  }
  return app;
}

/** A trial worker (server/worker.ts); resolves once it logs that it has started. */
export async function startWorker(
  databaseUrl: string,
  index: number,
  extraEnv: Record<string, string> = {},
): Promise<StartedProcess> {
  let started = false;
  const worker = startNode(
    `worker ${index}`,
    [...engineFlags, '--import', 'tsx', 'server/worker.ts'],
    { ...serviceEnv(databaseUrl), LOG_LEVEL: 'info', WORKER_STOP_GRACE_SECONDS: '1', ...extraEnv },
    (line) => {
      if (line.includes('"worker started"')) started = true;
    },
  );
  try {
    await waitFor(`worker ${index}`, async () => started, worker.exited, worker.tail, 60_000);
  } catch (err) {
    await worker.stop();
    throw err;
  }
  return worker;
}

/** Runs the load client (load-client.ts) in its own process and returns what it measured. */
export async function runLoad(spec: LoadSpec): Promise<LoadResult> {
  let last = '';
  const client = startNode(
    'load client',
    ['--import', 'tsx', 'benchmarks/service/load-client.ts', JSON.stringify(spec)],
    {},
    (line) => {
      if (line.startsWith('{')) last = line;
    },
  );
  const code = await client.exited;
  if (code !== 0 || last === '') {
    throw new Error(`the load client failed (${code}):\n${client.tail()}`);
  }
  return loadResultSchema.parse(JSON.parse(last));
}
