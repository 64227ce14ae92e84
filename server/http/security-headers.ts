import helmet from 'helmet';
import type { RequestHandler } from 'express';
import { publicUrl, type Env } from '@server/config/env.ts';

/**
 * Security headers (helmet) with a Content-Security-Policy for the built client: scripts,
 * fonts, images and API calls from this origin only; Monaco's workers come from our own
 * bundle (Vite may hand them over as blob: URLs); Monaco and React set inline styles, so
 * style-src keeps 'unsafe-inline'. Nothing may frame the app. HSTS and the upgrade of insecure
 * requests only when the public address is https: on plain http (loopback, development) they
 * would make the browser ask for addresses that do not answer.
 */
export function securityHeaders(env: Env): RequestHandler {
  const https = publicUrl(env).startsWith('https:');
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        baseUri: ["'self'"],
        scriptSrc: ["'self'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        fontSrc: ["'self'", 'data:'],
        imgSrc: ["'self'", 'data:', 'blob:'],
        connectSrc: ["'self'"],
        workerSrc: ["'self'", 'blob:'],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        formAction: ["'self'"],
        ...(https ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: https ? { maxAge: 180 * 24 * 60 * 60 } : false,
    crossOriginEmbedderPolicy: false,
  });
}
