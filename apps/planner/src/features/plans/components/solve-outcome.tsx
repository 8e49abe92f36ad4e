import type { PlanDetail } from '@millrace/contracts';
import { formatNumber } from '@/lib/format';
import { formatMoney, solveStatusWords } from '../plan-words';

/** What the last solve ended with, said in words: infeasibility, failed checks, rounding gap. */
export function SolveOutcome({ plan }: { plan: PlanDetail }) {
  const bad = ['check_failed', 'infeasible', 'unbounded', 'failed', 'stopped_early'].includes(plan.solveStatus);
  return (
    <div className="flex flex-col gap-2 text-sm">
      <p className={bad ? 'font-semibold text-fault-700' : 'font-semibold'}>
        {bad ? <span aria-hidden="true">✕ </span> : null}
        {solveStatusWords[plan.solveStatus]}
      </p>
      {plan.solveMessage ? <p>{plan.solveMessage}</p> : null}
      {plan.infeasibility ? (
        <div role="alert" className="rounded border border-fault-700 bg-fault-50 p-3">
          <p className="font-semibold">{plan.infeasibility.summary}</p>
          <ul className="mt-1 list-disc pl-5">
            {plan.infeasibility.conflicts.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {plan.checkViolations.length > 0 ? (
        <div role="alert" className="rounded border border-fault-700 bg-fault-50 p-3">
          <p className="font-semibold">
            The independent check found {plan.checkViolations.length} violation{plan.checkViolations.length === 1 ? '' : 's'} against the planning data; the
            plan is not shown as valid.
          </p>
          <ul className="mt-1 list-disc pl-5">
            {plan.checkViolations.slice(0, 20).map((v, i) => (
              <li key={`${v.item}-${i}`}>{v.message}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {plan.rounding ? (
        <p>
          Margin, whole units: {formatMoney(plan.rounding.margin, plan.currency)}; LP bound: {formatMoney(plan.rounding.lpBound, plan.currency)}{' '}
          (gap {formatNumber(plan.rounding.gap)}, {formatNumber(plan.rounding.relativeGap * 100)} %)
          {plan.rounding.outcome === 'violations_remain' ? '; the repair pass could not make every row hold.' : '.'}
        </p>
      ) : null}
    </div>
  );
}
