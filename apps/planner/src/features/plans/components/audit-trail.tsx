import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { roleLabels } from '@/lib/authorization';
import { usePlanAudit } from '../api/get-plan-audit';
import { auditActionWords, formatDateTime, planStateWords } from '../plan-words';

/** The plan version's append-only audit trail: who, when, from, to, comment, hashes. */
export function AuditTrail({ planId }: { planId: number }) {
  const audit = usePlanAudit(planId);
  if (audit.isPending) return <Loading label="Loading the audit trail…" />;
  if (audit.isError) return <ErrorState error={audit.error} onRetry={() => void audit.refetch()} />;
  if (audit.data.length === 0) return <EmptyState title="Nothing recorded yet" />;
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse bg-panel text-sm">
        <caption className="sr-only">Audit trail of plan version {planId}</caption>
        <thead className="bg-race-50">
          <tr>
            {['When', 'Who', 'What', 'From → to', 'Comment', 'Inputs / results hash'].map((h) => (
              <th key={h} scope="col" className="border border-line px-2 py-1.5 text-left">
                {h}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {audit.data.map((e) => (
            <tr key={e.id}>
              <td className="border border-line px-2 py-1.5 whitespace-nowrap">{formatDateTime(e.at)}</td>
              <td className="border border-line px-2 py-1.5">
                {e.actor.name}
                {e.actor.role ? <span className="text-ink-soft"> ({roleLabels[e.actor.role]})</span> : null}
              </td>
              <td className="border border-line px-2 py-1.5 font-semibold">{auditActionWords[e.action]}</td>
              <td className="border border-line px-2 py-1.5">
                {e.fromState ? planStateWords[e.fromState].label : '—'} → {planStateWords[e.toState].label}
              </td>
              <td className="border border-line px-2 py-1.5">{e.comment ?? ''}</td>
              <td className="border border-line px-2 py-1.5 font-mono text-xs" title={`${e.inputsHash} / ${e.resultsHash ?? '—'}`}>
                {e.inputsHash.slice(0, 10)} / {e.resultsHash ? e.resultsHash.slice(0, 10) : '—'}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
