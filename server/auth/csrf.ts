import type { Request, RequestHandler } from 'express';
import { publicUrl, type Env } from '@server/config/env.ts';
import { AppError } from '@server/http/errors.ts';

const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);
const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]']);

function originOf(value: string | undefined): string | null {
  if (!value) return null;
  try {
    const url = new URL(value);
    return url.protocol === 'http:' || url.protocol === 'https:' ? url.origin : null;
  } catch {
    return null;
  }
}

/** The origins this app answers as: its public address, and on loopback the address asked for. */
function ownOrigins(req: Request, env: Env): string[] {
  const origins = [new URL(publicUrl(env)).origin];
  const host = req.headers.host;
  if (host) {
    const requested = originOf(`${req.protocol}://${host}`);
    if (requested && LOOPBACK_HOSTS.has(new URL(requested).hostname)) origins.push(requested);
  }
  return origins;
}

/**
 * Refuses a write under `/api` or `/auth` that rides on the session cookie when the page that
 * sent it is not ours: the `Origin` header (or, without one, the `Referer`) must name this app.
 * SameSite=Lax already keeps the cookie off most cross-site writes; this covers the rest
 * (sibling subdomains, older browsers). Requests with a Bearer token carry no ambient
 * credential and pass.
 */
export function refuseCrossSiteWrites(env: Env): RequestHandler {
  return (req, _res, next) => {
    const guarded = req.path.startsWith('/api/') || req.path.startsWith('/auth/');
    if (!guarded || !UNSAFE_METHODS.has(req.method) || req.currentUser?.via !== 'session') {
      next();
      return;
    }
    // An Origin header, when sent, decides alone (`null` included); Referer only stands in for it.
    const { origin, referer } = req.headers;
    const sender = originOf(origin ?? referer);
    if (!sender || !ownOrigins(req, env).includes(sender)) {
      throw new AppError('forbidden', 'Cross-site request refused.');
    }
    next();
  };
}
