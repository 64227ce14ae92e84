import { fileURLToPath } from 'node:url';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import { createDatabase } from './client.ts';

/** Folder of the committed drizzle-kit migrations; found from the source or the bundle. */
export function migrationsFolder(): string {
  return (
    process.env.MIGRATIONS_DIR ??
    fileURLToPath(new URL('../../server/db/migrations', import.meta.url))
  );
}

export async function migrateDatabase(url: string): Promise<void> {
  const { pool, db } = createDatabase(url, 1);
  try {
    await migrate(db, { migrationsFolder: migrationsFolder() });
  } finally {
    await pool.end();
  }
}

const isEntry = process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1];
if (isEntry) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('DATABASE_URL is not set');
    process.exit(2);
  }
  migrateDatabase(url).then(
    () => console.error('[stablehand] migrations applied'),
    (err: unknown) => {
      console.error('[stablehand] migration failed:', err);
      process.exit(1);
    },
  );
}
