import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { Product } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { formatNumber } from '@/lib/format';

export const productKindLabels: Record<Product['kind'], string> = {
  finished: 'Finished good',
  subassembly: 'Sub-assembly',
};

export const productsColumns: ColumnDef<Product, any>[] = [
  {
    accessorKey: 'code',
    header: 'Code',
    enableHiding: false,
    cell: ({ row }) => (
      <Link className="font-semibold text-race-700 underline-offset-2 hover:underline" to={paths.product.getHref(row.original.id)}>
        {row.original.code}
      </Link>
    ),
  },
  { accessorKey: 'name', header: 'Name' },
  {
    accessorKey: 'kind',
    header: 'Kind',
    filterFn: 'equalsString',
    cell: ({ getValue }) => productKindLabels[getValue() as Product['kind']],
    meta: { filterOptions: Object.entries(productKindLabels).map(([value, label]) => ({ value, label })) },
  },
  { accessorKey: 'family', header: 'Family', cell: ({ getValue }) => (getValue() as string | null) ?? '—' },
  { accessorKey: 'unit', header: 'Unit' },
  { accessorKey: 'price', header: 'Price', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
  { accessorKey: 'safetyStock', header: 'Safety stock', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
  { accessorKey: 'batchMultiple', header: 'Batch multiple', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
  { accessorKey: 'openingStock', header: 'Opening stock', meta: { numeric: true }, cell: ({ getValue }) => formatNumber(getValue() as number) },
  {
    id: 'active',
    accessorFn: (p) => (p.active ? 'active' : 'inactive'),
    header: 'Status',
    filterFn: 'equalsString',
    cell: ({ getValue }) => (getValue() === 'active' ? 'Active' : 'Inactive'),
    meta: {
      filterOptions: [
        { value: 'active', label: 'Active' },
        { value: 'inactive', label: 'Inactive' },
      ],
    },
  },
];
