import pg from 'pg';
import { migrateDatabase } from '@server/db/migrate.ts';

/** A throw-away database on the project's cluster, migrated; drop() removes it. */
export interface BenchDatabase {
  name: string;
  url: string;
  drop(): Promise<void>;
}

function clusterUrl(): URL {
  return new URL(process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/stablehand');
}

function withDatabase(url: URL, database: string): string {
  const copy = new URL(url);
  copy.pathname = `/${database}`;
  return copy.toString();
}

async function asAdmin(sql: string): Promise<void> {
  const admin = new pg.Client({ connectionString: withDatabase(clusterUrl(), 'postgres') });
  await admin.connect();
  try {
    await admin.query(sql);
  } finally {
    await admin.end();
  }
}

/**
 * Creates `bench_service_<pid>_<time>` beside the app's database (as the tests' global set-up
 * does) and applies the committed migrations. The caller drops it in a `finally`.
 */
export async function createBenchDatabase(): Promise<BenchDatabase> {
  const name = `bench_service_${process.pid}_${Date.now()}`;
  await asAdmin(`create database "${name}"`);
  const url = withDatabase(clusterUrl(), name);
  const drop = () => asAdmin(`drop database if exists "${name}" with (force)`);
  try {
    await migrateDatabase(url);
  } catch (err) {
    await drop();
    throw err;
  }
  return { name, url, drop };
}
