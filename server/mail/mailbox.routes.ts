import { Router } from 'express';
import { mailboxQuerySchema } from '@shared/api/mailbox.ts';
import { idParamsSchema } from '@shared/api/params.ts';
import { mailboxEnabled, type Env } from '@server/config/env.ts';
import type { MailboxReader } from './mailbox-reader.ts';
import { clearMailbox, getMailboxMessage, listMailbox } from './mailbox.service.ts';

/**
 * The development mailbox: what the local fake SMTP server captured. When it is off (by default
 * in production) the router answers nothing, so these paths get the same 404 as any unknown route.
 */
export function mailboxRouter(env: Env, reader: MailboxReader): Router {
  const router = Router();
  if (!mailboxEnabled(env)) return router;

  router.get('/', async (req, res) => {
    res.json(await listMailbox(reader, mailboxQuerySchema.parse(req.query)));
  });
  router.get('/:id', async (req, res) => {
    res.json(await getMailboxMessage(reader, idParamsSchema.parse(req.params).id));
  });
  router.delete('/', async (_req, res) => {
    await clearMailbox(reader);
    res.status(204).end();
  });
  return router;
}
