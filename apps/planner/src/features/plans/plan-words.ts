import type { AuditEntry, CrossCheckStatus, PlanState, RunState, SolveStatus } from '@millrace/contracts';

/** Words shown for each plan state (DESIGN.md vocabulary), with a symbol so state never rests on colour. */
export const planStateWords: Record<PlanState, { label: string; symbol: string; className: string }> = {
  draft: { label: 'Draft', symbol: '✎', className: 'border-line bg-paper text-ink' },
  submitted: { label: 'Submitted', symbol: '⇢', className: 'border-race-600 bg-race-50 text-race-800' },
  approved: { label: 'Approved', symbol: '✓', className: 'border-fine-700 bg-fine-50 text-fine-700' },
  returned: { label: 'Returned', symbol: '↩', className: 'border-over-700 bg-over-50 text-over-700' },
  released: { label: 'Released', symbol: '★', className: 'border-fine-700 bg-fine-50 text-fine-700' },
  superseded: { label: 'Superseded', symbol: '⊘', className: 'border-line bg-paper text-ink-soft' },
};

export const solveStatusWords: Record<SolveStatus, string> = {
  not_solved: 'Not solved yet',
  queued: 'Waiting for a solver',
  solving: 'Solving',
  solved: 'Solved and checked',
  check_failed: 'Check failed',
  infeasible: 'No feasible plan',
  unbounded: 'Unbounded model',
  stopped_early: 'Stopped before optimal',
  cancelled: 'Cancelled',
  failed: 'Solve failed',
};

export const runStateWords: Record<RunState, string> = {
  queued: 'Waiting for a solver',
  running: 'Solving',
  finished: 'Finished',
  failed: 'Failed',
  cancelled: 'Cancelled',
};

/** The cross-check of a certificate, in words; "unverified" and "not finished" are said plainly. */
export const crossCheckWords: Record<CrossCheckStatus, { label: string; symbol: string }> = {
  running: { label: 'Cross-check still running', symbol: '…' },
  verified: { label: 'Verified by a second solver', symbol: '✓' },
  unverified: { label: 'Unverified: the second solver disagrees', symbol: '✕' },
  not_finished: { label: 'Cross-check not finished', symbol: '?' },
};

export const auditActionWords: Record<AuditEntry['action'], string> = {
  create: 'Created',
  solve: 'Solve started',
  solved: 'Solved',
  submit: 'Submitted',
  approve: 'Approved',
  return: 'Returned',
  release: 'Released',
  supersede: 'Superseded',
};

/** A money figure in the plant's currency: '12,345.60 EUR'. */
export function formatMoney(value: number, currency: string): string {
  return `${new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 }).format(value)} ${currency}`;
}

/** A signed difference: '+12.5', '−3', '±0' (the sign is part of the text, never colour alone). */
export function formatSigned(value: number, digits = 2, fixed = false): string {
  const rounded = Number(value.toFixed(digits));
  if (rounded === 0) return '±0';
  const text = new Intl.NumberFormat('en-GB', { minimumFractionDigits: fixed ? digits : 0, maximumFractionDigits: digits }).format(Math.abs(rounded));
  return rounded > 0 ? `+${text}` : `−${text}`;
}

/** A small number in scientific form for residuals and gaps: '3.2e-9'. */
export function formatTiny(value: number | null): string {
  if (value === null || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  return value.toExponential(1).replace('e+', 'e');
}

/** '2026-12-02T01:02:03Z' → '2 Dec 2026, 01:02' (UTC, so every reader sees the same time). */
export function formatDateTime(iso: string): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return `${d.toLocaleDateString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' })}, ${d.toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit', timeZone: 'UTC' })} UTC`;
}
