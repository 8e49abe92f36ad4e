import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { WorkCenter } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { formatHours, formatNumber } from '@/lib/format';

/** Clock hours of the shift pattern in a normal week (shifts × hours × days). */
export const patternHours = (w: WorkCenter) => w.shiftPattern.shiftsPerDay * w.shiftPattern.hoursPerShift * w.shiftPattern.daysPerWeek;

export const workCentersColumns: ColumnDef<WorkCenter, any>[] = [
  {
    accessorKey: 'code',
    header: 'Code',
    enableHiding: false,
    cell: ({ row }) => (
      <Link className="font-semibold text-race-700 underline-offset-2 hover:underline" to={paths.workCenter.getHref(row.original.id)}>
        {row.original.code}
      </Link>
    ),
  },
  { accessorKey: 'name', header: 'Name' },
  {
    id: 'pattern',
    header: 'Shift pattern',
    accessorFn: (w) => `${w.shiftPattern.shiftsPerDay} × ${formatNumber(w.shiftPattern.hoursPerShift)} h × ${w.shiftPattern.daysPerWeek} d`,
  },
  { id: 'weekHours', header: 'Clock hours a week', accessorFn: patternHours, meta: { numeric: true }, cell: ({ getValue }) => formatHours(getValue() as number) },
  { accessorKey: 'efficiency', header: 'Efficiency', meta: { numeric: true }, cell: ({ getValue }) => `${formatNumber((getValue() as number) * 100)} %` },
  {
    accessorKey: 'overtimeCapHoursPerWeek',
    header: 'Overtime cap a week',
    meta: { numeric: true },
    cell: ({ getValue }) => {
      const v = getValue() as number | null;
      return v === null ? 'no cap' : formatHours(v);
    },
  },
  { accessorKey: 'overtimeCostPerHour', header: 'Overtime cost per hour', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
];
