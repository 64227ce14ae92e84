import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { createDatabase, type Database } from '@server/db/client.ts';
import { migrateDatabase } from '@server/db/migrate.ts';

/**
 * A migrated database of its own on the test cluster, so the outbox tests count only the rows
 * they made (other test files enqueue e-mail into the shared test database at the same time).
 */
export async function createPrivateDatabase(
  sharedUrl: string,
): Promise<{ url: string; open: (max?: number) => Database; drop: () => Promise<void> }> {
  const name = `mail_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  const adminUrl = withDatabase(sharedUrl, 'postgres');
  await runAdmin(adminUrl, `create database "${name}"`);
  const url = withDatabase(sharedUrl, name);
  await migrateDatabase(url);
  const opened: Database[] = [];
  return {
    url,
    open: (max = 4) => {
      const database = createDatabase(url, max);
      opened.push(database);
      return database;
    },
    drop: async () => {
      await Promise.all(opened.map((d) => d.pool.end()));
      await runAdmin(adminUrl, `drop database if exists "${name}" with (force)`);
    },
  };
}

async function runAdmin(url: string, statement: string): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    await client.query(statement);
  } finally {
    await client.end();
  }
}

function withDatabase(url: string, database: string): string {
  const copy = new URL(url);
  copy.pathname = `/${database}`;
  return copy.toString();
}
