import type { ColumnDef } from '@tanstack/react-table';
import type { MaterialCall } from '@millrace/contracts';
import { formatNumber, formatWeek } from '@/lib/format';

const qty = (key: keyof MaterialCall, header: string): ColumnDef<MaterialCall, any> => ({
  accessorKey: key,
  header,
  meta: { numeric: true },
  cell: ({ getValue }) => formatNumber(getValue() as number),
});

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
          <span aria-hidden="true">⚑ </span>past due ({row.original.releaseWeek})
        </span>
      ) : (
        row.original.releaseWeek
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
  qty('spend', 'Spend'),
];
