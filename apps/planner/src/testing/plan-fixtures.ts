import type { Bottleneck, Certificate, LoadRow, PlanDetail, PlanResults, PlanReview, RunProgress } from '@millrace/contracts';

/**
 * Small hand-made plan answers for component tests (shapes from @millrace/contracts; values
 * invented for the test only, never checked as results of a plan).
 */
export const verifiedCertificate: Certificate = {
  primalResidual: 2.7e-16,
  dualResidual: 1.2e-18,
  relativeGap: 2.0e-11,
  iterations: 18,
  seconds: 3.3,
  crossCheck: {
    solver: 'highs',
    status: 'verified',
    objective: 1000.0000001,
    planObjective: 1000,
    relativeDifference: 1e-10,
    seconds: 2.2,
    message: 'HiGHS found the same optimum.',
  },
};

export function planDetail(overrides: Partial<PlanDetail> = {}): PlanDetail {
  return {
    id: 1,
    name: 'Week plan',
    state: 'draft',
    solveStatus: 'solved',
    horizonWeeks: 4,
    firstWeek: '2026-12-07',
    lastWeek: '2026-12-28',
    scenarioId: null,
    scenarioName: null,
    smoothing: { enabled: false, weight: 0 },
    wholeUnits: true,
    objective: 1000,
    currency: 'EUR',
    inputsHash: 'a'.repeat(64),
    createdBy: { id: 2, name: 'Pat Planner' },
    createdAt: '2026-12-02T08:00:00.000Z',
    updatedAt: '2026-12-02T08:00:00.000Z',
    version: 1,
    latestRunId: 5,
    certificate: verifiedCertificate,
    solveMessage: null,
    checkViolations: [],
    rounding: null,
    infeasibility: null,
    resultsHash: 'b'.repeat(64),
    modelSize: { rows: 10, columns: 20, nonzeros: 40 },
    ...overrides,
  };
}

export function runProgress(overrides: Partial<RunProgress> = {}): RunProgress {
  return {
    runId: 5,
    planId: 1,
    state: 'running',
    cancelRequested: false,
    iteration: 3,
    relativeGap: 1e-2,
    primalObjective: null,
    elapsedSeconds: 1.5,
    message: null,
    createdAt: '2026-12-02T08:00:00.000Z',
    startedAt: '2026-12-02T08:00:01.000Z',
    finishedAt: null,
    ...overrides,
  };
}

const loadRow = (workCenter: string, workCenterName: string, week: number, loadHours: number, availableHours: number, overtimeHours = 0): LoadRow => ({
  workCenter,
  workCenterName,
  week,
  weekStart: ['2026-12-07', '2026-12-14', '2026-12-21', '2026-12-28'][week - 1],
  loadHours,
  availableHours,
  percentOfAvailable: (loadHours / availableHours) * 100,
  overtimeHours,
});

export const testLoad: LoadRow[] = [
  loadRow('EDGE', 'Edge bander', 1, 30, 40),
  loadRow('EDGE', 'Edge bander', 2, 46, 40, 6),
  loadRow('SAW', 'Saw', 1, 20, 40),
  loadRow('SAW', 'Saw', 2, 40, 40),
];

export const testBottlenecks: Bottleneck[] = [
  {
    kind: 'capacity',
    item: 'EDGE',
    itemName: 'Edge bander',
    unit: 'per_hour',
    weeks: [{ week: 2, weekStart: '2026-12-14', value: 38.1 }],
    message: 'Edge bander: one more hour is worth 38.10 in week 2',
  },
  {
    kind: 'capacity',
    item: 'SAW',
    itemName: 'Saw',
    unit: 'per_hour',
    weeks: [{ week: 2, weekStart: '2026-12-14', value: 1e-9 }],
    message: 'Saw: noise',
  },
];

export const testResults: PlanResults = {
  planId: 1,
  objective: 1000,
  currency: 'EUR',
  lines: [
    { product: 'T-1', productName: 'Test table', week: 1, weekStart: '2026-12-07', demand: 10, make: 10, ship: 10, stock: 0, late: 0 },
    { product: 'T-1', productName: 'Test table', week: 2, weekStart: '2026-12-14', demand: 12, make: 8, ship: 8, stock: 0, late: 4 },
  ],
  load: testLoad,
  materialCalls: [],
  bottlenecks: testBottlenecks,
  reducedCosts: [],
  unmet: [],
  totals: {
    margin: 990,
    revenue: 2000,
    materialSpend: 500,
    extraUnitCost: 0,
    overtimeCost: 300,
    holdingCost: 10,
    latePenalty: 200,
    endBackorderPenalty: 0,
    safetyShortfallPenalty: 0,
    smoothingCost: 0,
    overtimeHours: 6,
    unmetQty: 4,
  },
};

export function planReview(plan: PlanDetail): PlanReview {
  const { certificate, solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize, ...summary } = plan;
  void solveMessage, checkViolations, rounding, infeasibility, resultsHash, modelSize;
  return {
    plan: summary,
    baseline: { ...summary, id: 9, name: 'Last week', state: 'approved' },
    certificate,
    changes: {
      margin: { before: 900, after: 990, delta: 90 },
      overtimeHours: { before: 0, after: 6, delta: 6 },
      unmetQty: { before: 4, after: 4, delta: 0 },
      quantities: [{ product: 'T-1', weekStart: '2026-12-14', before: 10, after: 8, delta: -2 }],
      load: [{ workCenter: 'EDGE', weekStart: '2026-12-14', before: 40, after: 46, delta: 6 }],
      overtime: [{ workCenter: 'EDGE', weekStart: '2026-12-14', before: 0, after: 6, delta: 6 }],
    },
    unmet: { before: [], after: [] },
    cautions: [
      { kind: 'advisory', item: null, week: null, message: 'This plan is advisory.' },
      { kind: 'working_time', item: 'EDGE', week: 2, message: 'Edge bander, week of 2026-12-14: 6 h overtime puts each crew at about 46 h that week, above the plant’s limit of 45 h.' },
    ],
  };
}
