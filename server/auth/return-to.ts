/**
 * The path to return to after sign-in, if `value` is a path on this site; otherwise null. Only a
 * same-origin path survives (no scheme, no `//host`, no backslash tricks), so the sign-in flow
 * can never be used to send someone to another site.
 */
export function safeReturnTo(value: unknown, ownOrigin: string): string | null {
  if (typeof value !== 'string' || value.length === 0 || value.length > 2000) return null;
  if (!value.startsWith('/') || value.startsWith('//') || /[\\\s]/.test(value)) return null;
  let url: URL;
  try {
    url = new URL(value, ownOrigin);
  } catch {
    return null;
  }
  if (url.origin !== new URL(ownOrigin).origin) return null;
  return `${url.pathname}${url.search}${url.hash}`;
}
