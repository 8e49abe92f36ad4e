import type { PlanDetail } from '@millrace/contracts';
import { formatNumber, formatWeek } from '@/lib/format';
import { marginFigures, marginLabels } from '../margin-words';
import { formatDateTime, formatMoney, solveStatusWords } from '../plan-words';

function marginRows(plan: PlanDetail): [string, string][] {
  const m = marginFigures(plan);
  const money = (v: number | null) => (v === null ? '—' : formatMoney(v, plan.currency));
  if (m.kind === 'whole_units')
    return [
      [marginLabels.wholeUnits, money(m.margin)],
      [marginLabels.lpBound, money(m.lpBound)],
    ];
  if (m.kind === 'lp_bound_only') return [[marginLabels.lpBound, money(m.lpBound)]];
  if (m.kind === 'lp_optimum') return [[marginLabels.lpOptimum, money(m.margin)]];
  return [[plan.wholeUnits ? marginLabels.wholeUnits : marginLabels.lpOptimum, '—']];
}

/** The settings a plan version was built with, and its margin (whole units first when they are on). */
export function PlanFacts({ plan }: { plan: PlanDetail }) {
  const rows: [string, string][] = [
    ['Horizon', `${plan.horizonWeeks} weeks, ${formatWeek(plan.firstWeek)} to ${formatWeek(plan.lastWeek)}`],
    ['Built from', plan.scenarioName ? `Scenario “${plan.scenarioName}”` : 'Current data'],
    ['Smoothing', plan.smoothing.enabled ? `On, weight ${formatNumber(plan.smoothing.weight)}` : 'Off'],
    ['Whole units', plan.wholeUnits ? 'On (rounded after the solve)' : 'Off (fractional quantities)'],
    ['Solve', solveStatusWords[plan.solveStatus]],
    ...marginRows(plan),
    ['Created', `${formatDateTime(plan.createdAt)}${plan.createdBy ? ` by ${plan.createdBy.name}` : ''}`],
  ];
  if (plan.modelSize) rows.push(['Model size', `${plan.modelSize.rows} rows × ${plan.modelSize.columns} columns, ${plan.modelSize.nonzeros} nonzeros`]);
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 rounded border border-line bg-panel p-3 text-sm">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-semibold">{k}</dt>
          <dd>{v}</dd>
        </div>
      ))}
    </dl>
  );
}
