import { existsSync } from 'node:fs';
import path from 'node:path';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import expressStaticGzip from 'express-static-gzip';

/** Vite names files under /assets/ by their content hash: they never change, so browsers keep them a year. */
const IMMUTABLE = 'public, max-age=31536000, immutable';

/**
 * Serves the built web app beside the API: precompressed .br/.gz files when the browser takes them (made
 * at build by vite-plugin-compression2), hashed assets cached for good, index.html and the rest revalidated
 * on every load, source maps only outside production, and index.html for the app's own deep links.
 */
export function webAppHandler(dir: string, production: boolean): RequestHandler | undefined {
  const index = path.join(dir, 'index.html');
  if (!existsSync(index)) return undefined;
  const files = expressStaticGzip(dir, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      setHeaders: (res, filePath) => {
        const rel = path.relative(dir, filePath).split(path.sep).join('/');
        res.setHeader('Cache-Control', rel.startsWith('assets/') ? IMMUTABLE : 'no-cache');
      },
    },
  });
  return (req: Request, res: Response, next: NextFunction) => {
    if (req.path === '/api' || req.path.startsWith('/api/')) return next();
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (production && req.path.endsWith('.map')) {
      res.status(404).type('text/plain').send('Not found');
      return;
    }
    files(req, res, (err?: unknown) => {
      if (err) return next(err);
      // Not a file: an app route (deep link) gets index.html; a missing asset gets 404.
      if (path.extname(req.path) !== '' || !req.accepts('html')) {
        res.status(404).type('text/plain').send('Not found');
        return;
      }
      res.setHeader('Cache-Control', 'no-cache');
      res.sendFile(index);
    });
  };
}
