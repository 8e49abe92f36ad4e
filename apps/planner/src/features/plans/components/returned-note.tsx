import { usePlanAudit } from '../api/get-plan-audit';
import { formatDateTime } from '../plan-words';

/** For a returned plan: who sent it back, when, and why (the latest "return" in the audit trail). */
export function ReturnedNote({ planId }: { planId: number }) {
  const audit = usePlanAudit(planId);
  const last = audit.data?.filter((e) => e.action === 'return').at(-1);
  if (!last) return null;
  return (
    <div role="note" aria-label="Returned with a comment" className="rounded border border-over-700 bg-over-50 p-3">
      <p className="font-semibold text-over-700">
        <span aria-hidden="true">↩ </span>Returned by {last.actor.name} on {formatDateTime(last.at)}
      </p>
      <p className="mt-1 whitespace-pre-line">{last.comment}</p>
    </div>
  );
}
