import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { LotRule, Material } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format';

export const lotRuleLabels: Record<LotRule, string> = {
  lot_for_lot: 'Lot-for-lot',
  fixed_order_quantity: 'Fixed order quantity',
  minimum_order_quantity: 'Minimum order quantity',
  period_order_quantity: 'Period order quantity',
};

export const materialsColumns: ColumnDef<Material, any>[] = [
  {
    accessorKey: 'code',
    header: 'Code',
    enableHiding: false,
    cell: ({ row }) => (
      <Link className="font-semibold text-race-700 underline-offset-2 hover:underline" to={paths.material.getHref(row.original.id)}>
        {row.original.code}
      </Link>
    ),
  },
  { accessorKey: 'name', header: 'Name' },
  { accessorKey: 'unit', header: 'Unit' },
  { accessorKey: 'onHand', header: 'On hand', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
  { accessorKey: 'unitCost', header: 'Unit cost', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
  { accessorKey: 'leadTimeWeeks', header: 'Lead time (weeks)', meta: { numeric: true } },
  {
    accessorKey: 'weeklySupplyCap',
    header: 'Supply cap a week',
    meta: { numeric: true },
    cell: ({ getValue }) => {
      const v = getValue() as number | null;
      return v === null ? 'no cap' : formatNumber(v);
    },
  },
  {
    accessorKey: 'lotRule',
    header: 'Lot rule',
    filterFn: 'equalsString',
    cell: ({ getValue }) => lotRuleLabels[getValue() as LotRule],
    meta: { filterOptions: Object.entries(lotRuleLabels).map(([value, label]) => ({ value, label })) },
  },
  {
    accessorKey: 'lotSize',
    header: 'Lot size',
    meta: { numeric: true },
    cell: ({ getValue }) => {
      const v = getValue() as number | null;
      return v === null ? '—' : formatNumber(v);
    },
  },
];
