import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import type { MailboxMessage } from '@shared/api/mailbox.ts';

export interface CapturedMailStore {
  messages(): MailboxMessage[];
  clear(): void;
}

/**
 * The fake SMTP server's reader: `GET /messages` answers every captured message as JSON (oldest
 * first), `DELETE /messages` forgets them. It lets the app read the mailbox when the fake runs
 * in a process of its own.
 */
export async function startCapturedMailHttp(
  store: CapturedMailStore,
  port: number,
  host: string,
): Promise<{ server: Server; port: number }> {
  const server = createServer((req, res) => {
    const path = new URL(req.url ?? '/', 'http://localhost').pathname;
    if (path !== '/messages') {
      res.writeHead(404, { 'content-type': 'application/json' }).end('{"error":"not found"}');
    } else if (req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify(store.messages()));
    } else if (req.method === 'DELETE') {
      store.clear();
      res.writeHead(204).end();
    } else {
      res.writeHead(405, { allow: 'GET, DELETE' }).end();
    }
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      server.off('error', reject);
      resolve();
    });
  });
  return { server, port: (server.address() as AddressInfo).port };
}
