import { Router } from 'express';
import { scenarioCreateSchema, scenarioIdParamsSchema, scenarioUpdateSchema } from '@millrace/contracts';
import type { AppContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow } from '../auth/guard';
import { AppError } from '../http/app-error';
import { validate } from '../http/validate-request';
import { findScenario, listScenarios } from './scenarios.repository';
import { createScenario, removeScenario, updateScenario } from './scenarios.service';

/** CRUD /api/scenarios: planners write, planners, supervisors and admins read. */
export function scenariosRouter(ctx: AppContext): Router {
  const router = Router();
  const readers = allow('planner', 'supervisor', 'admin');
  const byId = validate({ params: scenarioIdParamsSchema });
  const create = validate({ body: scenarioCreateSchema });
  const update = validate({ params: scenarioIdParamsSchema, body: scenarioUpdateSchema });

  router.get('/api/scenarios', readers, async (_req, res) => {
    res.json(await listScenarios(ctx.dataSource.manager));
  });
  router.get('/api/scenarios/:id', allow('planner', 'supervisor', 'admin'), byId, async (_req, res) => {
    const { params } = byId.from(res);
    const scenario = await findScenario(ctx.dataSource.manager, params.id);
    if (!scenario) throw AppError.notFound(`Scenario ${params.id} does not exist.`);
    res.json(scenario);
  });
  router.post('/api/scenarios', allow('planner'), create, async (_req, res) => {
    const { body } = create.from(res);
    res.status(201).json(await createScenario(ctx.dataSource, body, currentPerson(res).id));
  });
  router.patch('/api/scenarios/:id', allow('planner'), update, async (_req, res) => {
    const { params, body } = update.from(res);
    res.json(await updateScenario(ctx.dataSource, params.id, body));
  });
  router.delete('/api/scenarios/:id', allow('planner'), byId, async (_req, res) => {
    const { params } = byId.from(res);
    await removeScenario(ctx.dataSource, params.id);
    res.status(204).end();
  });
  return router;
}
