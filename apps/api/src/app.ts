import express, { type Express, type Router } from 'express';
import type { ApiContext, AppContext } from './app-context';
import { authRouter } from './auth/auth.router';
import { checkOrigin } from './auth/csrf';
import { loadSession } from './auth/load-session';
import { createLucia } from './auth/lucia';
import { healthRouter } from './health/health.router';
import { apiHeaders } from './http/api-headers';
import { apiNotFound } from './http/api-not-found';
import { errorHandler } from './http/error-handler';
import { requireDatabase } from './http/require-database';
import { servePlanner } from './http/serve-planner';
import { peopleRouter } from './people/people.router';
import { settingsRouter } from './settings/settings.router';
import { productsRouter } from './products/products.router';
import { workCentersRouter } from './work-centers/work-centers.router';
import { materialsRouter } from './materials/materials.router';
import { demandRouter } from './demand/demand.router';
import { homeRouter } from './home/home.router';
import { plansRouter } from './plans/plans.router';
import { scenariosRouter } from './scenarios/scenarios.router';
import { signOffRouter } from './sign-off/sign-off.router';
import { outboxRouter } from './mail/outbox.router';
import { invitationsRouter } from './invitations/invitations.router';
import { importsRouter } from './imports/imports.router';
import { exportsRouter } from './exports/exports.router';
import { shiftSheetsRouter } from './shift-sheets/shift-sheets.router';
import { devMailRouter } from './dev-mail/dev-mail.router';

/** Largest JSON body accepted (bigger → 413 payload_too_large). */
export const jsonBodyLimit = '1mb';

/**
 * Every area router, mounted at the root: routers declare full paths (`/api/people/:id`) and put
 * `allow(...)` or `open()` first on each route (the route-matrix test enforces it).
 * Areas append their router factory here.
 */
const areaRouters: Array<(ctx: ApiContext) => Router> = [authRouter, peopleRouter, settingsRouter, productsRouter, workCentersRouter, materialsRouter, demandRouter, homeRouter, plansRouter, signOffRouter, scenariosRouter, outboxRouter, invitationsRouter, importsRouter, exportsRouter, shiftSheetsRouter, devMailRouter];

/** Builds the Express app (no listen): health, DB gate, CSRF, JSON, sessions, areas, 404, errors. */
export function createApp(ctx: AppContext): Express {
  const app = express();
  app.disable('x-powered-by');
  const api: ApiContext = { ...ctx, lucia: createLucia(ctx.dataSource, ctx.config.http.publicUrl) };

  app.use('/api', apiHeaders);
  app.use(healthRouter(api)); // answers even while the database is down
  app.use('/api', requireDatabase(ctx.dataSource));
  app.use('/api', checkOrigin(ctx.config.http.publicUrl));
  app.use('/api', express.json({ limit: jsonBodyLimit }));
  app.use('/api', loadSession(api.lucia));
  for (const router of areaRouters) app.use(router(api));
  app.use('/api', apiNotFound);
  if (ctx.config.plannerDist) servePlanner(app, ctx.config.plannerDist);
  app.use(errorHandler());
  return app;
}
