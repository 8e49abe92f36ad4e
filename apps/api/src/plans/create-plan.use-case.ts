import type { DataSource } from 'typeorm';
import type { DataIssue, PlanCreate, PlanDetail } from '@millrace/contracts';
import { planCreateSchema } from '@millrace/contracts';
import { validatePlanningData } from '@millrace/plan-model';
import type { SignedInPerson } from '../auth/current-person';
import { AppError } from '../http/app-error';
import { assertWeekStarts } from '../master-data/week-alignment';
import { loadPlanningData } from '../planning-data/load-planning-data';
import { applyScenarioOverrides } from '../scenarios/apply-scenario-overrides';
import { findScenario } from '../scenarios/scenarios.repository';
import { appendAudit } from '../sign-off/audit.repository';
import { canonicalJson, sha256 } from './canonical-hash';
import { findPlanDetail, insertPlan } from './plans.repository';

/**
 * A new plan version in state draft: read the plant's current data (with the scenario's
 * overrides when one is named), validate it for the horizon (422 naming every issue, nothing
 * written), then store the snapshot and its hash with the version and note it in the audit trail.
 */
export async function createPlan(ds: DataSource, input: PlanCreate, person: SignedInPerson): Promise<PlanDetail> {
  const request = planCreateSchema.parse(input);
  const id = await ds.transaction(async (db) => {
    const scenario = request.scenarioId === undefined ? null : await findScenario(db, request.scenarioId);
    if (request.scenarioId !== undefined && !scenario)
      throw AppError.unprocessable('The scenario does not exist.', [{ item: `scenario ${request.scenarioId}`, message: `Scenario ${request.scenarioId} does not exist.` }]);

    if (request.firstWeek) await assertWeekStarts(db, [{ path: 'firstWeek', date: request.firstWeek }]);
    const current = await loadPlanningData(db, request.horizonWeeks, request.firstWeek ? { from: request.firstWeek } : {});
    const { data, issues: scenarioIssues } = scenario ? applyScenarioOverrides(current, scenario.overrides) : { data: current, issues: [] };
    const issues: DataIssue[] = [...scenarioIssues, ...validatePlanningData(data, request.horizonWeeks).map(({ item, message }) => ({ item, message }))];
    if (issues.length > 0) {
      throw AppError.unprocessable(
        `The planning data has ${issues.length} issue${issues.length === 1 ? '' : 's'}; fix ${issues.length === 1 ? 'it' : 'them'} and create the plan again.`,
        issues,
      );
    }
    const snapshot = data;
    const inputs = canonicalJson(snapshot);
    const inputsHash = sha256(inputs);
    const planId = await insertPlan(db, {
      name: request.name,
      horizonWeeks: request.horizonWeeks,
      firstWeek: snapshot.weeks[0].startDate,
      lastWeek: snapshot.weeks[request.horizonWeeks - 1].startDate,
      scenarioId: scenario?.id ?? null,
      scenarioName: scenario?.name ?? null,
      smoothing: request.smoothing,
      wholeUnits: request.wholeUnits,
      currency: snapshot.plant.currency,
      inputs,
      inputsHash,
      createdBy: person.id,
    });
    await appendAudit(db, {
      planId,
      actor: person,
      action: 'create',
      fromState: null,
      toState: 'draft',
      comment: scenario ? `Built from scenario "${scenario.name}".` : null,
      inputsHash,
      resultsHash: null,
    });
    return planId;
  });
  return (await findPlanDetail(ds.manager, id))!;
}
