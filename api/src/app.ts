import compression from 'compression';
import express from 'express';
import helmet from 'helmet';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import { getConfig } from './config/env';
import { sequelize as defaultSequelize } from './models';
import { httpLogger } from './logger';
import { errorHandler } from './middlewares/error-handler';
import { notFoundHandler, spaRouter } from './middlewares/not-found';
import { createRateLimits } from './middlewares/rate-limit';
import { jsonBody, wellFormedPath } from './middlewares/request-shape';
import { authRouter } from './modules/auth/auth.routes';
import { healthRouter } from './modules/health/health.routes';
import { invitationsRouter } from './modules/invitations/invitations.routes';
import { membersRouter } from './modules/members/members.routes';
import { projectsRouter } from './modules/projects/projects.routes';
import { designsRouter } from './modules/designs/designs.routes';
import { proposalsRouter } from './modules/proposals/proposals.routes';
import { calcRouter } from './modules/calc/calc.routes';
import { brandRouter } from './modules/brand/brand.routes';
import { billingRouter, billingWebhookRouter } from './modules/billing/billing.routes';
import { versionsRouter } from './modules/versions/versions.routes';
import { reviewersRouter } from './modules/reviewers/reviewers.routes';
import { auditRouter, projectAuditRouter } from './modules/audit/audit.routes';
import { priceBooksRouter } from './modules/price-books/price-books.routes';
import { estimatesRouter, projectEstimatesRouter } from './modules/estimates/estimates.routes';
import openapi from './openapi.json' with { type: 'json' };

export interface AppOptions {
  /** Database the health check probes (tests point it at a closed port to see a 503). */
  healthDatabase?: Sequelize;
  /** Folder of the built SPA; defaults to WEB_DIST. */
  webDist?: string | null;
  /** Extra routes under /api/v1, mounted last (the benchmark's bare route). */
  extraRoutes?: (api: express.Router) => void;
  /** Request and error log; defaults to the process logger (tests capture it). */
  logger?: Logger;
}

/** Builds the Express app without listening; server.ts listens and tests drive it with supertest. */
export function createApp(options: AppOptions = {}): express.Express {
  const config = getConfig();
  const app = express();
  app.set('trust proxy', config.trustProxy);
  app.disable('x-powered-by');

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // A Vite build loads only its own module scripts; ant-design-vue injects <style>
          // elements at run time (CSS-in-JS), hence inline styles; fonts ship with the app.
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          frameSrc: ["'self'", 'blob:'],
          workerSrc: ["'self'", 'blob:'],
          objectSrc: ["'none'"],
          baseUri: ["'self'"],
          formAction: ["'self'"],
          frameAncestors: ["'none'"],
          // Served over plain HTTP on loopback locally; TLS is the proxy's job.
          upgradeInsecureRequests: null,
        },
      },
    }),
  );
  app.use(httpLogger(options.logger));
  app.use(wellFormedPath);
  // Answers made at run time (the API's JSON, index.html) compressed as they go: brotli or gzip
  // by Accept-Encoding, above 1 kB. The built SPA's files are compressed once at build time and
  // sent as they are (spaRouter); a response already encoded is left alone. Sessions are bearer
  // tokens the browser never attaches by itself, so a compressed answer gives a third party no
  // secret to guess at (the BREACH attack needs one sent with its own requests).
  app.use(compression());

  const limits = createRateLimits(defaultSequelize);
  const api = express.Router();
  // Nothing the API answers may be kept by a browser or a proxy: sessions, tokens, firm data.
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  // The payment service's events are verified on their raw bytes: before the JSON parser.
  api.use('/billing', billingWebhookRouter());
  api.use(jsonBody());
  api.get('/openapi.json', (_req, res) => {
    res.json(openapi);
  });
  api.use('/health', healthRouter(options.healthDatabase ?? defaultSequelize));
  api.use('/auth', authRouter(limits));
  api.use('/invitations', invitationsRouter(limits));
  api.use('/members', reviewersRouter());
  api.use('/members', membersRouter());
  api.use('/projects', designsRouter());
  api.use('/projects', versionsRouter());
  api.use('/projects', projectAuditRouter());
  api.use('/audit', auditRouter());
  api.use('/projects', proposalsRouter());
  api.use('/projects', projectsRouter());
  api.use('/firm/brand', brandRouter());
  api.use('/billing', billingRouter());
  api.use('/price-books', priceBooksRouter());
  api.use('/projects', projectEstimatesRouter());
  api.use('/estimates', estimatesRouter());

  // engine routes
  // (the engine helper mounts calcRouter from './modules/calc/calc.routes' here: api.use('/calc', calcRouter))
  api.use('/calc', calcRouter());
  options.extraRoutes?.(api);

  api.use(notFoundHandler);
  app.use('/api/v1', api);
  app.use('/api', notFoundHandler);

  const webDist = options.webDist === undefined ? config.webDist : options.webDist;
  if (webDist !== null) app.use(spaRouter(webDist));
  app.use(notFoundHandler);
  app.use(errorHandler);
  return app;
}
