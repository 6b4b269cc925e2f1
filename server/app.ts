import cookieParser from 'cookie-parser';
import express, { type Express, Router } from 'express';
import { authRouter } from './auth/auth.router';
import { AuthService } from './auth/auth.service';
import { type PassportInstance, createPassport } from './auth/passport';
import { sessionMiddleware } from './auth/session';
import { checkRunsRouter } from './checks/check-runs.router';
import { servesDevOutbox, usesTls } from './config';
import { findingExportsRouter } from './findings/finding-exports.router';
import { findingsRouter } from './findings/findings.router';
import { runReportRouter } from './findings/run-report.router';
import { savedViewpointsRouter } from './findings/saved-viewpoints.router';
import type { AppContext } from './http/app-context';
import { type CsrfProtection, createCsrfProtection } from './http/csrf';
import { apiNotFound, errorMiddleware } from './http/error-middleware';
import { jsonBody } from './http/json-body';
import { requestLogger } from './http/request-logger';
import { securityHeaders } from './http/security-headers';
import { webClientRouter } from './http/web-client';
import { notificationsRouter } from './notifications/notifications.router';
import { outboxRouter } from './outbox/outbox.router';
import { modelFeatureRouter } from './models/model-feature.router';
import { membersRouter } from './projects/members.router';
import { projectsRouter } from './projects/projects.router';
import { resultMappingsRouter } from './results/result-mappings.router';
import { resultSetsRouter } from './results/result-sets.router';
import { resultUploadsRouter } from './results/result-uploads.router';
import { usersRouter } from './users/users.router';

interface ApiDeps {
  passport: PassportInstance;
  csrf: CsrfProtection;
}

/**
 * The resource routers under /api, in one list: a new feature adds one line here. Each router
 * guards its own routes (requireProjectPermission, requireAdmin, requireSignedIn).
 */
function featureRouters(ctx: AppContext, deps: ApiDeps): [path: string, router: Router][] {
  return [
    ['/auth', authRouter(ctx, deps)],
    ['/users', usersRouter(ctx)],
    ['/projects', projectsRouter(ctx)],
    ['/projects/:projectId/members', membersRouter(ctx)],
    ['/projects/:projectId', modelFeatureRouter(ctx)],
    ['/projects/:projectId/results/uploads', resultUploadsRouter(ctx)],
    ['/projects/:projectId/results', resultSetsRouter(ctx)],
    ['/projects/:projectId/result-mappings', resultMappingsRouter(ctx)],
    ['/projects/:projectId/checks', checkRunsRouter(ctx)],
    ['/projects/:projectId/findings', findingExportsRouter(ctx)],
    ['/projects/:projectId/findings', findingsRouter(ctx)],
    ['/projects/:projectId/viewpoints', savedViewpointsRouter(ctx)],
    ['/projects/:projectId/checks/:runId/report.pdf', runReportRouter(ctx)],
    ['/notifications', notificationsRouter(ctx)],
    ...(servesDevOutbox(ctx.config) ? ([['/dev', outboxRouter(ctx.dataSource)]] as [string, Router][]) : []),
  ];
}

/** Builds the Express app from the context; never listens (main.ts does). */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.locals.context = ctx;
  app.disable('x-powered-by');
  app.set('trust proxy', ctx.config.trustProxy);
  app.use(requestLogger(ctx.logger));
  app.use(securityHeaders({ tls: usesTls(ctx.config) }));
  app.use('/api', apiRouter(ctx));
  app.use(webClientRouter(ctx.config.webRoot));
  app.use(errorMiddleware);
  return app;
}

function apiRouter(ctx: AppContext): Router {
  const secureCookies = usesTls(ctx.config);
  const api = Router();
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });
  api.get('/health', (_req, res) => {
    res.json({ status: 'ok' });
  });

  api.use(jsonBody());
  api.use(cookieParser());
  api.use(sessionMiddleware({ store: ctx.sessionStore, secret: ctx.config.sessionSecret, secureCookies }));
  const passport = createPassport(new AuthService(ctx.dataSource));
  api.use(passport.initialize(), passport.session());
  const csrf = createCsrfProtection({ secret: ctx.config.sessionSecret, secureCookies });
  api.use(csrf.protect);

  for (const [path, router] of featureRouters(ctx, { passport, csrf })) api.use(path, router);
  api.use(apiNotFound);
  return api;
}
