import type { ColumnDef } from '@tanstack/react-table';
import { roles, type Person, type Role } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { roleLabels } from '@/lib/authorization';

export type PeopleActions = {
  myEmail: string;
  busyId: number | null;
  changeRole: (person: Person, role: Role) => void;
  setActive: (person: Person, active: boolean) => void;
};

export function peopleColumns(actions: PeopleActions): ColumnDef<Person, any>[] {
  return [
    { accessorKey: 'name', header: 'Name', enableHiding: false },
    { accessorKey: 'email', header: 'E-mail' },
    {
      accessorKey: 'role',
      header: 'Role',
      filterFn: 'equalsString',
      meta: { filterOptions: roles.map((r) => ({ value: r, label: roleLabels[r] })) },
      cell: ({ row }) => {
        const p = row.original;
        const self = p.email === actions.myEmail;
        return (
          <select
            aria-label={`Role of ${p.name}`}
            value={p.role}
            disabled={self || actions.busyId === p.id}
            title={self ? 'You cannot change your own role.' : undefined}
            onChange={(e) => actions.changeRole(p, e.target.value as Role)}
            className="rounded border border-line bg-panel px-1.5 py-0.5"
          >
            {roles.map((r) => (
              <option key={r} value={r}>
                {roleLabels[r]}
              </option>
            ))}
          </select>
        );
      },
    },
    {
      id: 'status',
      header: 'Status',
      accessorFn: (p) => (p.active ? 'active' : 'deactivated'),
      filterFn: 'equalsString',
      meta: {
        filterOptions: [
          { value: 'active', label: 'Active' },
          { value: 'deactivated', label: 'Deactivated' },
        ],
      },
      cell: ({ row }) => (row.original.active ? 'Active' : <span className="text-ink-soft">⊘ Deactivated</span>),
    },
    {
      id: 'actions',
      header: 'Actions',
      enableSorting: false,
      enableHiding: false,
      cell: ({ row }) => {
        const p = row.original;
        const self = p.email === actions.myEmail;
        return (
          <Button
            size="sm"
            variant={p.active ? 'danger' : 'secondary'}
            disabled={self}
            busy={actions.busyId === p.id}
            busyLabel="Saving…"
            title={self ? 'You cannot deactivate yourself.' : undefined}
            aria-label={`${p.active ? 'Deactivate' : 'Reactivate'} ${p.name}`}
            onClick={() => actions.setActive(p, !p.active)}
          >
            {p.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        );
      },
    },
  ];
}
