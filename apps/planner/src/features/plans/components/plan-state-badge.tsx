import type { PlanState } from '@millrace/contracts';
import { planStateWords } from '../plan-words';

/** A plan's sign-off state: symbol and word, never colour alone. */
export function PlanStateBadge({ state }: { state: PlanState }) {
  const w = planStateWords[state];
  return (
    <span className={`inline-flex items-center gap-1 rounded border px-1.5 py-0.5 text-sm font-semibold ${w.className}`}>
      <span aria-hidden="true">{w.symbol}</span>
      {w.label}
    </span>
  );
}
