import { Router } from 'express';
import type { ApiContext } from '../app-context';
import { open } from '../auth/guard';
import { checkDatabase } from './check-database';

/** GET /api/health: no sign-in; 200 when the database answers, 503 otherwise. */
export function healthRouter({ dataSource }: ApiContext): Router {
  const router = Router();
  router.get('/api/health', open(), async (_req, res) => {
    const db = await checkDatabase(dataSource);
    res.set('Cache-Control', 'no-store');
    if (db === 'up') res.json({ status: 'ok', db });
    else res.status(503).json({ status: 'degraded', db });
  });
  return router;
}
