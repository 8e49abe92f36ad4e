import { Link, useSearchParams } from 'react-router-dom';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';
import { useCaughtMailList } from './api/get-caught-mail';
import { CaughtMessageReader } from './components/caught-message-reader';

/**
 * Caught mail (development): every message the local mail catcher received, newest first, and a
 * reader. The chosen message lives in the address (?message=) so a reload keeps it open.
 */
export function CaughtMailPage() {
  const list = useCaughtMailList();
  const [params] = useSearchParams();
  const chosen = params.get('message');
  return (
    <>
      <PageHeader
        title="Caught mail"
        description="Development only: what Millrace sent to the local mail catcher instead of real mailboxes. Newest first."
      />
      {list.isPending ? <Loading label="Loading caught mail…" /> : null}
      {list.isError ? <ErrorState error={list.error} onRetry={() => void list.refetch()} /> : null}
      {list.data ? (
        list.data.length === 0 ? (
          <EmptyState title="No mail caught yet">Messages appear here when Millrace sends invitations, reset links or sign-off notices.</EmptyState>
        ) : (
          <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(0,3fr)]">
            <table className="w-full text-sm">
              <caption className="sr-only">Caught messages</caption>
              <thead>
                <tr className="border-b border-line text-left">
                  <th scope="col" className="p-2">To</th>
                  <th scope="col" className="p-2">Subject</th>
                  <th scope="col" className="p-2">Date</th>
                </tr>
              </thead>
              <tbody>
                {list.data.map((m) => (
                  <tr key={m.id} className={`border-b border-line ${m.id === chosen ? 'bg-race-50' : ''}`} aria-current={m.id === chosen ? 'true' : undefined}>
                    <td className="p-2">{m.to.join(', ')}</td>
                    <td className="p-2">
                      <Link className="underline" to={paths.caughtMail.getHref(m.id)}>
                        {m.subject || '(no subject)'}
                      </Link>
                    </td>
                    <td className="p-2 whitespace-nowrap">{formatDateTime(m.date)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <section aria-label="Message" className="rounded border border-line bg-panel p-4">
              {chosen ? <CaughtMessageReader id={chosen} /> : <p className="text-ink-soft">Choose a message to read it.</p>}
            </section>
          </div>
        )
      ) : null}
    </>
  );
}
