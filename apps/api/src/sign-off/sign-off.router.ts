import { Router } from 'express';
import { planIdParamsSchema, returnTransitionSchema, transitionSchema, type PlanAction } from '@millrace/contracts';
import type { AppContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow } from '../auth/guard';
import { AppError } from '../http/app-error';
import { validate } from '../http/validate-request';
import { findPlan } from '../plans/plans.repository';
import { listAudit } from './audit.repository';
import { reviewPlan } from './review-plan.use-case';
import { transitionPlan } from './transition-plan.use-case';

/**
 * Sign-off: POST /api/plans/:id/submit|approve|return|release (who may do what is decided by the
 * state machine, which answers 403 or 409), GET /api/plans/:id/audit, GET /api/plans/:id/review.
 */
export function signOffRouter(ctx: AppContext): Router {
  const router = Router();
  const withComment = validate({ params: planIdParamsSchema, body: transitionSchema });
  const withRequiredComment = validate({ params: planIdParamsSchema, body: returnTransitionSchema });
  const byId = validate({ params: planIdParamsSchema });

  const step = (action: PlanAction, input: typeof withComment | typeof withRequiredComment) =>
    router.post(`/api/plans/:id/${action}`, allow('planner', 'supervisor', 'admin'), input, async (_req, res) => {
      const { params, body } = input.from(res);
      const plan = await transitionPlan(ctx.dataSource, {
        planId: params.id,
        action,
        comment: body.comment && body.comment.length > 0 ? body.comment : null,
        person: currentPerson(res),
        publicUrl: ctx.config.http.publicUrl,
      });
      res.json(plan);
    });
  step('submit', withComment);
  step('approve', withComment);
  step('return', withRequiredComment);
  step('release', withComment);

  router.get('/api/plans/:id/audit', allow('planner', 'supervisor', 'admin'), byId, async (_req, res) => {
    const { params } = byId.from(res);
    if (!(await findPlan(ctx.dataSource.manager, params.id))) throw AppError.notFound(`Plan version ${params.id} does not exist.`);
    res.json(await listAudit(ctx.dataSource.manager, params.id));
  });

  router.get('/api/plans/:id/review', allow('planner', 'supervisor', 'admin'), byId, async (_req, res) => {
    const { params } = byId.from(res);
    res.json(await reviewPlan(ctx.dataSource.manager, params.id));
  });
  return router;
}
