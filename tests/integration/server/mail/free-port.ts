import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';

/** A loopback port that nothing listens on: taken from the system, then released at once. */
export async function unusedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}
