import { Link } from 'react-router-dom';
import type { Role } from '@millrace/contracts';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { DataTable } from '@/components/ui/table/data-table';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { usePlan } from './api/get-plan';
import { usePlans } from './api/get-plans';
import { useSolvePlan } from './api/solve-plan';
import { AuditTrail } from './components/audit-trail';
import { CertificatePanel } from './components/certificate-panel';
import { PlanCreateForm } from './components/plan-create-form';
import { PlanFacts } from './components/plan-facts';
import { PlanStateBadge } from './components/plan-state-badge';
import { ReturnedNote } from './components/returned-note';
import { plansColumns } from './components/plans-columns';
import { RunProgressPanel } from './components/run-progress';
import { SignOffActions } from './components/sign-off-actions';
import { SolveOutcome } from './components/solve-outcome';
import { usePlanRows } from './components/use-plan-certificates';
import { canSolve } from './sign-off-rules';

export const linkButtonClass = 'rounded border border-race-700 bg-race-700 px-3 py-1.5 font-semibold text-white hover:bg-race-800';
export const linkSecondaryClass = 'rounded border border-line bg-panel px-3 py-1.5 font-semibold text-ink hover:bg-race-50';

/** Every plan version, filterable by state (filter kept in the URL). */
export function PlansListPage({ canCreate }: { canCreate: boolean }) {
  const plans = usePlans();
  const rows = usePlanRows(plans.data ?? []);
  const newLink = canCreate ? (
    <Link className={linkButtonClass} to={paths.planNew.getHref()}>
      New plan version
    </Link>
  ) : null;
  return (
    <>
      <PageHeader
        title="Plan versions"
        description="Each version is one solved plan over a horizon, taken through sign-off."
        actions={
          <>
            <Link className={linkSecondaryClass} to={paths.scenarios.getHref()}>
              Scenarios
            </Link>
            <Link className={linkSecondaryClass} to={paths.planCompare.getHref()}>
              Compare two versions
            </Link>
            {newLink}
          </>
        }
      />
      {plans.isPending ? <Loading label="Loading plan versions…" /> : null}
      {plans.isError ? <ErrorState error={plans.error} onRetry={() => void plans.refetch()} /> : null}
      {plans.data ? (
        <DataTable
          label="Plan versions"
          columns={plansColumns}
          data={rows}
          getRowId={(p) => String(p.id)}
          empty={
            <EmptyState title="No plan versions yet" action={newLink}>
              A plan version turns the current data (or a scenario) into a weekly production plan.
            </EmptyState>
          }
        />
      ) : null}
    </>
  );
}

export function PlanNewPage() {
  return (
    <>
      <PageHeader
        title="New plan version"
        description={
          <Link className="text-race-700 underline" to={paths.plans.getHref()}>
            Back to plan versions
          </Link>
        }
      />
      <PlanCreateForm />
    </>
  );
}

/** One plan version: its settings, solve with live progress, outcome, certificate, sign-off, audit trail. */
export function PlanPage({ planId, role }: { planId: number; role: Role }) {
  const plan = usePlan(planId);
  const plans = usePlans();
  const solve = useSolvePlan();
  // the review compares with the version approved last; approved, released and superseded versions all were approved once
  const baselineKnown = plans.data !== undefined;
  const anotherApproved = (plans.data ?? []).some((q) => q.id !== planId && (q.state === 'approved' || q.state === 'released' || q.state === 'superseded'));

  if (plan.isPending) return <Loading label="Loading the plan version…" />;
  if (plan.isError) return <ErrorState error={plan.error} onRetry={() => void plan.refetch()} />;
  const p = plan.data;
  const runId = (solve.data && solve.variables === planId ? solve.data.runId : null) ?? p.latestRunId;
  const running = p.solveStatus === 'queued' || p.solveStatus === 'solving';
  const hasResults = p.solveStatus === 'solved';

  return (
    <>
      <PageHeader
        title={`#${p.id} ${p.name}`}
        description={
          <span className="flex items-center gap-3">
            <PlanStateBadge state={p.state} />
            <Link className="text-race-700 underline" to={paths.plans.getHref()}>
              All plan versions
            </Link>
          </span>
        }
        actions={
          <>
            {hasResults ? (
              <Link className={linkButtonClass} to={paths.planResults.getHref(p.id)}>
                Open results
              </Link>
            ) : null}
            {hasResults && role === 'supervisor' && p.state === 'submitted' ? (
              <Link className={linkSecondaryClass} to={paths.planReview.getHref(p.id)}>
                Review for sign-off
              </Link>
            ) : hasResults && baselineKnown ? (
              anotherApproved ? (
                <Link className={linkSecondaryClass} to={paths.planReview.getHref(p.id)}>
                  Changes since last approved
                </Link>
              ) : (
                <span className="px-3 py-1.5 text-ink-soft">No approved version yet</span>
              )
            ) : null}
            <Link className={linkSecondaryClass} to={paths.planCompare.getHref(p.id)}>
              Compare
            </Link>
          </>
        }
      />
      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[2fr_1fr]">
        <div className="flex min-w-0 flex-col gap-4">
          {p.state === 'returned' ? <ReturnedNote planId={p.id} /> : null}
          <PlanFacts plan={p} />
          <section aria-labelledby="solve-heading" className="flex flex-col gap-3 rounded border border-line bg-panel p-3">
            <div className="flex flex-wrap items-center justify-between gap-2">
              <h2 id="solve-heading" className="font-semibold">
                Solve
              </h2>
              {canSolve(p.state, role) ? (
                <Button variant="primary" busy={solve.isPending} busyLabel="Starting…" disabled={running} onClick={() => solve.mutate(p.id)}>
                  {running ? 'Solving…' : p.solveStatus === 'not_solved' || p.solveStatus === 'cancelled' ? 'Solve' : 'Solve again'}
                </Button>
              ) : null}
            </div>
            {solve.isError ? <ErrorState error={solve.error} title="The solve did not start" /> : null}
            {runId !== null ? <RunProgressPanel key={runId} planId={p.id} runId={runId} canCancel={role === 'planner'} /> : null}
            {running ? null : <SolveOutcome plan={p} />}
          </section>
          <SignOffActions plan={p} role={role} />
          <section aria-labelledby="audit-heading" className="flex flex-col gap-2">
            <h2 id="audit-heading" className="text-lg font-semibold">
              Audit trail
            </h2>
            <AuditTrail planId={p.id} />
          </section>
        </div>
        <div className="flex flex-col gap-4">
          <CertificatePanel certificate={p.certificate} currency={p.currency} />
        </div>
      </div>
    </>
  );
}
