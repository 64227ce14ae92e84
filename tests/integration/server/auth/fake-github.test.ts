import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoIdentities } from '@server/fake-github/demo-identities.ts';
import { createFakeGithubApp } from '@server/fake-github/fake-github-app.ts';
import { stableIdForLogin } from '@server/fake-github/fake-identity-book.ts';

const client = { id: 'bench-client', secret: 'bench-client-secret' };
const redirectUri = 'http://127.0.0.1:9/auth/github/callback';
let server: Server;
let base: string;
beforeAll(async () => {
  const app = createFakeGithubApp({ identities: demoIdentities, client });
  server = await new Promise((resolve) => {
    const s = app.listen(0, '127.0.0.1', () => resolve(s));
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise<void>((resolve) => server.close(() => resolve()));
});

async function codeFor(login: string, state = 'nonce-1'): Promise<string> {
  const res = await fetch(`${base}/login/oauth/authorize`, {
    method: 'POST',
    redirect: 'manual',
    body: new URLSearchParams({ client_id: client.id, redirect_uri: redirectUri, state, login }),
  });
  expect(res.status).toBe(303);
  const location = new URL(res.headers.get('location')!);
  expect(`${location.origin}${location.pathname}`).toBe(redirectUri);
  expect(location.searchParams.get('state')).toBe(state);
  return location.searchParams.get('code')!;
}

function exchange(code: string, secret = client.secret) {
  return fetch(`${base}/login/oauth/access_token`, {
    method: 'POST',
    headers: { accept: 'application/json' },
    body: new URLSearchParams({
      client_id: client.id,
      client_secret: secret,
      code,
      redirect_uri: redirectUri,
    }),
  });
}

describe('the fake GitHub provider', () => {
  it('shows a sign-in screen listing every demo person', async () => {
    const url = new URL(`${base}/login/oauth/authorize`);
    url.search = new URLSearchParams({
      client_id: client.id,
      redirect_uri: redirectUri,
    }).toString();
    const res = await fetch(url);
    expect(res.status).toBe(200);
    const html = await res.text();
    for (const person of demoIdentities) expect(html).toContain(`value="${person.login}"`);
    expect(html).toContain('name="login"');
  });

  it('refuses an unknown client on the sign-in screen', async () => {
    const url = `${base}/login/oauth/authorize?client_id=other&redirect_uri=${encodeURIComponent(redirectUri)}`;
    expect((await fetch(url)).status).toBe(400);
  });

  it('exchanges a code for a token that reads the profile and e-mails', async () => {
    const person = demoIdentities[1]!;
    const res = await exchange(await codeFor(person.login));
    expect(res.status).toBe(200);
    const grant = (await res.json()) as { access_token: string; token_type: string };
    expect(grant.token_type).toBe('bearer');

    const profile = await fetch(`${base}/user`, {
      headers: { authorization: `token ${grant.access_token}` },
    });
    expect(await profile.json()).toEqual(person);
    const emails = await fetch(`${base}/user/emails`, {
      headers: { authorization: `Bearer ${grant.access_token}` },
    });
    expect(await emails.json()).toEqual([
      { email: person.email, primary: true, verified: true, visibility: 'public' },
    ]);
  });

  it('takes a JSON body for the exchange too', async () => {
    const res = await fetch(`${base}/login/oauth/access_token`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({
        client_id: client.id,
        client_secret: client.secret,
        code: await codeFor(demoIdentities[0]!.login),
      }),
    });
    expect(res.status).toBe(200);
  });

  it('refuses a wrong client secret', async () => {
    const res = await exchange(await codeFor(demoIdentities[0]!.login), 'not-the-secret');
    expect(res.status).toBe(401);
    expect(await res.json()).toMatchObject({ error: 'incorrect_client_credentials' });
  });

  it('refuses a code the second time', async () => {
    const code = await codeFor(demoIdentities[0]!.login);
    expect((await exchange(code)).status).toBe(200);
    const again = await exchange(code);
    expect(again.status).toBe(400);
    expect(await again.json()).toMatchObject({ error: 'bad_verification_code' });
  });

  it('refuses the profile without a valid token', async () => {
    expect((await fetch(`${base}/user`)).status).toBe(401);
    const res = await fetch(`${base}/user`, { headers: { authorization: 'Bearer made-up' } });
    expect(res.status).toBe(401);
  });

  it('gives a typed new login the same id every time', async () => {
    const read = async () => {
      const res = await exchange(await codeFor('Gauge.Lab-visitor'));
      const { access_token } = (await res.json()) as { access_token: string };
      const profile = await fetch(`${base}/user`, {
        headers: { authorization: `token ${access_token}` },
      });
      return (await profile.json()) as { id: number; login: string };
    };
    const first = await read();
    const second = await read();
    expect(first.id).toBe(stableIdForLogin('gauge.lab-visitor'));
    expect(second).toEqual(first);
    expect(first.login).toBe('Gauge.Lab-visitor');
  });

  it('refuses a login it cannot accept', async () => {
    const res = await fetch(`${base}/login/oauth/authorize`, {
      method: 'POST',
      redirect: 'manual',
      body: new URLSearchParams({
        client_id: client.id,
        redirect_uri: redirectUri,
        login: '<script>',
      }),
    });
    expect(res.status).toBe(400);
  });
});
