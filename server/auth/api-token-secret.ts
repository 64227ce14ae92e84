import { createHash, randomBytes } from 'node:crypto';

const TOKEN_PREFIX = 'shk_';

/** A new API token: the secret (shown once), its SHA-256 hash (stored) and a short prefix (listed). */
export function generateApiToken(): { token: string; hash: string; prefix: string } {
  const token = `${TOKEN_PREFIX}${randomBytes(32).toString('base64url')}`;
  return { token, hash: hashSecret(token), prefix: token.slice(0, TOKEN_PREFIX.length + 6) };
}

/** SHA-256 hex of a secret (API tokens, invitation links). High-entropy secrets need no slow hash. */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}

export function looksLikeApiToken(value: string): boolean {
  return (
    value.startsWith(TOKEN_PREFIX) && value.length > TOKEN_PREFIX.length + 20 && value.length < 200
  );
}
