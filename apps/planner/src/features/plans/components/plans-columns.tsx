import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { CrossCheckStatus, PlanDetail, PlanSummary } from '@millrace/contracts';
import { planStateSchema } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { formatWeek } from '@/lib/format';
import { marginFigures, marginLabels } from '../margin-words';
import { crossCheckWords, formatDateTime, formatMoney, planStateWords, solveStatusWords } from '../plan-words';
import { PlanStateBadge } from './plan-state-badge';

/** A listed plan version with the state of its certificate and its rounding (read from the version's detail). */
export type PlanRow = PlanSummary & { certificate: CrossCheckStatus | 'none' | 'loading' | 'unknown'; rounding: PlanDetail['rounding'] };

/** The main margin figure of a row: the whole-units margin when known, else the LP optimum. */
const mainMargin = (row: PlanRow): number | undefined => {
  const m = marginFigures(row);
  return m.kind === 'whole_units' ? m.margin : m.kind === 'lp_optimum' ? m.margin : m.kind === 'lp_bound_only' ? m.lpBound : undefined;
};

function MarginCell({ row }: { row: PlanRow }) {
  const m = marginFigures(row);
  const money = (v: number | null) => (v === null ? '—' : formatMoney(v, row.currency));
  if (m.kind === 'none') return <>—</>;
  if (m.kind === 'whole_units')
    return (
      <>
        {money(m.margin)}
        <span className="block text-xs text-ink-soft">
          {marginLabels.wholeUnits}; {marginLabels.lpBound} {money(m.lpBound)}
        </span>
      </>
    );
  if (m.kind === 'lp_bound_only')
    return (
      <>
        {money(m.lpBound)}
        <span className="block text-xs text-ink-soft">{marginLabels.lpBound} (whole-units margin {row.certificate === 'loading' ? 'being read' : 'on the plan page'})</span>
      </>
    );
  return (
    <>
      {money(m.margin)}
      <span className="block text-xs text-ink-soft">{marginLabels.lpOptimum}</span>
    </>
  );
}

const certificateText = (row: PlanRow): string => {
  if (row.certificate === 'none') return row.solveStatus === 'solved' ? 'No certificate' : '—';
  if (row.certificate === 'loading') return 'Reading…';
  if (row.certificate === 'unknown') return 'Could not be read';
  return `${crossCheckWords[row.certificate].symbol} ${crossCheckWords[row.certificate].label}`;
};

export const plansColumns: ColumnDef<PlanRow, any>[] = [
  {
    accessorKey: 'name',
    header: 'Plan version',
    enableHiding: false,
    cell: ({ row }) => (
      <Link className="font-semibold text-race-700 underline-offset-2 hover:underline" to={paths.plan.getHref(row.original.id)}>
        #{row.original.id} {row.original.name}
      </Link>
    ),
  },
  {
    accessorKey: 'state',
    header: 'State',
    filterFn: 'equalsString',
    meta: { filterOptions: planStateSchema.options.map((s) => ({ value: s, label: planStateWords[s].label })) },
    cell: ({ row }) => <PlanStateBadge state={row.original.state} />,
  },
  { id: 'solve', header: 'Solve', accessorFn: (p) => solveStatusWords[p.solveStatus] },
  {
    id: 'horizon',
    header: 'Horizon',
    accessorFn: (p) => p.firstWeek,
    cell: ({ row }) => `${row.original.horizonWeeks} weeks from ${formatWeek(row.original.firstWeek)}`,
  },
  {
    id: 'margin',
    header: 'Margin',
    accessorFn: mainMargin,
    meta: { numeric: true },
    sortUndefined: 'last',
    cell: ({ row }) => <MarginCell row={row.original} />,
  },
  { id: 'certificate', header: 'Certificate', accessorFn: certificateText },
  { id: 'scenario', header: 'Scenario', accessorFn: (p) => p.scenarioName ?? 'Current data' },
  { id: 'createdBy', header: 'Created by', accessorFn: (p) => p.createdBy?.name ?? '—' },
  { accessorKey: 'createdAt', header: 'Created', cell: ({ row }) => formatDateTime(row.original.createdAt) },
];
