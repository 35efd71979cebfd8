import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { randomUUID } from 'node:crypto';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import { RequestContext } from '@mikro-orm/core';
import type { Env } from './env.ts';
import { loggableUrl, type Logger } from './logger.ts';
import type { Orm } from './db/orm.ts';
import { apiNotFound, errorHandler } from './middleware/error-handler.ts';
import { sameOriginMutations } from './middleware/same-origin.ts';
import type { Auth } from './auth/auth.ts';
import type { Storage } from './adapters/storage.ts';
import type { Payments } from './adapters/payments.ts';
import type { Jobs } from './adapters/jobs.ts';
import type { RateLimits } from './lib/rate-limits.ts';
import { paymentsWebhookRouter } from './features/checkout/payments-webhook.router.ts';
import { storefrontOrdersRouter } from './features/orders/storefront-orders.router.ts';
import { storefrontCheckoutRouter } from './features/checkout/storefront-checkout.router.ts';
import { storefrontReplacementsRouter } from './features/review/storefront-replacements.router.ts';
import { storefrontProofsRouter } from './features/prep/storefront-proofs.router.ts';
import { myOrdersRouter } from './features/orders/my-orders.router.ts';
import { workspaceRouter, type WorkspaceRoute } from './middleware/workspace-routes.ts';
import { healthRouter } from './features/health/health.router.ts';
import { storefrontRouter } from './features/studios/storefront.router.ts';
import { studioRoutes } from './features/studios/studio.routes.ts';
import { accountsRouter } from './features/accounts/accounts.router.ts';
import { teamRoutes } from './features/team/team.routes.ts';
import { invitesRouter } from './features/team/invites.router.ts';
import { platformRouter } from './features/platform/platform.router.ts';
import { catalogRoutes } from './features/catalog/catalog.routes.ts';
import { shippingRoutes } from './features/shipping/shipping.routes.ts';
import { workspaceOrderRoutes } from './features/orders/orders.routes.ts';
import { reviewRoutes } from './features/review/review.routes.ts';
import { prepRoutes } from './features/prep/prep.routes.ts';
import { refundRoutes } from './features/checkout/refunds.routes.ts';
import { productionRoutes } from './features/production/production.routes.ts';
import { auditRoutes } from './features/audit/audit.routes.ts';
import { storefrontCatalogRouter } from './features/catalog/storefront-catalog.router.ts';
import { storefrontPhotosRouter } from './features/photos/storefront-photos.router.ts';

export type AppDeps = {
  env: Env;
  orm: Orm;
  logger: Logger;
  version: string;
  auth: Auth;
  storage: Storage;
  payments: Payments;
  jobs: Jobs;
  limits: RateLimits;
};

/** Every route under /api/studios/:studioSlug, from every feature. The isolation tests walk this list. */
export function workspaceRoutes(deps: AppDeps): WorkspaceRoute[] {
  return [
    ...studioRoutes(deps),
    ...teamRoutes(deps),
    ...catalogRoutes(deps),
    ...shippingRoutes(),
    ...workspaceOrderRoutes(deps),
    ...reviewRoutes(deps),
    ...prepRoutes(deps),
    ...refundRoutes(deps),
    ...productionRoutes(deps),
    ...auditRoutes(),
  ];
}

/** Where presigned upload URLs point: the endpoint itself, or the bucket's own host. */
function storageOrigins(env: Env): string[] {
  const endpoint = new URL(env.S3_ENDPOINT);
  return env.S3_FORCE_PATH_STYLE ? [endpoint.origin] : [`${endpoint.protocol}//${env.S3_BUCKET}.${endpoint.host}`];
}

/** Builds the Express app. It never listens: server/index.ts does, and tests use it directly. */
export function createApp(deps: AppDeps): Express {
  const { env, orm, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');

  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          // The built client has no inline script; styles come from our own bundle.
          'script-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          // Browsers PUT uploads straight to object storage with presigned URLs.
          'connect-src': ["'self'", ...storageOrigins(env)],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(
    pinoHttp({
      logger,
      genReqId: (req, res) => {
        const incoming = req.headers['x-request-id'];
        const id = typeof incoming === 'string' && /^[\w-]{1,64}$/.test(incoming) ? incoming : randomUUID();
        res.setHeader('x-request-id', id);
        return id;
      },
      // One short line per request: no headers (cookies, keys) in the log.
      serializers: {
        req: (req: { id: string; method: string; url: string }) => ({ id: req.id, method: req.method, url: loggableUrl(req.url) }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
      customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : 'info'),
    }),
  );
  // The payment provider's signature covers the raw body: this route reads it before any parser.
  app.use('/api/payments/webhook', paymentsWebhookRouter(deps));
  app.use('/api', sameOriginMutations(env.APP_URL));
  app.use('/api', express.json({ limit: env.JSON_BODY_LIMIT }));
  // Each request gets its own identity map, so entities never leak between requests.
  app.use((_req, _res, next) => RequestContext.create(orm.em, next));

  app.use('/api/health', healthRouter({ orm, version: deps.version }));
  app.use('/api/auth', deps.auth.router);
  app.use('/api/storefront', storefrontRouter(deps));
  app.use('/api/storefront', storefrontCatalogRouter(deps));
  app.use('/api/storefront', storefrontPhotosRouter(deps));
  app.use('/api/storefront', storefrontCheckoutRouter(deps));
  app.use('/api/storefront', storefrontOrdersRouter(deps));
  app.use('/api/storefront', storefrontReplacementsRouter(deps));
  app.use('/api/storefront', storefrontProofsRouter(deps));
  app.use('/api', accountsRouter(deps));
  app.use('/api', myOrdersRouter(deps));
  app.use('/api/invites', invitesRouter(deps));
  app.use('/api/platform', platformRouter(deps));
  app.use('/api/studios/:studioSlug', workspaceRouter({ auth: deps.auth, orm, routes: workspaceRoutes(deps) }));
  app.use('/api', apiNotFound);

  const clientDir = resolve(env.CLIENT_DIST);
  if (existsSync(resolve(clientDir, 'index.html'))) {
    app.use(express.static(clientDir, { index: false, maxAge: '1h', immutable: false }));
    // Client-side routes: every other GET gets the app shell, which shows its own not-found page.
    app.get('/{*path}', (_req, res) => res.sendFile(resolve(clientDir, 'index.html')));
  }

  app.use(errorHandler);
  return app;
}
