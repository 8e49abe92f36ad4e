import type { SolveStatus } from '@millrace/contracts';

const outcomeWords: Record<SolveStatus, string> = {
  not_solved: 'not solved',
  queued: 'queued',
  solving: 'solving',
  solved: 'solved',
  check_failed: 'solved, but the independent check failed',
  infeasible: 'no plan meets every must-ship order and limit',
  unbounded: 'unbounded',
  stopped_early: 'stopped early',
  cancelled: 'cancelled',
  failed: 'failed',
};

/** The audit-trail note of a finished solve: "Run 12 finished: solved; objective 634,689.90 EUR." */
export function solvedAuditComment(runId: number, status: SolveStatus, objective: number | null, currency: string): string {
  const value =
    objective === null
      ? 'no objective'
      : `objective ${new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(objective)} ${currency}`;
  return `Run ${runId} finished: ${outcomeWords[status]}; ${value}.`;
}
