import { Router, type Response } from 'express';
import { planCompareQuerySchema, planCreateSchema, planIdParamsSchema, planRunParamsSchema, planUpdateSchema } from '@millrace/contracts';
import type { AppContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow } from '../auth/guard';
import { AppError } from '../http/app-error';
import { validate } from '../http/validate-request';
import { findRun } from '../solver-jobs/solve-jobs.repository';
import { comparePlans } from './compare-plans.use-case';
import { createPlan } from './create-plan.use-case';
import { planLinesCsv, readPlanMps, readPlanResults } from './plan-results.use-case';
import { findPlanDetail, listPlans } from './plans.repository';
import { renamePlan } from './rename-plan.use-case';
import { cancelRun, solvePlan } from './solve-plan.use-case';

/**
 * Plan versions: create (planner), list and read (planner, supervisor, admin), solve off the
 * request thread with readable progress and cancel, results by part, CSV and the exact MPS.
 */
export function plansRouter(ctx: AppContext): Router {
  const router = Router();
  const db = () => ctx.dataSource.manager;
  const readers = ['planner', 'supervisor', 'admin'] as const;
  const byId = validate({ params: planIdParamsSchema });
  const byRun = validate({ params: planRunParamsSchema });
  const create = validate({ body: planCreateSchema });
  const rename = validate({ params: planIdParamsSchema, body: planUpdateSchema });
  const compare = validate({ query: planCompareQuerySchema });

  router.get('/api/plans', allow(...readers), async (_req, res) => {
    res.json(await listPlans(db()));
  });
  router.post('/api/plans', allow('planner'), create, async (_req, res) => {
    const { body } = create.from(res);
    res.status(201).json(await createPlan(ctx.dataSource, body, currentPerson(res)));
  });
  router.get('/api/plans/compare', allow(...readers), compare, async (_req, res) => {
    const { query } = compare.from(res);
    res.json(await comparePlans(db(), query.a, query.b));
  });
  router.get('/api/plans/:id', allow(...readers), byId, async (_req, res) => {
    const { params } = byId.from(res);
    const plan = await findPlanDetail(db(), params.id);
    if (!plan) throw AppError.notFound(`Plan version ${params.id} does not exist.`);
    res.json(plan);
  });
  router.patch('/api/plans/:id', allow('planner'), rename, async (_req, res) => {
    const { params, body } = rename.from(res);
    res.json(await renamePlan(ctx.dataSource, params.id, body));
  });

  router.post('/api/plans/:id/solve', allow('planner'), byId, async (_req, res) => {
    const { params } = byId.from(res);
    res.status(202).json(await solvePlan(ctx.dataSource, params.id, currentPerson(res)));
  });
  router.get('/api/plans/:id/runs/:runId', allow(...readers), byRun, async (_req, res) => {
    const { params } = byRun.from(res);
    const run = await findRun(db(), params.id, params.runId);
    if (!run) throw AppError.notFound(`Run ${params.runId} of plan version ${params.id} does not exist.`);
    const { kind: _kind, ...progress } = run;
    res.json(progress);
  });
  router.post('/api/plans/:id/runs/:runId/cancel', allow('planner'), byRun, async (_req, res) => {
    const { params } = byRun.from(res);
    res.status(202).json(await cancelRun(ctx.dataSource, params.id, params.runId));
  });

  const results = async (res: Response) => readPlanResults(db(), byId.from(res).params.id);
  router.get('/api/plans/:id/results', allow(...readers), byId, async (_req, res) => {
    res.json(await results(res));
  });
  router.get('/api/plans/:id/lines', allow(...readers), byId, async (_req, res) => {
    res.json((await results(res)).lines);
  });
  router.get('/api/plans/:id/load', allow(...readers), byId, async (_req, res) => {
    res.json((await results(res)).load);
  });
  router.get('/api/plans/:id/material-calls', allow(...readers), byId, async (_req, res) => {
    res.json((await results(res)).materialCalls);
  });
  router.get('/api/plans/:id/bottlenecks', allow(...readers), byId, async (_req, res) => {
    const r = await results(res);
    res.json({ bottlenecks: r.bottlenecks, reducedCosts: r.reducedCosts });
  });
  router.get('/api/plans/:id/unmet', allow(...readers), byId, async (_req, res) => {
    res.json((await results(res)).unmet);
  });
  router.get('/api/plans/:id/certificate', allow(...readers), byId, async (_req, res) => {
    const { params } = byId.from(res);
    const plan = await findPlanDetail(db(), params.id);
    if (!plan) throw AppError.notFound(`Plan version ${params.id} does not exist.`);
    if (!plan.certificate) throw AppError.conflict(`Plan version ${params.id} has no certificate yet (its solve status is ${plan.solveStatus}).`);
    res.json(plan.certificate);
  });
  router.get('/api/plans/:id/lines.csv', allow(...readers), byId, async (_req, res) => {
    const { params } = byId.from(res);
    res
      .attachment(`plan-${params.id}-lines.csv`)
      .type('text/csv; charset=utf-8')
      .send(planLinesCsv(await results(res)));
  });
  router.get('/api/plans/:id/model.mps', allow(...readers), byId, async (_req, res) => {
    const { params } = byId.from(res);
    const mps = await readPlanMps(db(), params.id);
    res.attachment(`plan-${params.id}.mps`).type('text/plain; charset=utf-8').send(mps);
  });
  return router;
}
