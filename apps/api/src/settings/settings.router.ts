import { Router } from 'express';
import { plantSettingsUpdateSchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow, everyRole } from '../auth/guard';
import { validate } from '../http/validate-request';
import { settingsWriters } from '../master-data/roles';
import { readPlantSettings } from './settings.repository';
import { updatePlantSettings } from './update-plant-settings.use-case';

/** Plant settings: read by every signed-in role (plant name, currency, week start), saved by admin and planner. */
export function settingsRouter({ dataSource }: ApiContext): Router {
  const router = Router();

  router.get('/api/settings', allow(...everyRole), async (_req, res) => {
    res.json(await readPlantSettings(dataSource.manager));
  });

  const updateInput = validate({ body: plantSettingsUpdateSchema });
  router.put('/api/settings', allow(...settingsWriters), updateInput, async (_req, res) => {
    res.json(await updatePlantSettings(dataSource, updateInput.from(res).body));
  });

  return router;
}
