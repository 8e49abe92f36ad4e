import { Router } from 'express';
import { outboxQuerySchema } from '@millrace/contracts';
import type { AppContext } from '../app-context';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { listOutbox } from './outbox.repository';

/** GET /api/outbox — admins see mail waiting to go out and mail that could not be delivered. */
export function outboxRouter(ctx: AppContext): Router {
  const router = Router();
  const input = validate({ query: outboxQuerySchema });
  router.get('/api/outbox', allow('admin'), input, async (_req, res) => {
    const { query } = input.from(res);
    res.json(await listOutbox(ctx.dataSource.manager, query.state ? [query.state] : ['pending', 'failed']));
  });
  return router;
}
