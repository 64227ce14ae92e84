import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { type Router } from 'express';

/**
 * Serves the built client: hashed assets with long caching, and index.html for every
 * other non-API path so that client-side routes survive a reload (history fallback).
 */
export function clientAppRouter(clientDir: string): Router {
  const root = path.resolve(clientDir);
  const indexFile = path.join(root, 'index.html');
  if (!existsSync(indexFile)) {
    throw new Error(`Built client not found at ${indexFile}; run npm run build first.`);
  }
  const router = express.Router();
  router.use(
    '/assets',
    express.static(path.join(root, 'assets'), {
      immutable: true,
      maxAge: '1y',
      fallthrough: false,
    }),
  );
  router.use(express.static(root, { index: false }));
  router.get('/{*splat}', (req, res, next) => {
    if (req.path.startsWith('/api/') || req.path.startsWith('/auth/')) {
      next();
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
  return router;
}
