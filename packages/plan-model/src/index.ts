/**
 * @millrace/plan-model — the weekly planning model, pure TypeScript (imports only lp-core).
 *
 * The story of one plan version, as the API runs it:
 *   validatePlanningData(data, horizon)          → issues (422 when any)
 *   applyScenario(data, overrides)               → the scenario's data (when the plan has one)
 *   buildModel(data, { horizonWeeks, smoothing }) → { problem, index }   (writeMps(problem) = model.mps)
 *   solve(problem)  (lp-core, in a worker)       → SolveResult
 *   mapSolution(data, built, result)             → Plan (lines, load, bottleneck values, unmet orders, material calls)
 *   diagnoseMustShip(data, built)                → words for must-ship conflicts when the solve did not prove them
 *   roundPlan(data, plan)                        → whole units / batch multiples + gap to the LP bound
 *   checkPlan(data, plan)                        → violations (a plan with any is never shown as valid)
 *   comparePlans(a, b)                           → side-by-side JSON
 *   buildShiftSheets(data, approvedPlan, opts)   → per work center, day and shift: jobs, unscheduled work, working-time cautions
 */
export * from './planning-data';
export * from './validate-planning-data';
export * from './bom-graph';
export * from './capacity';
export * from './routing-load';
export * from './standard-cost';
export * from './demand';
export * from './model/model-index';
export { LpBuilder } from './model/lp-builder';
export * from './build-model';
export * from './plan';
export * from './plan-margin';
export * from './map-solution';
export * from './explain-unmet';
export * from './explain-infeasibility';
export { TOLERANCES } from './tolerances';
export * from './mrp';
export * from './material-calls';
export * from './plan-recompute';
export * from './round-plan';
export * from './check-plan';
export * from './material-supply';
export * from './scenario';
export * from './compare-plans';
export * from './must-ship-diagnosis';
export * from './shift-sheets/shift-sheet';
export * from './shift-sheets/shift-windows';
export * from './shift-sheets/week-operations';
export * from './shift-sheets/plant-clock';
export * from './shift-sheets/working-time';
export * from './shift-sheets/dispatch-priority';
export * from './shift-sheets/build-shift-sheets';
