import { loadEnv } from '@server/config/env.ts';
import { createLogger } from '@server/http/logger.ts';
import { startFakeSmtpServer } from './fake-smtp-server.ts';

// The local fake SMTP server as a process of its own (started by npm start and npm run dev):
// SMTP on FAKE_SMTP_PORT, the mailbox's JSON reader on FAKE_SMTP_HTTP_PORT, loopback only.
const env = loadEnv();
const logger = createLogger(env.LOG_LEVEL).child({ component: 'fake-smtp' });

if (env.FAKE_SMTP_PORT === 0) {
  logger.info('FAKE_SMTP_PORT is 0: the fake SMTP server is not started');
  process.exit(0);
}

const server = await startFakeSmtpServer({
  port: env.FAKE_SMTP_PORT,
  httpPort: env.FAKE_SMTP_HTTP_PORT,
  host: '127.0.0.1',
});
logger.info({ smtpPort: server.port, httpPort: server.httpPort }, 'fake SMTP server listening');

function shutdown(signal: string) {
  logger.info({ signal }, 'fake SMTP server stopping');
  void server.close().finally(() => process.exit(0));
  setTimeout(() => process.exit(0), 5000).unref();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
