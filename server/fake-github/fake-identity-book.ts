import { createHash } from 'node:crypto';
import type { FakeGithubIdentity } from './demo-identities.ts';

/** Logins the fake accepts: letters, digits, dots, hyphens and underscores, up to 39 characters. */
export const fakeLoginPattern = /^[A-Za-z0-9](?:[A-Za-z0-9._-]{0,37}[A-Za-z0-9])?$/;

/**
 * A stable numeric id for a login typed on the sign-in screen: the same login always gets the
 * same id (across restarts), so signing in again finds the same account. Logins are compared
 * without case, as the real provider does.
 */
export function stableIdForLogin(login: string): number {
  const digest = createHash('sha256').update(login.toLowerCase(), 'utf8').digest();
  return 100_000_000 + (digest.readUInt32BE(0) % 900_000_000);
}

/** The people the fake knows: the configured ones plus anyone typed in since it started. */
export class FakeIdentityBook {
  private readonly byLogin = new Map<string, FakeGithubIdentity>();

  constructor(identities: readonly FakeGithubIdentity[]) {
    for (const identity of identities) this.byLogin.set(identity.login.toLowerCase(), identity);
  }

  list(): FakeGithubIdentity[] {
    return [...this.byLogin.values()];
  }

  find(login: string): FakeGithubIdentity | undefined {
    return this.byLogin.get(login.toLowerCase());
  }

  /** The known person with this login, or a new one with a stable id; null for a bad login. */
  findOrAdd(login: string): FakeGithubIdentity | null {
    if (!fakeLoginPattern.test(login)) return null;
    const known = this.find(login);
    if (known) return known;
    const identity: FakeGithubIdentity = {
      id: stableIdForLogin(login),
      login,
      name: login,
      email: `${login.toLowerCase()}@users.fake-github.test`,
    };
    this.byLogin.set(login.toLowerCase(), identity);
    return identity;
  }
}
