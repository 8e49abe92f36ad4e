import type { ColumnDef } from '@tanstack/react-table';
import type { PlanLine } from '@millrace/contracts';
import { formatNumber, formatWeek } from '@/lib/format';

const qty = (key: keyof PlanLine, header: string): ColumnDef<PlanLine, any> => ({
  accessorKey: key,
  header,
  meta: { numeric: true },
  cell: ({ getValue }) => formatNumber(getValue() as number),
});

/** The plan table: one row per product and week. */
export const planLinesColumns: ColumnDef<PlanLine, any>[] = [
  { accessorKey: 'product', header: 'Product', enableHiding: false, cell: ({ row }) => <span className="font-semibold">{row.original.product}</span> },
  { accessorKey: 'productName', header: 'Name' },
  { accessorKey: 'week', header: 'Week', meta: { numeric: true }, cell: ({ row }) => `${row.original.week} (${formatWeek(row.original.weekStart)})` },
  qty('demand', 'Demand'),
  qty('make', 'Make'),
  qty('ship', 'Ship'),
  qty('stock', 'Stock'),
  {
    accessorKey: 'late',
    header: 'Late',
    meta: { numeric: true },
    cell: ({ getValue }) => {
      const v = getValue() as number;
      return v > 1e-9 ? (
        <span className="font-semibold text-fault-700">
          <span aria-hidden="true">⚑ </span>
          {formatNumber(v)}
        </span>
      ) : (
        formatNumber(v)
      );
    },
  },
];
