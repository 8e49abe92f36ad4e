import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { DataTable } from '@/components/ui/table/data-table';
import { useOutbox } from './api/get-outbox';
import { outboxColumns } from './components/outbox-columns';

/** Mail Millrace sends (sign-off notices, shift sheets): what is waiting, what failed and why, what went out. */
export function MailPage() {
  const open = useOutbox();
  const sent = useOutbox('sent');
  const pending = open.isPending || sent.isPending;
  const error = open.error ?? sent.error;
  const messages = [...(open.data ?? []), ...(sent.data ?? [])].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return (
    <>
      <PageHeader
        title="Outgoing mail"
        description="Messages Millrace sends, retried until the mail server takes them. In development they land in the local mail catcher."
      />
      {pending ? <Loading label="Loading mail…" /> : null}
      {error ? <ErrorState error={error} onRetry={() => void Promise.all([open.refetch(), sent.refetch()])} /> : null}
      {!pending && !error ? (
        <DataTable
          label="Outgoing mail"
          columns={outboxColumns}
          data={messages}
          getRowId={(m) => String(m.id)}
          empty={<EmptyState title="No mail yet">Messages appear here when plans are submitted, approved or released.</EmptyState>}
        />
      ) : null}
    </>
  );
}
