import { Fragment } from 'react';
import { Button, Card, EmptyState, ErrorState, PageHeader, PageLoading } from '../../../components/ui/index.ts';
import { useMail, type CaughtMessage } from '../api/get-mail.ts';

/** The local mail catcher's inbox (development and test), so invitations and resets can be followed. */
export function MailPage() {
  const mail = useMail();
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Company"
        title="Caught mail"
        description="In development and tests Ballast sends e-mail to a catcher on this machine instead of the world."
        actions={
          <Button variant="secondary" onClick={() => mail.refetch()} loading={mail.isFetching && !mail.isPending}>
            Refresh
          </Button>
        }
      />
      {mail.isPending ? (
        <PageLoading />
      ) : mail.isError ? (
        <ErrorState title="The mail could not be loaded" error={mail.error} onRetry={() => mail.refetch()} retrying={mail.isFetching} />
      ) : !mail.data.enabled ? (
        <EmptyState title="The mail catcher is off">Here e-mail goes out for real, so there is nothing to show.</EmptyState>
      ) : mail.data.messages.length === 0 ? (
        <EmptyState title="No mail caught yet">Invitations and password resets show up here as they are sent.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-3" aria-label="Messages">
          {mail.data.messages.map((m) => (
            <li key={m.id}>
              <Message message={m} />
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

function Message({ message }: { message: CaughtMessage }) {
  return (
    <Card>
      <details>
        <summary className="cursor-pointer list-none">
          <span className="block font-semibold text-ink-900">{message.subject || '(no subject)'}</span>
          <span className="block text-sm text-ink-600">
            To {message.to} · {new Date(message.receivedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'medium' })}
          </span>
        </summary>
        <p className="mt-3 break-words whitespace-pre-wrap text-ink-800">
          <Linkified text={message.text} />
        </p>
      </details>
    </Card>
  );
}

/** Makes the links in a plain-text mail clickable (invitation and reset links). */
function Linkified({ text }: { text: string }) {
  const parts = text.split(/(https?:\/\/[^\s<>"]+)/g);
  return (
    <>
      {parts.map((part, i) =>
        i % 2 === 1 ? (
          <a key={i} href={part} className="font-semibold text-tide-700 underline">
            {part}
          </a>
        ) : (
          <Fragment key={i}>{part}</Fragment>
        ),
      )}
    </>
  );
}
