import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { toast } from 'sonner';
import { ApiError } from '@client/api/api-client.ts';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { PageHeader } from '@client/components/page-header.tsx';
import { errorMessage } from '@client/features/review/error-message.ts';
import { emptyMailbox, mailboxQueries } from './mailbox.queries.ts';

/** The development mailbox: what the local fake SMTP server captured. */
export default function MailboxPage() {
  const queryClient = useQueryClient();
  const [offset, setOffset] = useState(0);
  const [openId, setOpenId] = useState<number | null>(null);
  const list = useQuery({ ...mailboxQueries.list(offset), refetchInterval: 5_000 });
  const clear = useMutation({
    mutationFn: emptyMailbox,
    onSuccess: async () => {
      toast.success('The mailbox is empty');
      setOpenId(null);
      await queryClient.invalidateQueries({ queryKey: mailboxQueries.all() });
    },
    onError: (error) => toast.error(`The mailbox was not emptied: ${errorMessage(error)}`),
  });

  const header = (
    <PageHeader
      title="Development mailbox"
      description="E-mail the app sent while running in development, caught by the local fake SMTP server. Nothing here left the machine."
      actions={
        list.data && list.data.total > 0 ? (
          <button
            type="button"
            onClick={() => clear.mutate()}
            disabled={clear.isPending}
            className="rounded border border-rule px-3 py-1.5 text-sm"
          >
            Empty the mailbox
          </button>
        ) : null
      }
    />
  );
  if (list.isPending)
    return (
      <>
        {header}
        <LoadingState label="Loading the messages…" />
      </>
    );
  if (list.isError) {
    if (list.error instanceof ApiError && list.error.status === 404) {
      return (
        <>
          <PageHeader title="Development mailbox" />
          <div
            role="alert"
            className="rounded border border-rule bg-paper-deep p-4"
            data-testid="mailbox-unavailable"
          >
            <p className="font-medium">This server keeps no mailbox: it runs in production.</p>
            <p className="mt-1 text-sm text-ink-soft">
              The mailbox exists only in development and tests, where e-mail goes to a local fake
              SMTP server. Here messages go to their real addresses and cannot be read on this page.
            </p>
          </div>
        </>
      );
    }
    return (
      <>
        {header}
        <ErrorState error={list.error} onRetry={() => void list.refetch()} />
      </>
    );
  }
  const { items, total, limit } = list.data;
  return (
    <div>
      {header}
      {total === 0 ? (
        <EmptyState title="No messages yet.">
          Invitations, review requests, verdicts and promotions send e-mail; they appear here.
        </EmptyState>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[minmax(0,5fr)_minmax(0,6fr)]">
          <div>
            <table className="w-full text-sm" data-testid="mailbox-list">
              <caption className="sr-only">Captured messages, newest first</caption>
              <thead className="border-b border-rule text-left text-ink-soft">
                <tr>
                  <th className="py-1 pr-3 font-medium">Message</th>
                  <th className="py-1 text-right font-medium">Received</th>
                </tr>
              </thead>
              <tbody>
                {items.map((m) => (
                  <tr
                    key={m.id}
                    className={`border-b border-rule/60 align-top ${openId === m.id ? 'bg-paper-deep' : ''}`}
                  >
                    <td className="py-1.5 pr-3">
                      <button
                        type="button"
                        onClick={() => setOpenId(m.id)}
                        aria-pressed={openId === m.id}
                        className="block text-left font-medium underline decoration-rule underline-offset-2 hover:decoration-ink"
                      >
                        {m.subject || '(no subject)'}
                      </button>
                      <span
                        className="block truncate text-xs text-ink-soft"
                        title={m.to.join(', ')}
                      >
                        to {m.to.join(', ')}
                      </span>
                    </td>
                    <td className="py-1.5 text-right text-xs whitespace-nowrap text-ink-soft">
                      {formatDateTime(m.date)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <div className="mt-3 flex items-center gap-3 text-sm">
              <span className="text-ink-soft">
                {offset + 1}–{offset + items.length} of {total}
              </span>
              <button
                type="button"
                disabled={offset === 0}
                onClick={() => setOffset(Math.max(0, offset - limit))}
                className="underline disabled:no-underline disabled:opacity-50"
              >
                Newer
              </button>
              <button
                type="button"
                disabled={offset + items.length >= total}
                onClick={() => setOffset(offset + limit)}
                className="underline disabled:no-underline disabled:opacity-50"
              >
                Older
              </button>
            </div>
          </div>
          <div>
            {openId === null ? (
              <p className="text-sm text-ink-soft">Pick a message to read it.</p>
            ) : (
              <MessageView id={openId} />
            )}
          </div>
        </div>
      )}
    </div>
  );
}

function MessageView({ id }: { id: number }) {
  const message = useQuery(mailboxQueries.message(id));
  const [asHtml, setAsHtml] = useState(true);
  if (message.isPending) return <LoadingState label="Loading the message…" />;
  if (message.isError) return <ErrorState error={message.error} />;
  const m = message.data;
  const showHtml = asHtml && m.html !== null;
  return (
    <article
      aria-labelledby="message-subject"
      className="rounded border border-rule bg-white/60 p-4"
      data-testid="mailbox-message"
    >
      <h2 id="message-subject" className="text-lg font-semibold">
        {m.subject || '(no subject)'}
      </h2>
      <dl className="mt-2 grid grid-cols-[4rem_1fr] gap-x-3 text-sm">
        <dt className="text-ink-soft">From</dt>
        <dd>{m.from}</dd>
        <dt className="text-ink-soft">To</dt>
        <dd>{m.to.join(', ')}</dd>
        <dt className="text-ink-soft">Received</dt>
        <dd>{formatDateTime(m.date)}</dd>
      </dl>
      {m.html !== null ? (
        <div className="mt-3 flex gap-2 text-sm" role="group" aria-label="Show the message as">
          <button
            type="button"
            aria-pressed={showHtml}
            onClick={() => setAsHtml(true)}
            className={`rounded border px-2 py-0.5 ${showHtml ? 'border-ink' : 'border-rule'}`}
          >
            HTML
          </button>
          <button
            type="button"
            aria-pressed={!showHtml}
            onClick={() => setAsHtml(false)}
            className={`rounded border px-2 py-0.5 ${!showHtml ? 'border-ink' : 'border-rule'}`}
          >
            Text
          </button>
        </div>
      ) : null}
      {showHtml ? (
        // No scripts, no same-origin access, no forms: the HTML is only looked at.
        <iframe
          title={`HTML of “${m.subject}”`}
          sandbox=""
          srcDoc={m.html ?? ''}
          className="mt-3 h-96 w-full rounded border border-rule bg-white"
        />
      ) : (
        <pre className="mt-3 max-h-96 overflow-auto whitespace-pre-wrap rounded border border-rule bg-white p-3 font-mono text-xs">
          {m.text}
        </pre>
      )}
    </article>
  );
}
