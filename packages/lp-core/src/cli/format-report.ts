/** The two printed forms of a solve report: one JSON line, or a short readable summary. */
import type { SolveReport } from './solve-file';

/** Exactly one line; non-finite numbers become null. */
export function reportAsJson(report: SolveReport): string {
  return JSON.stringify(report, (_key, value) => (typeof value === 'number' && !Number.isFinite(value) ? null : value));
}

export function reportAsText(report: SolveReport): string {
  const lines = [
    `problem        ${report.problem} (${report.rows} rows, ${report.cols} columns, ${report.nonzeros} non-zeros)`,
    `solver         ${report.solver === 'ipm' ? 'interior point' : 'log barrier'}`,
    `status         ${report.status}`,
    `objective      ${report.objective === null ? '—' : report.objective.toPrecision(12)}`,
    `iterations     ${report.iterations}`,
    `time           ${report.seconds.toFixed(3)} s`,
    `certificate    primal residual ${report.primalResidual.toExponential(2)}, dual residual ${report.dualResidual.toExponential(2)}, relative gap ${report.relativeGap.toExponential(2)}`,
  ];
  if (report.integerColumnsRelaxed > 0) lines.push(`note           ${report.integerColumnsRelaxed} integer columns solved as continuous (relaxation)`);
  if (report.message) lines.push(`message        ${report.message}`);
  return lines.join('\n');
}
