import type { AddressInfo } from 'node:net';
import { loadEnv } from '@server/config/env.ts';
import { demoIdentities } from './demo-identities.ts';
import { createFakeGithubApp } from './fake-github-app.ts';

// The local stand-in for GitHub sign-in, for development: listens on loopback only.
const env = loadEnv();
if (env.FAKE_GITHUB_PORT === 0) {
  console.log('FAKE_GITHUB_PORT is 0: the local sign-in provider is not started.');
  process.exit(0);
}

const app = createFakeGithubApp({
  identities: demoIdentities,
  client: { id: env.GITHUB_CLIENT_ID, secret: env.GITHUB_CLIENT_SECRET },
});
const server = app.listen(env.FAKE_GITHUB_PORT, '127.0.0.1', (err?: Error) => {
  if (err) {
    console.error(`The local sign-in provider could not listen: ${err.message}`);
    process.exit(1);
  }
  const { port } = server.address() as AddressInfo;
  console.log(`Local sign-in provider (fake GitHub) at http://127.0.0.1:${port}/`);
});

const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
