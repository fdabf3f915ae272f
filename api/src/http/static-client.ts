import { existsSync } from 'node:fs';
import path from 'node:path';
import express, { Router } from 'express';

/**
 * Serves the built Angular client. Hashed bundles are cached for a year;
 * index.html never, so a new build is picked up at once. Any other GET that
 * is not an API route gets index.html (client-side routes).
 */
export function staticClient(distDir: string): Router {
  const router = Router();
  const root = path.resolve(distDir);
  const index = path.join(root, 'index.html');
  router.use(
    express.static(root, {
      index: false,
      setHeaders(res, file) {
        res.setHeader('Cache-Control', /[.-][A-Z0-9]{8,}\.(js|css|woff2?)$/i.test(file) ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get(/^\/(?!api\/|auth\/).*/, (_req, res, next) => {
    if (!existsSync(index)) {
      res.status(503).type('text').send('The client is not built yet: run `npm run build` (npm start does it for you).');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(index, (err) => err && next(err));
  });
  return router;
}
