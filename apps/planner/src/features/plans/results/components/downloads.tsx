/** Links to the exact MPS model that was solved and to the plan lines as CSV (same-origin, session cookie). */
export function Downloads({ planId }: { planId: number }) {
  const linkClass = 'rounded border border-line bg-panel px-3 py-1.5 font-semibold text-race-700 hover:bg-race-50';
  return (
    <div className="flex flex-wrap gap-2" role="group" aria-label="Downloads">
      <a className={linkClass} href={`/api/plans/${planId}/model.mps`} download={`plan-${planId}.mps`}>
        <span aria-hidden="true">⤓ </span>Download MPS model
      </a>
      <a className={linkClass} href={`/api/plans/${planId}/lines.csv`} download={`plan-${planId}-lines.csv`}>
        <span aria-hidden="true">⤓ </span>Download plan lines (CSV)
      </a>
    </div>
  );
}
