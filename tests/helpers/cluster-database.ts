import pg from 'pg';

/** The same connection address with another database name. */
export function withDatabase(url: string | URL, database: string): string {
  const copy = new URL(url);
  copy.pathname = `/${database}`;
  return copy.toString();
}

/**
 * Runs one statement on the cluster's `postgres` database (create or drop a database of a test's
 * own), through a connection of its own that is closed afterwards.
 */
export async function onCluster(anyDatabaseUrl: string, statement: string): Promise<void> {
  const client = new pg.Client({ connectionString: withDatabase(anyDatabaseUrl, 'postgres') });
  await client.connect();
  try {
    await client.query(statement);
  } finally {
    await client.end();
  }
}
