import path from 'node:path';
import express, { type RequestHandler, type Router } from 'express';
import { notFound } from '../errors';

/** JSON 404 for any path nobody answered. */
export const notFoundHandler: RequestHandler = (req) => {
  throw notFound(`Nothing at ${req.method} ${req.baseUrl}${req.path}.`);
};

/**
 * Serves the built SPA: hashed assets with a long cache, and index.html (never cached) for
 * any other GET outside /api so the client router can take over. A missing file that looks
 * like an asset (has an extension) stays a 404.
 */
export function spaRouter(webDist: string): Router {
  const root = path.resolve(webDist);
  const router = express.Router();
  router.use(
    express.static(root, {
      index: false,
      setHeaders(res, filePath) {
        if (filePath.includes(`${path.sep}assets${path.sep}`)) {
          res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        }
      },
    }),
  );
  router.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/') || path.extname(req.path) !== '') {
      next();
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(path.join(root, 'index.html'), (error) => {
      if (error) next(notFound('The web app has not been built.'));
    });
  });
  return router;
}
