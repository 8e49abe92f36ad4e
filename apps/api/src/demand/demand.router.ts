import { Router } from 'express';
import { demandBatchSchema, demandQuerySchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { masterDataReaders, masterDataWriters } from '../master-data/roles';
import { applyDemandChanges } from './apply-demand-changes.use-case';
import { getDemandGrid } from './get-demand-grid.use-case';

/** Demand per product and week: firm orders and forecasts, read as a grid and saved as a batch. */
export function demandRouter({ dataSource }: ApiContext): Router {
  const router = Router();

  const gridInput = validate({ query: demandQuerySchema });
  router.get('/api/demand', allow(...masterDataReaders), gridInput, async (_req, res) => {
    res.json(await getDemandGrid(dataSource.manager, gridInput.from(res).query));
  });

  const batchInput = validate({ body: demandBatchSchema });
  router.put('/api/demand', allow(...masterDataWriters), batchInput, async (_req, res) => {
    res.json(await applyDemandChanges(dataSource, batchInput.from(res).body));
  });

  return router;
}
