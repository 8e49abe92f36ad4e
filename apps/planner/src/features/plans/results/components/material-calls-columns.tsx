import type { ColumnDef } from '@tanstack/react-table';
import type { MaterialCall } from '@millrace/contracts';
import { formatNumber, formatWeek } from '@/lib/format';

const qty = (key: keyof MaterialCall, header: string): ColumnDef<MaterialCall, any> => ({
  accessorKey: key,
  header,
  meta: { numeric: true },
  cell: ({ getValue }) => formatNumber(getValue() as number),
});

const money = new Intl.NumberFormat('en-GB', { minimumFractionDigits: 2, maximumFractionDigits: 2 });

/** Start of the order week: the need week's start moved back by the weeks between them. */
const releaseWeekStart = (call: MaterialCall): string => {
  const start = new Date(`${call.weekStart}T00:00:00Z`);
  start.setUTCDate(start.getUTCDate() - 7 * (call.week - call.releaseWeek));
  return start.toISOString().slice(0, 10);
};

/** Material calls: what to order, how much, and in which week to release the order. */
export const materialCallsColumns: ColumnDef<MaterialCall, any>[] = [
  { accessorKey: 'material', header: 'Material', enableHiding: false, cell: ({ row }) => <span className="font-semibold">{row.original.material}</span> },
  { accessorKey: 'materialName', header: 'Name' },
  {
    accessorKey: 'releaseWeek',
    header: 'Order in week',
    meta: { numeric: true },
    cell: ({ row }) =>
      row.original.pastDue ? (
        <span className="font-semibold text-fault-700">
          <span aria-hidden="true">⚑ </span>past due (week of {formatWeek(releaseWeekStart(row.original))})
        </span>
      ) : (
        `${row.original.releaseWeek} (${formatWeek(releaseWeekStart(row.original))})`
      ),
  },
  { accessorKey: 'week', header: 'Needed in week', meta: { numeric: true }, cell: ({ row }) => `${row.original.week} (${formatWeek(row.original.weekStart)})` },
  {
    accessorKey: 'plannedReceipt',
    header: 'Order quantity',
    meta: { numeric: true },
    cell: ({ row }) => `${formatNumber(row.original.plannedReceipt)} ${row.original.unit}`,
  },
  qty('grossRequirement', 'Gross need'),
  qty('scheduledReceipt', 'Scheduled receipt'),
  qty('projectedAvailable', 'Projected available'),
  qty('netRequirement', 'Net need'),
  { accessorKey: 'spend', header: 'Spend', meta: { numeric: true }, cell: ({ row }) => money.format(row.original.spend) },
];
