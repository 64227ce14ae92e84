import { randomBytes } from 'node:crypto';
import express, { type Express, type Request, type Response } from 'express';
import { loadEnv } from '@server/config/env.ts';
import type { FakeGithubIdentity } from './demo-identities.ts';
import { FakeIdentityBook } from './fake-identity-book.ts';
import { renderSignInPage, type AuthorizeRequest } from './sign-in-page.ts';

export interface FakeGithubOptions {
  identities: readonly FakeGithubIdentity[];
  /** The one OAuth client the fake serves; defaults to the app's default client settings. */
  client?: { id: string; secret: string };
}

interface Grant {
  login: string;
  clientId: string;
  redirectUri: string;
  expiresAt: number;
}

const CODE_LIFETIME_MS = 10 * 60 * 1000;

const field = (source: unknown, name: string): string => {
  const value = (source as Record<string, unknown> | undefined)?.[name];
  return typeof value === 'string' ? value : '';
};

function isHttpUrl(value: string): boolean {
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:';
  } catch {
    return false;
  }
}

/**
 * A GitHub-compatible OAuth provider for development and tests: an authorize screen, the code
 * exchange and the profile endpoints that passport-github2 calls. Codes are single-use and bound
 * to the client and redirect address they were issued for. All state lives in memory.
 */
export function createFakeGithubApp(options: FakeGithubOptions): Express {
  const defaults = loadEnv({});
  const client = options.client ?? {
    id: defaults.GITHUB_CLIENT_ID,
    secret: defaults.GITHUB_CLIENT_SECRET,
  };
  const book = new FakeIdentityBook(options.identities);
  const codes = new Map<string, Grant>();
  const accessTokens = new Map<string, string>();

  const app = express();
  app.disable('x-powered-by');
  app.use(express.urlencoded({ extended: false, limit: '16kb' }));
  app.use(express.json({ limit: '16kb' }));

  function readAuthorizeRequest(source: unknown, res: Response): AuthorizeRequest | null {
    const request = {
      clientId: field(source, 'client_id'),
      redirectUri: field(source, 'redirect_uri'),
      state: field(source, 'state'),
    };
    if (request.clientId !== client.id) {
      res.status(400).type('text/plain').send('Unknown OAuth client.');
      return null;
    }
    if (!isHttpUrl(request.redirectUri)) {
      res.status(400).type('text/plain').send('redirect_uri must be an http(s) address.');
      return null;
    }
    return request;
  }

  app.get('/login/oauth/authorize', (req, res) => {
    const request = readAuthorizeRequest(req.query, res);
    if (request) res.type('html').send(renderSignInPage(request, book.list()));
  });

  app.post('/login/oauth/authorize', (req, res) => {
    const request = readAuthorizeRequest(req.body, res);
    if (!request) return;
    const identity = book.findOrAdd(field(req.body, 'login').trim());
    if (!identity) {
      res.status(400).type('text/plain').send('That login is not valid.');
      return;
    }
    const code = randomBytes(16).toString('hex');
    codes.set(code, {
      login: identity.login,
      clientId: request.clientId,
      redirectUri: request.redirectUri,
      expiresAt: Date.now() + CODE_LIFETIME_MS,
    });
    const target = new URL(request.redirectUri);
    target.searchParams.set('code', code);
    if (request.state) target.searchParams.set('state', request.state);
    res.redirect(303, target.toString());
  });

  app.post('/login/oauth/access_token', (req, res) => {
    if (
      field(req.body, 'client_id') !== client.id ||
      field(req.body, 'client_secret') !== client.secret
    ) {
      res.status(401).json({
        error: 'incorrect_client_credentials',
        error_description: 'The client_id and/or client_secret passed are incorrect.',
      });
      return;
    }
    const code = field(req.body, 'code');
    const grant = codes.get(code);
    // A code is spent on first presentation, whatever the outcome.
    codes.delete(code);
    if (!grant || grant.expiresAt < Date.now() || grant.clientId !== client.id) {
      res.status(400).json({
        error: 'bad_verification_code',
        error_description: 'The code passed is incorrect or expired.',
      });
      return;
    }
    const redirectUri = field(req.body, 'redirect_uri');
    if (redirectUri && redirectUri !== grant.redirectUri) {
      res.status(400).json({
        error: 'redirect_uri_mismatch',
        error_description: 'The redirect_uri does not match the one the code was issued for.',
      });
      return;
    }
    const accessToken = `fgho_${randomBytes(20).toString('hex')}`;
    accessTokens.set(accessToken, grant.login);
    res.json({ access_token: accessToken, token_type: 'bearer', scope: 'user:email' });
  });

  function identityFor(req: Request, res: Response): FakeGithubIdentity | null {
    const match = /^(?:token|bearer)\s+(\S+)$/i.exec(req.headers.authorization ?? '');
    const login = match ? accessTokens.get(match[1]!) : undefined;
    const identity = login ? book.find(login) : undefined;
    if (!identity) {
      res.status(401).json({ message: 'Requires authentication' });
      return null;
    }
    return identity;
  }

  app.get('/user', (req, res) => {
    const identity = identityFor(req, res);
    if (identity) {
      const { id, login, name, email } = identity;
      res.json({ id, login, name, email });
    }
  });

  app.get('/user/emails', (req, res) => {
    const identity = identityFor(req, res);
    if (identity) {
      res.json([{ email: identity.email, primary: true, verified: true, visibility: 'public' }]);
    }
  });

  return app;
}
