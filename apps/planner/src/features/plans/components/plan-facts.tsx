import type { PlanDetail } from '@millrace/contracts';
import { formatNumber, formatWeek } from '@/lib/format';
import { formatDateTime, formatMoney, solveStatusWords } from '../plan-words';

/** The settings a plan version was built with, and its margin. */
export function PlanFacts({ plan }: { plan: PlanDetail }) {
  const rows: [string, string][] = [
    ['Horizon', `${plan.horizonWeeks} weeks, ${formatWeek(plan.firstWeek)} to ${formatWeek(plan.lastWeek)}`],
    ['Built from', plan.scenarioName ? `Scenario “${plan.scenarioName}”` : 'Current data'],
    ['Smoothing', plan.smoothing.enabled ? `On, weight ${formatNumber(plan.smoothing.weight)}` : 'Off'],
    ['Whole units', plan.wholeUnits ? 'On (rounded after the solve)' : 'Off (fractional quantities)'],
    ['Solve', solveStatusWords[plan.solveStatus]],
    ['Margin, LP optimum (objective)', plan.objective === null ? '—' : formatMoney(plan.objective, plan.currency)],
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
