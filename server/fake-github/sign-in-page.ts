import type { FakeGithubIdentity } from './demo-identities.ts';

/** What the sign-in form sends back unchanged: the OAuth request being answered. */
export interface AuthorizeRequest {
  clientId: string;
  redirectUri: string;
  state: string;
}

const escapeHtml = (text: string): string =>
  text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

function hiddenFields(request: AuthorizeRequest): string {
  return [
    ['client_id', request.clientId],
    ['redirect_uri', request.redirectUri],
    ['state', request.state],
  ]
    .map(([name, value]) => `<input type="hidden" name="${name}" value="${escapeHtml(value!)}">`)
    .join('\n      ');
}

/**
 * The plain sign-in screen of the local provider: one button per known person and a field to
 * sign in as someone new. It is a development tool, so it asks for no password.
 */
export function renderSignInPage(
  request: AuthorizeRequest,
  identities: readonly FakeGithubIdentity[],
): string {
  const buttons = identities
    .map(
      (p) =>
        `<button type="submit" name="login" value="${escapeHtml(p.login)}">` +
        `${escapeHtml(p.name)} <small>${escapeHtml(p.login)}</small></button>`,
    )
    .join('\n      ');
  return `<!doctype html>
<html lang="en">
<head>
  <meta charset="utf-8">
  <title>Local sign-in (development)</title>
  <style>
    body { font-family: system-ui, sans-serif; max-width: 28rem; margin: 3rem auto; color: #1f2933; }
    form { display: grid; gap: 0.5rem; margin-bottom: 1.5rem; }
    button { padding: 0.5rem 0.75rem; text-align: left; cursor: pointer; }
    small { color: #52606d; margin-left: 0.5rem; }
    p.note { color: #52606d; font-size: 0.9rem; }
  </style>
</head>
<body>
  <h1>Local sign-in</h1>
  <p class="note">This stand-in for a GitHub sign-in runs on this machine for development and
  tests. Nobody is asked for a password: choose who you want to be.</p>
  <form method="post" action="/login/oauth/authorize" aria-label="Known people">
      ${hiddenFields(request)}
      ${buttons}
  </form>
  <form method="post" action="/login/oauth/authorize" aria-label="Someone new">
      ${hiddenFields(request)}
      <label for="login">Or sign in as a new login</label>
      <input id="login" name="login" required pattern="[A-Za-z0-9][A-Za-z0-9._\\-]{0,38}" autocomplete="off">
      <button type="submit">Continue</button>
  </form>
</body>
</html>
`;
}
