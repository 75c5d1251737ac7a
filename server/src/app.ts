import express, { type Express, Router } from 'express';
import helmet from 'helmet';
import * as OpenApiValidator from 'express-openapi-validator';
import { apiKeysRouter } from './api-keys/api-keys.routes.js';
import { auditRouter } from './audit/audit.routes.js';
import { authenticate } from './auth/authenticate.js';
import { authorizeOperation, requireAuthorizedOperation } from './auth/authorize-operation.js';
import { type AppContext, logLine } from './context.js';
import { embedDemoRouter } from './embed-demo/embed-demo.routes.js';
import { embedTokensRouter } from './embed-tokens/embed-tokens.routes.js';
import { healthRouter } from './health/health.routes.js';
import { embedCorsHeaders, embedPreflight, embedRefusalCors } from './http/embed-cors.js';
import { problemHandler, RouteNotFoundError } from './http/problem.js';
import { rateLimits } from './http/rate-limit.js';
import { requestId } from './http/request-id.js';
import { mountStaticSites } from './http/static-sites.js';
import { mailboxRouter } from './mail/mailbox.routes.js';
import { loadApiDocument } from './openapi/api-document.js';
import { sessionsRouter } from './sessions/sessions.routes.js';
import { usersRouter } from './users/users.routes.js';
import { computeRouter } from './compute/compute.routes.js';
import { modelsRouter } from './models/models.routes.js';

/** The feature routers mounted under `/api/v1` (authorised before validation by `authorizeOperation`). */
function apiV1(context: AppContext): Router {
  const router = Router();
  router.use(sessionsRouter(context));
  router.use(usersRouter(context));
  router.use(apiKeysRouter(context));
  router.use(embedTokensRouter(context));
  router.use(auditRouter(context));
  router.use(mailboxRouter(context));
  router.use(computeRouter(context));
  router.use(modelsRouter(context));
  return router;
}

/**
 * Builds the Express app (never listens): helmet, request ids, rate limits, the bearer strategy,
 * authorisation by each operation's `x-polewright-permission`, JSON bodies, OpenAPI validation of every
 * `/api` request, the routers, the static front ends and the one problem+json error handler.
 */
export function createApp(context: AppContext): Express {
  const app = express();
  const log = (message: string) => logLine(context, message);
  app.disable('x-powered-by');
  app.set('query parser', 'simple');
  app.use(requestId());
  // plain HTTP is the default deployment here: no upgrade-insecure-requests (it breaks Swagger UI off localhost)
  app.use(helmet({ contentSecurityPolicy: { directives: { upgradeInsecureRequests: null } }, crossOriginResourcePolicy: { policy: 'cross-origin' } }));
  app.use('/api', embedPreflight(), embedRefusalCors());
  for (const limiter of rateLimits(context.config.rateLimitPerMinute)) app.use('/api', limiter);
  app.use('/api', authenticate(context), embedCorsHeaders());
  // who may call an operation is decided before its body is read or validated: 401/403, never a 400 first
  app.use('/api', authorizeOperation(loadApiDocument(context.config.openapiPath)));
  app.use('/api', express.json({ limit: context.config.jsonBodyLimit, type: ['application/json', 'application/*+json'] }));
  app.use(
    OpenApiValidator.middleware({
      apiSpec: context.config.openapiPath,
      validateRequests: { allowUnknownQueryParameters: false, allErrors: true },
      validateResponses: context.config.validateResponses,
      validateSecurity: { handlers: { bearerAuth: (req) => Boolean((req as express.Request).principal) } },
      fileUploader: false,
      ignoreUndocumented: false,
      ignorePaths: /^\/api\/docs(\/|$)/,
      // dereferenced: refs between split files then never point into another schema's inside
      $refParser: { mode: 'dereference' },
    }),
  );
  app.use('/api', healthRouter(context));
  app.use('/api/v1', requireAuthorizedOperation(), apiV1(context));
  app.use('/api', (req, _res, next) => next(new RouteNotFoundError(req.method, req.originalUrl.split('?')[0] ?? '/')));
  // the embedding demo's stand-in for a host backend (mints its embed token), before the static demo/embed
  app.use(embedDemoRouter(context));
  mountStaticSites(app, log);
  app.use((req, _res, next) => next(new RouteNotFoundError(req.method, req.originalUrl.split('?')[0] ?? '/')));
  app.use(problemHandler((message, error) => (context.log ?? console.error)(`${message}: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`)));
  return app;
}
