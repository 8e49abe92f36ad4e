import type { ColumnDef } from '@tanstack/react-table';
import { roles, type Person, type Role } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { roleLabels } from '@/lib/authorization';
import type { WorkCenterChoice } from '../api/get-work-center-choices';
import { assignedWorkCentersText, WorkCenterPicker } from './work-center-picker';

export type PeopleActions = {
  myEmail: string;
  busyId: number | null;
  changeRole: (person: Person, role: Role) => void;
  setActive: (person: Person, active: boolean) => void;
  setWorkCenters: (person: Person, workCenterIds: number[]) => void;
  workCenterChoices: WorkCenterChoice[] | undefined;
  workCenterChoicesError?: string;
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
      id: 'workCenters',
      header: 'Work centers',
      enableSorting: false,
      accessorFn: (p) => (p.workCenterIds ?? []).length,
      cell: ({ row }) => {
        const p = row.original;
        const ids = p.workCenterIds ?? [];
        if (p.role === 'floor_lead') {
          return (
            <WorkCenterPicker
              key={`${p.id}-${p.version}`}
              person={p}
              choices={actions.workCenterChoices}
              choicesError={actions.workCenterChoicesError}
              busy={actions.busyId === p.id}
              onSave={(next) => actions.setWorkCenters(p, next)}
            />
          );
        }
        return ids.length === 0 ? (
          <span className="text-ink-soft">—</span>
        ) : (
          <span className="text-ink-soft" title="Kept for when they are a floor lead again; only floor leads' sheets follow them.">
            {assignedWorkCentersText(ids, actions.workCenterChoices)} (used for floor leads only)
          </span>
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
