import { execFile } from 'node:child_process';
import { chown, mkdtemp, readdir, rm } from 'node:fs/promises';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { onCluster, withDatabase } from '@tests/helpers/cluster-database.ts';

const run = promisify(execFile);

/**
 * A PostgreSQL cluster of the test's own, in a temporary folder, on a loopback port of the given
 * range: one that a test may stop and restart without touching the cluster other tests share.
 * Found and run as scripts/db.sh does: the newest /usr/lib/postgresql/<v>/bin, and as the
 * postgres user when we are root (initdb refuses root).
 */
export interface PrivateCluster {
  /** Address of the cluster's `postgres` database. */
  url: string;
  /** A new empty database on it; returns its address. */
  createDatabase(name: string): Promise<string>;
  stop(): Promise<void>;
  start(): Promise<void>;
  /** Stops the cluster at once and deletes its folder; safe to call on a half-made cluster. */
  destroy(): Promise<void>;
}

async function pgBin(): Promise<string> {
  const versions = (await readdir('/usr/lib/postgresql')).sort((a, b) =>
    a.localeCompare(b, undefined, { numeric: true }),
  );
  const newest = versions.at(-1);
  if (!newest) throw new Error('no PostgreSQL server binaries under /usr/lib/postgresql');
  return `/usr/lib/postgresql/${newest}/bin`;
}

async function portIsFree(port: number): Promise<boolean> {
  const server = createServer();
  return new Promise((resolve) => {
    server.once('error', () => resolve(false));
    server.listen(port, '127.0.0.1', () => server.close(() => resolve(true)));
  });
}

async function freePort(from: number, to: number): Promise<number> {
  for (let port = from; port <= to; port++) if (await portIsFree(port)) return port;
  throw new Error(`no free port in ${from}–${to}`);
}

async function ownerIds(): Promise<{ uid: number; gid: number } | null> {
  if (process.getuid?.() !== 0) return null;
  const [uid, gid] = await Promise.all([
    run('id', ['-u', 'postgres']),
    run('id', ['-g', 'postgres']),
  ]);
  return { uid: Number(uid.stdout.trim()), gid: Number(gid.stdout.trim()) };
}

export async function startPrivateCluster(ports: {
  from: number;
  to: number;
}): Promise<PrivateCluster> {
  const bin = await pgBin();
  const owner = await ownerIds();
  const asOwner = (command: string, args: string[]) =>
    owner
      ? run('runuser', ['-u', 'postgres', '--', join(bin, command), ...args])
      : run(join(bin, command), args);

  const root = await mkdtemp(join(tmpdir(), 'stablehand-faults-'));
  const dataDir = join(root, 'pg');
  const pgCtl = (args: string[]) => asOwner('pg_ctl', ['-D', dataDir, ...args]);

  const destroy = async () => {
    // Stopped already, or never started: pg_ctl fails, which is fine here.
    await pgCtl(['-m', 'immediate', '-w', '-s', 'stop']).catch(() => {});
    await rm(root, { recursive: true, force: true });
  };

  try {
    if (owner) await chown(root, owner.uid, owner.gid);
    await asOwner('initdb', [
      '-D',
      dataDir,
      '-U',
      'postgres',
      '--auth=trust',
      '-E',
      'UTF8',
      '--locale=C.UTF-8',
    ]);
    const port = await freePort(ports.from, ports.to);
    const options = `-c listen_addresses=127.0.0.1 -p ${port} -k ${root} -c fsync=off -c max_connections=100`;
    const start = async () => {
      await pgCtl(['-l', join(root, 'server.log'), '-o', options, '-w', '-s', 'start']);
    };
    await start();
    const url = `postgres://postgres@127.0.0.1:${port}/postgres`;
    return {
      url,
      createDatabase: async (name) => {
        await onCluster(url, `create database "${name}"`);
        return withDatabase(url, name);
      },
      stop: async () => {
        await pgCtl(['-m', 'fast', '-w', '-s', 'stop']);
      },
      start,
      destroy,
    };
  } catch (err) {
    await destroy();
    throw err;
  }
}
