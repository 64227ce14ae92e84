import { count } from 'drizzle-orm';
import pg from 'pg';
import { pino } from 'pino';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import { createDatabase, type Database } from '@server/db/client.ts';
import { migrateDatabase } from '@server/db/migrate.ts';
import { auditLog } from '@server/db/schema/audit-log.ts';
import { teams } from '@server/db/schema/teams.ts';
import { users } from '@server/db/schema/users.ts';
import { loadDemo } from '@server/demo/demo-load.ts';

function databaseUrlNamed(base: string, name: string): string {
  const url = new URL(base);
  url.pathname = `/${name}`;
  return url.toString();
}

async function adminQuery(base: string, text: string): Promise<void> {
  const client = new pg.Client({ connectionString: databaseUrlNamed(base, 'postgres') });
  await client.connect();
  try {
    await client.query(text);
  } finally {
    await client.end();
  }
}

describe('a demo load that fails', () => {
  const base = inject('databaseUrl');
  const name = `demo_rollback_${process.pid}_${Date.now()}`;
  let database: Database;

  beforeAll(async () => {
    await adminQuery(base, `create database "${name}"`);
    await migrateDatabase(databaseUrlNamed(base, name));
    database = createDatabase(databaseUrlNamed(base, name), 2);
    // Someone else signed in first with a demo person's login: the load cannot record that
    // person (logins are unique) and must give up after it has already written other people.
    await database.db
      .insert(users)
      .values({ githubId: '99', login: 'yara.domsch', displayName: null, email: null });
  });

  afterAll(async () => {
    await database?.pool.end();
    await adminQuery(base, `drop database if exists "${name}" with (force)`);
  });

  it('throws and leaves nothing of itself behind', async () => {
    const { db } = database;
    await expect(loadDemo(db, loadEnv({}), { logger: pino({ level: 'silent' }) })).rejects.toThrow(
      /yara\.domsch/,
    );
    const [people] = await db.select({ n: count() }).from(users);
    const [teamCount] = await db.select({ n: count() }).from(teams);
    const [audits] = await db.select({ n: count() }).from(auditLog);
    expect(people!.n).toBe(1);
    expect(teamCount!.n).toBe(0);
    expect(audits!.n).toBe(0);
  });
});
