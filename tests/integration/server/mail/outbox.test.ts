import { eq, sql } from 'drizzle-orm';
import { pino } from 'pino';
import { afterAll, beforeAll, beforeEach, describe, expect, inject, it, vi } from 'vitest';
import { loadEnv } from '@server/config/env.ts';
import type { Database } from '@server/db/client.ts';
import { emailOutbox } from '@server/db/schema/email-outbox.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { deliverPendingEmail, enqueueEmail, startOutboxSender } from '@server/mail/outbox.ts';
import { createMailTransport } from '@server/mail/transport.ts';
import { unusedPort } from './free-port.ts';
import { createPrivateDatabase } from './private-database.ts';

let privateDb: Awaited<ReturnType<typeof createPrivateDatabase>>;
let database: Database;
let fake: FakeSmtpServer;

beforeAll(async () => {
  privateDb = await createPrivateDatabase(inject('databaseUrl'));
  database = privateDb.open(6);
  fake = await startFakeSmtpServer({ port: 0, host: '127.0.0.1' });
});
afterAll(async () => {
  await fake?.close();
  await privateDb?.drop();
});
beforeEach(async () => {
  fake.clear();
  await database.db.delete(emailOutbox);
});

const transportTo = (port: number) => createMailTransport(loadEnv({ SMTP_PORT: String(port) }));

function email(subject: string, to: string | string[] = 'ines.probst@frame.example') {
  return {
    kind: 'awaits-review' as const,
    to,
    subject,
    text: `${subject} (text)`,
    html: `<p>${subject}</p>`,
  };
}

async function rowById(id: number) {
  const [row] = await database.db.select().from(emailOutbox).where(eq(emailOutbox.id, id));
  return row!;
}

describe('enqueueEmail', () => {
  it('commits with the caller transaction and disappears with its rollback', async () => {
    await database.db
      .transaction(async (tx) => {
        await enqueueEmail(tx, email('Rolled back'));
        tx.rollback();
      })
      .catch(() => {});
    const ids = await database.db.transaction((tx) =>
      enqueueEmail(
        tx,
        email('Committed', ['a@frame.example', 'b@frame.example', 'a@frame.example']),
      ),
    );
    const rows = await database.db.select().from(emailOutbox);
    expect(rows.map((r) => r.subject)).toEqual(['Committed', 'Committed']);
    expect(rows.map((r) => r.toAddress).sort()).toEqual(['a@frame.example', 'b@frame.example']);
    expect(rows.map((r) => r.id).sort()).toEqual([...ids].sort());
    expect(rows.every((r) => r.kind === 'awaits-review' && r.sentAt === null)).toBe(true);
  });
});

describe('deliverPendingEmail', () => {
  it('sends due messages and marks them sent; a second run finds nothing to do', async () => {
    await enqueueEmail(
      database.db,
      email('LU candidate awaits review', ['x@frame.example', 'y@frame.example']),
    );
    const result = await deliverPendingEmail(database.db, transportTo(fake.port));
    expect(result).toEqual({ claimed: 2, sent: 2, failed: 0 });

    const captured = fake.messages();
    expect(captured.map((m) => m.to[0]).sort()).toEqual(['x@frame.example', 'y@frame.example']);
    expect(captured[0]).toMatchObject({
      subject: 'LU candidate awaits review',
      text: 'LU candidate awaits review (text)',
      html: '<p>LU candidate awaits review</p>',
    });
    const rows = await database.db.select().from(emailOutbox);
    expect(rows.every((r) => r.sentAt !== null && r.attempts === 0)).toBe(true);

    expect(await deliverPendingEmail(database.db, transportTo(fake.port))).toEqual({
      claimed: 0,
      sent: 0,
      failed: 0,
    });
    expect(fake.messages()).toHaveLength(2);
  });

  it('keeps a message the server could not take, retries later and then delivers the same row', async () => {
    const [id] = await enqueueEmail(database.db, email('Sent back: QR candidate'));
    const deadPort = await unusedPort();

    const failed = await deliverPendingEmail(database.db, transportTo(deadPort));
    expect(failed).toEqual({ claimed: 1, sent: 0, failed: 1 });
    const afterFailure = await rowById(id!);
    expect(afterFailure.sentAt).toBeNull();
    expect(afterFailure.attempts).toBe(1);
    expect(afterFailure.lastError).toMatch(/ECONNREFUSED/);
    const [{ due }] = (
      await database.db.execute<{ due: boolean }>(
        sql`select next_attempt_at > now() + interval '3 seconds' as due from email_outbox where id = ${id}`,
      )
    ).rows as [{ due: boolean }];
    expect(due).toBe(true);

    // Not due yet: nobody claims it, even with a working server.
    expect((await deliverPendingEmail(database.db, transportTo(fake.port))).claimed).toBe(0);

    // Time passes: the retry comes due and goes to a server that is now listening.
    await database.db
      .update(emailOutbox)
      .set({ nextAttemptAt: sql`now() - interval '1 second'` })
      .where(eq(emailOutbox.id, id!));
    expect(await deliverPendingEmail(database.db, transportTo(fake.port))).toEqual({
      claimed: 1,
      sent: 1,
      failed: 0,
    });
    const delivered = await rowById(id!);
    expect(delivered.sentAt).not.toBeNull();
    expect(delivered.attempts).toBe(1);
    expect(fake.messages().map((m) => m.subject)).toEqual(['Sent back: QR candidate']);
    expect(await database.db.$count(emailOutbox)).toBe(1);
  });

  it('lets two senders drain the outbox together with each message delivered exactly once', async () => {
    const subjects = Array.from({ length: 40 }, (_, i) => `Drift alert ${i + 1}`);
    for (const s of subjects) await enqueueEmail(database.db, email(s));

    // Two senders as two processes would be: their own pools, their own SMTP connections.
    const pools = [privateDb.open(2), privateDb.open(2)];
    const drain = async (d: Database) => {
      let sent = 0;
      for (;;) {
        const r = await deliverPendingEmail(d.db, transportTo(fake.port), { batchSize: 3 });
        sent += r.sent;
        if (r.claimed === 0) return sent;
      }
    };
    const [a, b] = await Promise.all(pools.map(drain));

    expect(a! + b!).toBe(40);
    expect(
      fake
        .messages()
        .map((m) => m.subject)
        .sort(),
    ).toEqual([...subjects].sort());
    const rows = await database.db.select().from(emailOutbox);
    expect(rows.every((r) => r.sentAt !== null && r.attempts === 0)).toBe(true);
  });
});

describe('startOutboxSender', () => {
  it('delivers what is enqueued while it runs, and stops', async () => {
    const sender = startOutboxSender({
      db: database.db,
      transport: transportTo(fake.port),
      intervalMs: 50,
      logger: pino({ level: 'silent' }),
    });
    try {
      await enqueueEmail(database.db, email('Promoted: blocked LU'));
      await vi.waitFor(
        () => expect(fake.messages().map((m) => m.subject)).toEqual(['Promoted: blocked LU']),
        {
          timeout: 10_000,
          interval: 50,
        },
      );
    } finally {
      await sender.stop();
    }
    const [row] = await database.db.select().from(emailOutbox);
    expect(row?.sentAt).not.toBeNull();
  });
});
