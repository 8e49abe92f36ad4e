import type { SheetPlan } from '@millrace/contracts';
import { formatShortDay } from '../sheet-words';

/** Choose the plan version, the week and (optionally) one work center; the choice lives in the URL. */
export function SheetChoices({
  plans,
  planId,
  week,
  weeks,
  workCenter,
  onChange,
}: {
  plans: SheetPlan[];
  planId: number;
  week: string | undefined;
  weeks: string[];
  workCenter: string | undefined;
  onChange: (next: { plan?: number; week?: string; workCenter?: string }) => void;
}) {
  const select = 'rounded border border-line bg-panel px-2 py-1 font-normal';
  return (
    <div className="flex flex-wrap items-end gap-4">
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Plan version
        <select className={select} value={planId} onChange={(e) => onChange({ plan: Number(e.target.value) })}>
          {plans.some((p) => p.id === planId) ? null : <option value={planId}>#{planId}</option>}
          {plans.map((p) => (
            <option key={p.id} value={p.id}>
              #{p.id} {p.name} ({p.state})
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1 text-sm font-semibold">
        Week
        <select className={select} value={week ?? weeks[0] ?? ''} onChange={(e) => onChange({ plan: planId, week: e.target.value, workCenter })}>
          {weeks.map((w) => (
            <option key={w} value={w}>
              Week of {formatShortDay(w)} ({w})
            </option>
          ))}
        </select>
      </label>
    </div>
  );
}
