import { Router } from 'express';
import { homeQuerySchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow, everyRole } from '../auth/guard';
import { validate } from '../http/validate-request';
import { getHomeSummary } from './get-home-summary.use-case';

/** The home page data, for every signed-in role (floor leads included). */
export function homeRouter({ dataSource }: ApiContext): Router {
  const router = Router();
  const input = validate({ query: homeQuerySchema });
  router.get('/api/home', allow(...everyRole), input, async (_req, res) => {
    res.json(await getHomeSummary(dataSource, input.from(res).query));
  });
  return router;
}
