import { Link, useSearchParams } from 'react-router-dom';
import type { Role, SheetPlan } from '@millrace/contracts';
import { addDays } from '@millrace/contracts';
import { Caution } from '@/components/ui/caution';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { shiftSheetsPdfHref, useShiftSheets } from './api/get-shift-sheets';
import { useSheetPlans } from './api/get-sheet-plans';
import { CrewCautions } from './components/crew-cautions';
import { SheetChoices } from './components/sheet-choices';
import { ShiftJobList } from './components/shift-job-list';
import { WeekTimeline } from './components/week-timeline';
import { formatMinutes, formatQuantityUnit, formatStamp, formatWeekOf, sheetPlanStateWords } from './sheet-words';

const parseId = (raw: string | null): number | null => (raw && /^\d+$/.test(raw) && Number(raw) > 0 ? Number(raw) : null);

/** The plan's week that holds today, if the plan covers today. */
function currentWeekOf(plan: SheetPlan | undefined, today = new Date().toISOString().slice(0, 10)): string | undefined {
  if (!plan || today < plan.firstWeek || today > addDays(plan.lastWeek, 6)) return undefined;
  const days = Math.round((Date.parse(`${today}T00:00:00Z`) - Date.parse(`${plan.firstWeek}T00:00:00Z`)) / 864e5);
  return addDays(plan.firstWeek, Math.floor(days / 7) * 7);
}

/** Weeks of a plan from its first to its last week start. */
function weeksOf(plan: SheetPlan | undefined): string[] {
  if (!plan) return [];
  const out: string[] = [];
  for (let w = plan.firstWeek; w <= plan.lastWeek; w = addDays(w, 7)) out.push(w);
  return out;
}

/**
 * Shift sheets of an approved or released plan version, one week at a time: a timeline per work
 * center, the work list of each shift, working-time cautions, and the way to paper (print view,
 * PDF). Nothing here is editable. Floor leads arrive from their navigation or the release e-mail
 * (`?plan=<id>`).
 */
