import path from 'node:path';
import express, { Router } from 'express';

// Angular's production build puts a content hash in every bundle name (main-ABCD1234.js).
const HASHED_ASSET = /-[A-Z0-9]{8}\.(?:js|css|mjs)$/;

/**
 * Serves the built Angular client from `webRoot`: files as they are, and index.html for any
 * other GET outside /api so client-side routes survive a reload. Without a build it answers a
 * page saying how to make one.
 */
export function webClientRouter(webRoot: string): Router {
  const router = Router();
  router.use(
    express.static(webRoot, {
      index: false,
      setHeaders(res, filePath) {
        res.setHeader('Cache-Control', HASHED_ASSET.test(filePath) ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  router.get('/{*splat}', (req, res, next) => {
    // A missing file (its last segment has an extension) is a 404, not the app.
    if (req.path === '/api' || req.path.startsWith('/api/') || path.extname(req.path) !== '') {
      next();
      return;
    }
    res.sendFile(path.join(webRoot, 'index.html'), { headers: { 'Cache-Control': 'no-cache' } }, (error) => {
      if (!error) return;
      if ((error as NodeJS.ErrnoException).code !== 'ENOENT') {
        next(error);
        return;
      }
      res.status(503).type('html').send(NOT_BUILT_PAGE);
    });
  });
  return router;
}

const NOT_BUILT_PAGE = `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>Taulens — client not built</title></head>
<body style="font-family:sans-serif;max-width:40rem;margin:3rem auto;line-height:1.5">
<h1>The Taulens web client has not been built</h1>
<p>The server is running and its API answers under <code>/api</code>, but there is no built client to show.</p>
<p>Run <code>npm run build</code> (or <code>npm start</code>, which builds and starts), then reload this page.</p>
</body></html>`;
