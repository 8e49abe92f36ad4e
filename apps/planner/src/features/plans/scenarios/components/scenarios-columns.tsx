import type { ColumnDef } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { Scenario } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { formatDateTime } from '../../plan-words';
import { overrideKindWords } from './override-fields';

export const scenariosColumns: ColumnDef<Scenario, any>[] = [
  {
    accessorKey: 'name',
    header: 'Scenario',
    enableHiding: false,
    cell: ({ row }) => (
      <Link className="font-semibold text-race-700 underline-offset-2 hover:underline" to={paths.scenario.getHref(row.original.id)}>
        {row.original.name}
      </Link>
    ),
  },
  { accessorKey: 'description', header: 'Description' },
  {
    id: 'overrides',
    header: 'Overrides',
    accessorFn: (s) => (s.overrides.length === 0 ? 'none' : s.overrides.map((o) => overrideKindWords[o.kind]).join('; ')),
  },
  { id: 'plans', header: 'Used by plan versions', accessorFn: (s) => (s.usedByPlanIds.length === 0 ? '—' : s.usedByPlanIds.map((id) => `#${id}`).join(', ')) },
  { id: 'locked', header: 'Editable', accessorFn: (s) => (s.locked ? 'No (an approved plan uses it)' : 'Yes') },
  { accessorKey: 'updatedAt', header: 'Changed', cell: ({ row }) => formatDateTime(row.original.updatedAt) },
];