export function ShiftSheetsPage({ role }: { role: Role }) {
  const [params, setParams] = useSearchParams();
  const plans = useSheetPlans();
  const askedPlan = parseId(params.get('plan'));
  const list = plans.data ?? [];
  const planId = askedPlan ?? list.find((p) => p.state === 'released')?.id ?? list[0]?.id ?? null;
  const plan = list.find((p) => p.id === planId);
  const week = params.get('week') ?? currentWeekOf(plan);
  const workCenter = params.get('workCenter') ?? undefined;
  const sheets = useShiftSheets(plans.isSuccess ? planId : null, week);

  const choose = (next: { plan?: number; week?: string; workCenter?: string }) => {
    const q: Record<string, string> = {};
    if (next.plan !== undefined) q.plan = String(next.plan);
    if (next.week) q.week = next.week;
    if (next.workCenter) q.workCenter = next.workCenter;
    setParams(q, { replace: true });
  };

  const header = <PageHeader title="Shift sheets" description="What each work center runs, shift by shift, in the order to run it." />;
  if (plans.isPending) return <>{header}<Loading label="Finding plan versions with shift sheets…" /></>;
  if (plans.isError) return <>{header}<ErrorState error={plans.error} onRetry={() => void plans.refetch()} /></>;
  if (planId === null) {
    return (
      <>
        {header}
        <EmptyState title={role === 'floor_lead' ? 'No plan has been released to the floor yet' : 'No approved or released plan version yet'}>
          {role === 'floor_lead' ? 'You get an e-mail with a link here when a supervisor releases one.' : 'Shift sheets appear once a supervisor approves a plan version.'}
        </EmptyState>
      </>
    );
  }

  const data = sheets.data;
  const weekStart = data?.week.start ?? week;
  const shown = data ? data.workCenters.filter((c) => !workCenter || c.code === workCenter) : [];
  return (
    <>
      {header}
      <div className="mb-4 flex flex-col gap-3 rounded border border-line bg-panel p-3">
        <SheetChoices plans={list} planId={planId} week={weekStart} weeks={data?.weeks ?? weeksOf(plan)} workCenter={workCenter} onChange={choose} />
        {data ? (
          <p className="text-sm">
            <span className="font-semibold">
              #{data.plan.id} {data.plan.name}
            </span>{' '}
            · {sheetPlanStateWords[data.plan.state] ?? data.plan.state}
            {data.plan.approvedBy ? ` · approved by ${data.plan.approvedBy}${data.plan.approvedAt ? ` on ${formatStamp(data.plan.approvedAt)}` : ''}` : ''} · {data.plantName}
          </p>
        ) : null}
        {data?.workCenterScope === 'none_assigned' ? (
          <p role="note" className="text-sm">
            <span className="font-semibold">No work centers assigned: showing all.</span> An admin can assign your work centers on the People page.
          </p>
        ) : null}
        {data?.workCenterScope === 'assigned' ? (
          <p role="note" className="text-sm">
            <span className="font-semibold">Your work centers:</span> {data.workCenters.map((c) => `${c.code} ${c.name}`).join(', ') || 'none of them is in this plan version'}
          </p>
        ) : null}
      </div>

      {sheets.isPending ? <Loading label="Laying out the week…" /> : null}
      {sheets.isError ? (
        <ErrorState
          error={sheets.error}
          title={isApiError(sheets.error) && sheets.error.status === 409 ? 'No shift sheets for this plan version' : undefined}
          onRetry={() => void sheets.refetch()}
        />
      ) : null}
      {sheets.isError && isApiError(sheets.error) && sheets.error.issues.length + sheets.error.fields.length > 0 ? (
        <ul className="mt-2 list-disc pl-6 text-sm">
          {sheets.error.issues.map((i) => (
            <li key={i.item}>
              <span className="font-semibold">{i.item}:</span> {i.message}
            </li>
          ))}
          {sheets.error.fields.map((f) => (
            <li key={f.path}>{f.message}</li>
          ))}
        </ul>
      ) : null}

      {data ? (
        <div className="flex flex-col gap-6">
          <section aria-labelledby="timeline-heading" className="flex flex-col gap-2">
            <div className="flex flex-wrap items-end justify-between gap-2">
              <h2 id="timeline-heading" className="text-lg font-semibold">
                Week of {data.week.start}: {data.sheetCount} shift{data.sheetCount === 1 ? '' : 's'} with work
              </h2>
              <div className="flex flex-wrap gap-2">
                <Link className="rounded border border-line bg-panel px-3 py-1.5 font-semibold hover:bg-race-50" to={paths.printShiftSheets.getHref(data.plan.id, data.week.start, workCenter)}>
                  Print view{workCenter ? ` for ${workCenter}` : ''}
                </Link>
                {data.sheetCount > 0 ? (
                  <a className="rounded border border-race-700 bg-race-700 px-3 py-1.5 font-semibold text-white hover:bg-race-800" href={shiftSheetsPdfHref(data.plan.id, data.week.start, workCenter)} download>
                    Download PDF{workCenter ? ` for ${workCenter}` : ''} (A4)
                  </a>
                ) : null}
              </div>
            </div>
            <WeekTimeline week={data} highlight={workCenter} />
          </section>

          {data.carriedOver.length > 0 ? (
            <section aria-labelledby="carried-heading" className="rounded border border-dashed border-line bg-panel p-3 text-sm">
              <h2 id="carried-heading" className="font-semibold">
                Carried on to the week of {addDays(data.week.start, 7)}: {formatMinutes(data.carriedOver.reduce((a, c) => a + c.hours, 0) * 60)}
              </h2>
              <p className="text-ink-soft">Work this week cannot finish runs first in the next week’s open shifts, marked as carried over.</p>
              <ul className="list-disc pl-5">
                {data.carriedOver.map((c) => (
                  <li key={`${c.workCenter}-${c.product}-${c.operation}-${c.planWeek}`}>
                    {c.workCenter}: {c.product} operation {c.operation}, {formatQuantityUnit(c.quantity, 'units')} ({formatMinutes(c.hours * 60)}) of the {formatWeekOf(c.planWeek).replace('wk of', 'week of')} — {c.reason}.
                  </li>
                ))}
              </ul>
            </section>
          ) : null}

          {data.unscheduled.length > 0 ? (
            <Caution title="Work still open after the plan’s last week">
              <ul className="list-disc pl-5">
                {data.unscheduled.map((u) => (
                  <li key={`${u.workCenter}-${u.product}-${u.operation}-${u.planWeek}`}>
                    {u.workCenter}: {u.product} operation {u.operation}, {formatQuantityUnit(u.quantity, 'units')} ({formatMinutes(u.hours * 60)}) of the {formatWeekOf(u.planWeek).replace('wk of', 'week of')} — {u.reason}. Talk to the planner.
                  </li>
                ))}
              </ul>
            </Caution>
          ) : null}

          <CrewCautions week={data} workCenter={workCenter} />

          <section aria-labelledby="lists-heading" className="flex flex-col gap-3">
            <div className="flex flex-wrap items-end justify-between gap-2">
              <h2 id="lists-heading" className="text-lg font-semibold">
                Work list per shift
              </h2>
              <label className="flex items-center gap-2 text-sm font-semibold">
                Work center
                <select
                  className="rounded border border-line bg-panel px-2 py-1 font-normal"
                  value={workCenter ?? ''}
                  onChange={(e) => choose({ plan: data.plan.id, week: data.week.start, workCenter: e.target.value || undefined })}
                >
                  <option value="">{data.workCenterScope === 'assigned' ? 'All your work centers' : 'All work centers'}</option>
                  {data.workCenters.map((c) => (
                    <option key={c.code} value={c.code}>
                      {c.code} {c.name}
                    </option>
                  ))}
                </select>
              </label>
            </div>
            {shown.map((c) => (
              <section key={c.code} aria-label={`${c.code} ${c.name}`} className="flex flex-col gap-2">
                <div className="flex flex-wrap items-center justify-between gap-2">
                  <h3 className="text-base font-semibold">
                    {c.code} {c.name}
                  </h3>
                  {c.days.length > 0 ? (
                    <span className="flex gap-2 text-sm">
                      <Link className="text-race-700 underline" to={paths.printShiftSheets.getHref(data.plan.id, data.week.start, c.code)}>
                        Print {c.code}
                      </Link>
                      <a className="text-race-700 underline" href={shiftSheetsPdfHref(data.plan.id, data.week.start, c.code)} download>
                        PDF of {c.code}
                      </a>
                    </span>
                  ) : null}
                </div>
                <ShiftJobList workCenter={c} />
              </section>
            ))}
          </section>
          <p className="text-sm text-ink-soft">
            These sheets are advice from an approved plan; the supervisor on shift decides. Setups and changeovers follow lockout/tagout.
          </p>
        </div>
      ) : null}
    </>
  );
}
