import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { mailboxMessageSchema } from '@shared/api/mailbox.ts';
import { startFakeSmtpServer, type FakeSmtpServer } from '@server/fake-smtp/fake-smtp-server.ts';
import { loadEnv } from '@server/config/env.ts';
import { createMailTransport } from '@server/mail/transport.ts';

let fake: FakeSmtpServer;
beforeAll(async () => {
  fake = await startFakeSmtpServer({ port: 0, httpPort: 0, host: '127.0.0.1', capacity: 3 });
});
afterAll(() => fake.close());
beforeEach(() => fake.clear());

function transport() {
  return createMailTransport(
    loadEnv({ SMTP_PORT: String(fake.port), MAIL_FROM: 'Stablehand <review@frame.example>' }),
  );
}

describe('fake SMTP server', () => {
  it('captures a message sent by nodemailer with its subject, recipients and both bodies', async () => {
    const info = await transport().sendMail({
      to: ['ines.probst@frame.example', 'tomas.arvid@frame.example'],
      subject: 'Cholesky candidate awaits review',
      text: 'Plain body',
      html: '<p>HTML <b>body</b></p>',
    });
    expect(info.accepted).toEqual(['ines.probst@frame.example', 'tomas.arvid@frame.example']);

    const [message, ...rest] = fake.messages();
    expect(rest).toHaveLength(0);
    expect(mailboxMessageSchema.parse(message)).toMatchObject({
      from: 'Stablehand <review@frame.example>',
      to: ['ines.probst@frame.example', 'tomas.arvid@frame.example'],
      subject: 'Cholesky candidate awaits review',
      text: 'Plain body',
      html: '<p>HTML <b>body</b></p>',
    });
  });

  it('gives a text-only message a null html and keeps only the newest messages beyond capacity', async () => {
    const t = transport();
    for (const n of [1, 2, 3, 4]) {
      await t.sendMail({ to: 'mara.lind@frame.example', subject: `Drift ${n}`, text: `n=${n}` });
    }
    const kept = fake.messages();
    expect(kept.map((m) => m.subject)).toEqual(['Drift 2', 'Drift 3', 'Drift 4']);
    expect(kept.every((m) => m.html === null)).toBe(true);
    expect(new Set(kept.map((m) => m.id)).size).toBe(3);
  });

  it('serves the captured messages as JSON and forgets them on DELETE', async () => {
    await transport().sendMail({ to: 'ola.berg@frame.example', subject: 'Hello', text: 'x' });
    const base = `http://127.0.0.1:${fake.httpPort}`;

    const listed = z
      .array(mailboxMessageSchema)
      .parse(await (await fetch(`${base}/messages`)).json());
    expect(listed.map((m) => m.subject)).toEqual(['Hello']);

    const cleared = await fetch(`${base}/messages`, { method: 'DELETE' });
    expect(cleared.status).toBe(204);
    expect(fake.messages()).toEqual([]);
    expect((await fetch(`${base}/other`)).status).toBe(404);
  });
});
