import type { ColumnDef } from '@tanstack/react-table';
import type { OutboxMessage, OutboxState } from '@millrace/contracts';

export const outboxStateLabels: Record<OutboxState, string> = {
  pending: '… Waiting',
  sent: '✓ Sent',
  failed: '✕ Failed',
};

const time = (iso: string | null) => (iso ? new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' }) : '—');

export const outboxColumns: ColumnDef<OutboxMessage, any>[] = [
  { accessorKey: 'createdAt', header: 'Queued', cell: ({ getValue }) => time(getValue() as string) },
  { accessorKey: 'to', header: 'To' },
  { accessorKey: 'subject', header: 'Subject' },
  {
    accessorKey: 'state',
    header: 'State',
    filterFn: 'equalsString',
    cell: ({ getValue }) => outboxStateLabels[getValue() as OutboxState],
    meta: { filterOptions: Object.entries(outboxStateLabels).map(([value, label]) => ({ value, label: label.replace(/^\W+\s/, '') })) },
  },
  { accessorKey: 'attempts', header: 'Attempts', meta: { numeric: true } },
  { accessorKey: 'nextAttemptAt', header: 'Next attempt', cell: ({ getValue }) => time(getValue() as string | null) },
  { accessorKey: 'sentAt', header: 'Sent', cell: ({ getValue }) => time(getValue() as string | null) },
  { accessorKey: 'lastError', header: 'Last error', cell: ({ getValue }) => (getValue() as string | null) ?? '—' },
];
