import type { Certificate } from '@millrace/contracts';
import { formatNumber } from '@/lib/format';
import { crossCheckWords, formatMoney, formatTiny } from '../plan-words';

const solverNames: Record<NonNullable<Certificate['crossCheck']>['solver'], string> = {
  'javascript-lp-solver': 'javascript-lp-solver (simplex)',
  highs: 'HiGHS',
  barrier: 'log-barrier method',
};

/**
 * The certificate of a plan: duality gap and residuals measured on the LP as solved, and the
 * independent cross-check. "Unverified" and "not finished" are said plainly, never as a pass.
 */
export function CertificatePanel({ certificate, currency }: { certificate: Certificate | null; currency: string }) {
  if (!certificate) {
    return (
      <section aria-labelledby="certificate-heading" className="rounded border border-line bg-panel p-3 text-sm">
        <h2 id="certificate-heading" className="font-semibold">
          Certificate
        </h2>
        <p className="mt-1 text-ink-soft">No certificate yet: the plan version has not been solved to the end.</p>
      </section>
    );
  }
  const check = certificate.crossCheck;
  const checkWords = check ? crossCheckWords[check.status] : null;
  const checkTone =
    check?.status === 'verified' ? 'text-fine-700' : check?.status === 'unverified' ? 'text-fault-700' : 'text-over-700';
  return (
    <section aria-labelledby="certificate-heading" className="rounded border border-line bg-panel p-3 text-sm">
      <h2 id="certificate-heading" className="font-semibold">
        Certificate
      </h2>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 tabular-nums">
        <dt>Duality gap (relative)</dt>
        <dd>{formatTiny(certificate.relativeGap)}</dd>
        <dt>Primal residual</dt>
        <dd>{formatTiny(certificate.primalResidual)}</dd>
        <dt>Dual residual</dt>
        <dd>{formatTiny(certificate.dualResidual)}</dd>
        <dt>Iterations</dt>
        <dd>
          {certificate.iterations} in {formatNumber(certificate.seconds)} s
        </dd>
      </dl>
      <h3 className="mt-3 font-semibold">Cross-check</h3>
      {check && checkWords ? (
        <div className="mt-1 flex flex-col gap-1">
          <p className={`font-semibold ${checkTone}`}>
            <span aria-hidden="true">{checkWords.symbol} </span>
            {checkWords.label}
          </p>
          <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 tabular-nums">
            <dt>Second solver</dt>
            <dd>{solverNames[check.solver]}</dd>
            <dt>Its margin</dt>
            <dd>{check.objective === null ? (check.status === 'running' ? 'not yet' : 'not reached') : formatMoney(check.objective, currency)}</dd>
            <dt>Plan's margin</dt>
            <dd>{check.planObjective === null ? '—' : formatMoney(check.planObjective, currency)}</dd>
            <dt>Relative difference</dt>
            <dd>{formatTiny(check.relativeDifference)}</dd>
            <dt>Time</dt>
            <dd>{check.seconds === null ? '—' : `${formatNumber(check.seconds)} s`}</dd>
          </dl>
          {check.message ? <p className="text-ink-soft">{check.message}</p> : null}
        </div>
      ) : (
        <p className="mt-1 font-semibold text-over-700">
          <span aria-hidden="true">? </span>Cross-check not started
        </p>
      )}
    </section>
  );
}
