import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { Tabs } from '@/components/ui/tabs';
import { formatDateTime } from '@/lib/format';
import { useCaughtMessage } from '../api/get-caught-mail';

/**
 * One caught message. The HTML part is shown in an iframe with an empty `sandbox` (no scripts, no
 * forms, no same-origin access) from `srcdoc`, so a message cannot act on the planner's session.
 */
export function CaughtMessageReader({ id }: { id: string }) {
  const message = useCaughtMessage(id);
  if (message.isPending) return <Loading label="Opening the message…" />;
  if (message.isError) return <ErrorState error={message.error} onRetry={() => void message.refetch()} />;
  const m = message.data;
  const textPart = (
    <pre aria-label="Plain-text part" className="whitespace-pre-wrap rounded border border-line bg-paper p-3 text-sm">
      {m.text}
    </pre>
  );
  return (
    <article aria-labelledby="caught-subject" className="flex flex-col gap-3">
      <h2 id="caught-subject" className="text-lg font-semibold">
        {m.subject || '(no subject)'}
      </h2>
      <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
        <dt className="font-semibold">From</dt>
        <dd>{m.from}</dd>
        <dt className="font-semibold">To</dt>
        <dd>{m.to.join(', ')}</dd>
        {m.cc.length > 0 ? (
          <>
            <dt className="font-semibold">Cc</dt>
            <dd>{m.cc.join(', ')}</dd>
          </>
        ) : null}
        <dt className="font-semibold">Date</dt>
        <dd>{formatDateTime(m.date)}</dd>
      </dl>
      {m.html !== null ? (
        <Tabs
          label="Message part"
          items={[
            { id: 'text', label: 'Plain text', content: () => textPart },
            {
              id: 'html',
              label: 'HTML',
              content: () => (
                <iframe title={`HTML part of ${m.subject}`} sandbox="" srcDoc={m.html ?? ''} className="h-[32rem] w-full rounded border border-line bg-white" />
              ),
            },
          ]}
        />
      ) : (
        textPart
      )}
    </article>
  );
}
