import path from 'node:path';
import express, { type RequestHandler, type Router } from 'express';
import expressStaticGzip from 'express-static-gzip';
import { notFound } from '../errors';

/** JSON 404 for any path nobody answered. */
export const notFoundHandler: RequestHandler = (req) => {
  throw notFound(`Nothing at ${req.method} ${req.baseUrl}${req.path}.`);
};

/** Vite names every file under assets/ by its content's hash: a new build means new names. */
const IMMUTABLE = 'public, max-age=31536000, immutable';

/**
 * Serves the built SPA. Files under assets/ are named by their content's hash, so they may be
 * kept for a year unasked (immutable); anything else, index.html above all, is checked with the
 * server on every use (no-cache). The build writes each text file also as .br and .gz
 * (vite-plugin-compression2): express-static-gzip sends the one the browser accepts, brotli
 * first, with `Vary: Accept-Encoding`. index.html answers every other GET outside /api so the
 * client router can take over; a missing file that looks like an asset (has an extension)
 * stays a 404, and so does the dot-folder .vite (the build's manifest).
 */
export function spaRouter(webDist: string): Router {
  const root = path.resolve(webDist);
  const assets = `${path.sep}assets${path.sep}`;
  const serve = expressStaticGzip(root, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      setHeaders(res, filePath) {
        res.setHeader('Cache-Control', filePath.includes(assets) ? IMMUTABLE : 'no-cache');
      },
    },
  }) as RequestHandler;
  const router = express.Router();
  router.use(serve);
  router.get('/{*splat}', (req, res, next) => {
    if (req.path === '/api' || req.path.startsWith('/api/') || path.extname(req.path) !== '') {
      next();
      return;
    }
    req.url = '/index.html';
    serve(req, res, (error?: unknown) => {
      next(error ?? notFound('The web app has not been built.'));
    });
  });
  return router;
}
