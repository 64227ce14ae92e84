import { randomUUID } from 'node:crypto';
import { createDatabase, type Database } from '@server/db/client.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { onCluster, withDatabase } from '@tests/helpers/cluster-database.ts';

/**
 * A migrated database of its own on the test cluster, so the outbox tests count only the rows
 * they made (other test files enqueue e-mail into the shared test database at the same time).
 */
export async function createPrivateDatabase(
  sharedUrl: string,
): Promise<{ url: string; open: (max?: number) => Database; drop: () => Promise<void> }> {
  const name = `mail_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  await onCluster(sharedUrl, `create database "${name}"`);
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
      await onCluster(sharedUrl, `drop database if exists "${name}" with (force)`);
    },
  };
}
