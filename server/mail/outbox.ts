import type { Logger } from 'pino';
import type { Db } from '@server/db/client.ts';
import type { EmailContent } from './compose-email.ts';
import {
  claimDueEmail,
  insertOutboxRows,
  markEmailFailed,
  markEmailSent,
  type DbOrTx,
} from './outbox.repo.ts';
import type { MailSender } from './transport.ts';

/** Which event a message tells about; stored with each row for the record. */
export const emailKinds = [
  'invitation',
  'awaits-review',
  'sent-back',
  'signed-off',
  'cleared',
  'promoted',
  'reinstated',
  'drift-alert',
] as const;
export type EmailKind = (typeof emailKinds)[number];

export interface OutgoingEmail extends EmailContent {
  kind: EmailKind;
  /** One address, or several: each gets a row (and a message) of its own. */
  to: string | readonly string[];
}

/**
 * Queues a message for delivery. Pass the transaction that makes the state change the message
 * tells about, so both commit or neither does; a sender delivers it afterwards.
 */
export async function enqueueEmail(db: DbOrTx, email: OutgoingEmail): Promise<number[]> {
  const addresses = [
    ...new Set((typeof email.to === 'string' ? [email.to] : email.to).map((a) => a.trim())),
  ];
  return insertOutboxRows(
    db,
    addresses
      .filter((a) => a !== '')
      .map((toAddress) => ({
        kind: email.kind,
        toAddress,
        subject: email.subject,
        textBody: email.text,
        htmlBody: email.html,
      })),
  );
}

const baseDelayMs = 5_000;
const maxDelayMs = 10 * 60_000;

/** Wait before the next try after `attempts` failed ones: 5 s, 10 s, 20 s, ... capped at 10 min. */
export function retryDelayMs(attempts: number): number {
  return Math.min(maxDelayMs, baseDelayMs * 2 ** Math.max(0, attempts - 1));
}

export interface DeliveryOptions {
  batchSize?: number;
  /**
   * How long a claimed batch stays hidden from other senders. It must exceed the time to send a
   * whole batch (the transport's timeouts bound each message at well under a minute).
   */
  leaseMs?: number;
}

export interface DeliveryResult {
  claimed: number;
  sent: number;
  failed: number;
}

/**
 * Sends one batch of due messages. Each is marked sent, or keeps its row with one more attempt,
 * the error and a later `next_attempt_at`; nothing is deleted, so an unreachable server loses
 * nothing. Several senders may run at once: each claims different rows.
 */
export async function deliverPendingEmail(
  db: Db,
  transport: MailSender,
  options: DeliveryOptions = {},
): Promise<DeliveryResult> {
  const { batchSize = 10, leaseMs = 15 * 60_000 } = options;
  const claimed = await claimDueEmail(db, batchSize, leaseMs);
  let sent = 0;
  for (const row of claimed) {
    try {
      await transport.sendMail({
        to: row.toAddress,
        subject: row.subject,
        text: row.textBody,
        html: row.htmlBody,
      });
    } catch (err) {
      const attempts = row.attempts + 1;
      const message = (err instanceof Error ? err.message : String(err)).slice(0, 1000);
      await markEmailFailed(db, row.id, attempts, message, retryDelayMs(attempts));
      continue;
    }
    await markEmailSent(db, row.id);
    sent += 1;
  }
  return { claimed: claimed.length, sent, failed: claimed.length - sent };
}

export interface OutboxSenderOptions {
  db: Db;
  transport: MailSender;
  intervalMs?: number;
  batchSize?: number;
  logger: Pick<Logger, 'info' | 'warn' | 'error'>;
}

/**
 * Drains the outbox now and then every `intervalMs` (full batches are followed at once by the
 * next). The timer does not keep the process alive; `stop()` waits for the batch in hand.
 */
export function startOutboxSender(options: OutboxSenderOptions): { stop(): Promise<void> } {
  const { db, transport, logger, intervalMs = 5_000, batchSize = 10 } = options;
  let stopped = false;
  let timer: NodeJS.Timeout | undefined;
  let running: Promise<void> = Promise.resolve();

  const drain = async () => {
    try {
      for (;;) {
        const result = await deliverPendingEmail(db, transport, { batchSize });
        if (result.failed > 0) logger.warn(result, 'some e-mail could not be sent; will retry');
        else if (result.sent > 0) logger.info(result, 'e-mail sent');
        if (stopped || result.claimed < batchSize) return;
      }
    } catch (err) {
      logger.error({ err }, 'the outbox sender could not read the outbox');
    }
  };
  const tick = () => {
    running = drain().then(() => {
      if (!stopped) timer = setTimeout(tick, intervalMs).unref();
    });
  };
  tick();

  return {
    stop: async () => {
      stopped = true;
      clearTimeout(timer);
      await running;
    },
  };
}
