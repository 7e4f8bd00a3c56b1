import { buttonStyles } from '../../../components/ui/button-styles';
import { EmptyState, ErrorState, LoadingState } from '../../../components/ui/query-states';
import { formatDateTime } from '../../../lib/format-date-time';
import { useMail } from '../api/list-mail';
import { Linkify } from './linkify';

/** The fake SMTP server's messages, newest first, with their links clickable. */
export function MailboxList() {
  const mail = useMail();
  if (mail.isPending) return <LoadingState label="Loading the mailbox…" />;
  if (mail.isError)
    return <ErrorState title="The mailbox could not be loaded" error={mail.error} onRetry={() => mail.refetch()} />;
  if (mail.data === null)
    return (
      <EmptyState title="The fake mail server is off">
        This server sends mail through a real SMTP server (<code>SMTP_URL</code> is set), so there is no local mailbox
        to show.
      </EmptyState>
    );
  return (
    <div className="flex flex-col gap-4">
      <div>
        <button type="button" className={buttonStyles('secondary')} onClick={() => mail.refetch()}>
          {mail.isFetching ? 'Checking…' : 'Check for new mail'}
        </button>
      </div>
      {mail.data.length === 0 ? (
        <EmptyState title="No mail yet">Invitations, reset links and audit notices show here once sent.</EmptyState>
      ) : (
        <ol className="flex flex-col gap-3">
          {mail.data.map((message) => (
            <li key={message.id}>
              <article
                aria-labelledby={`mail-${message.id}`}
                className="rounded-lg border border-abyss/10 bg-white p-4"
              >
                <h2 id={`mail-${message.id}`} className="font-semibold">
                  {message.subject}
                </h2>
                <p className="text-sm text-abyss-soft">
                  to {message.to.join(', ')} · from {message.from} · {formatDateTime(message.receivedAt)}
                </p>
                <p className="mt-2 text-sm whitespace-pre-wrap">
                  <Linkify text={message.text} />
                </p>
              </article>
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}
