import pg from 'pg';
import type { TestProject } from 'vitest/node';
import { migrateDatabase } from '@server/db/migrate.ts';

declare module 'vitest' {
  export interface ProvidedContext {
    databaseUrl: string;
  }
}

/**
 * Creates a fresh database for this run on the project's cluster, migrates it, hands its URL
 * to the tests, and drops it afterwards. The app's own database is never touched.
 */
export default async function setup(project: TestProject) {
  const clusterUrl = new URL(
    process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/stablehand',
  );
  const name = `test_${process.pid}_${Date.now()}`;
  const admin = new pg.Client({ connectionString: withDatabase(clusterUrl, 'postgres') });
  await admin.connect();
  await admin.query(`create database "${name}"`);
  await admin.end();

  const url = withDatabase(clusterUrl, name);
  await migrateDatabase(url);
  project.provide('databaseUrl', url);

  return async () => {
    const cleaner = new pg.Client({ connectionString: withDatabase(clusterUrl, 'postgres') });
    await cleaner.connect();
    await cleaner.query(`drop database if exists "${name}" with (force)`);
    await cleaner.end();
  };
}

function withDatabase(url: URL, database: string): string {
  const copy = new URL(url);
  copy.pathname = `/${database}`;
  return copy.toString();
}
