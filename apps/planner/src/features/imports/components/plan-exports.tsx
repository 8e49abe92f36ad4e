import { useState } from 'react';
import { useSolvedPlans } from '../api/get-solved-plans';

const linkClass = 'text-race-700 underline';

/** Plan lines and material calls of a solved plan version, as CSV or XLSX. */
export function PlanExports() {
  const plans = useSolvedPlans();
  const [chosen, setChosen] = useState<number | null>(null);
  const plan = chosen ?? plans.data?.[0]?.id ?? null;
  if (!plans.data || plans.data.length === 0 || plan === null) return null;
  const href = (kind: string, format: string) => `/api/exports/${kind}?format=${format}&plan=${plan}`;
  return (
    <section aria-labelledby="plan-exports-heading" className="mb-8 flex flex-wrap items-end gap-4 rounded border border-line bg-panel p-4 text-sm">
      <h2 id="plan-exports-heading" className="w-full text-lg font-semibold">
        Plan results as a file
      </h2>
      <label className="flex flex-col gap-1 font-semibold">
        Plan version
        <select value={plan} onChange={(e) => setChosen(Number(e.target.value))} className="rounded border border-line bg-panel px-2 py-1.5 font-normal">
          {plans.data.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name} ({p.firstWeek} to {p.lastWeek})
            </option>
          ))}
        </select>
      </label>
      {[
        ['plan-lines', 'Plan lines'],
        ['material-calls', 'Material calls'],
      ].map(([kind, label]) => (
        <span key={kind} className="flex flex-col gap-1">
          <span className="font-semibold">{label}</span>
          <span className="flex gap-3">
            <a className={linkClass} href={href(kind, 'csv')} download aria-label={`${label} as CSV`}>
              CSV
            </a>
            <a className={linkClass} href={href(kind, 'xlsx')} download aria-label={`${label} as XLSX`}>
              XLSX
            </a>
          </span>
        </span>
      ))}
    </section>
  );
}
