import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Inbox, Trash2 } from 'lucide-react';
import type { MailboxMessage } from '@shared/collab/mailbox.schema';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { FormAlert } from '@/components/ui/form-alert';
import { cn } from '@/lib/cn';
import { isApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/dates';
import { useEmptyMailbox } from '../api/empty-mailbox';
import { useMailbox } from '../api/get-mailbox';
import { linkifyOwnOrigin } from '../utils/linkify';

export const MAILBOX_DEV_ONLY = 'The mailbox is only available in development.';

/** The text part, with links to this app made clickable and every other address left as text. */
function MessageText({ text }: { text: string }) {
  const parts = linkifyOwnOrigin(text, window.location.origin);
  return (
    <pre className="overflow-x-auto rounded border border-line bg-canvas p-3 font-sans text-sm wrap-anywhere whitespace-pre-wrap">
      {parts.map((part, i) =>
        part.kind === 'link' ? (
          <Link key={i} to={part.path} className="font-semibold break-all text-link underline">
            {part.text}
          </Link>
        ) : (
          <span key={i}>{part.text}</span>
        ),
      )}
    </pre>
  );
}

function MessageView({ message }: { message: MailboxMessage }) {
  return (
    <article aria-label={`E-mail: ${message.subject}`} className="flex min-w-0 flex-col gap-3">
      <div className="flex flex-col gap-1">
        <h2 className="text-xl font-bold wrap-anywhere">{message.subject || '(no subject)'}</h2>
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 text-sm">
          <dt className="text-ink-muted">From</dt>
          <dd className="break-all">{message.from}</dd>
          <dt className="text-ink-muted">To</dt>
          <dd className="break-all">{message.to.join(', ')}</dd>
          <dt className="text-ink-muted">Received</dt>
          <dd>{formatDateTime(message.date)}</dd>
        </dl>
      </div>
      <h3 className="font-bold">Text part</h3>
      <MessageText text={message.text} />
      {message.html ? (
        <>
          <h3 className="font-bold">HTML part</h3>
          {/* Sandboxed with no permissions: no scripts, no forms, no navigation of this page. */}
          <iframe sandbox="" srcDoc={message.html} title={`HTML part of “${message.subject}”`} className="h-[28rem] w-full rounded border border-line bg-white" />
        </>
      ) : (
        <p className="text-sm text-ink-muted">This e-mail has no HTML part.</p>
      )}
    </article>
  );
}

/** Development only: the e-mails the local mail server caught, newest first, and one opened. */
export function MailboxView() {
  const { data, isPending, error, refetch, isFetching } = useMailbox();
  const empty = useEmptyMailbox();
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const [emptyError, setEmptyError] = useState<string | null>(null);

  if (isPending) return <p className="text-ink-muted">Loading the mailbox…</p>;
  if (!data) {
    const devOnly = isApiError(error) && error.status === 404;
    return <FormAlert message={devOnly ? MAILBOX_DEV_ONLY : isApiError(error) ? error.message : 'The mailbox could not be read.'} />;
  }

  const messages = [...data.items].sort((a, b) => b.date.localeCompare(a.date));
  const selected = messages.find((m) => m.id === selectedId) ?? messages[0];

  return (
    <div className="flex min-w-0 flex-col gap-4">
      <div className="flex flex-wrap gap-3">
        <Button variant="secondary" onClick={() => void refetch()} isPending={isFetching} pendingLabel="Checking…">
          <Inbox aria-hidden="true" className="size-5" /> Check for new mail
        </Button>
        <Button
          variant="secondary"
          disabled={messages.length === 0}
          isPending={empty.isPending}
          pendingLabel="Emptying…"
          onClick={() => {
            setEmptyError(null);
            empty.mutate(undefined, {
              onSuccess: () => setSelectedId(null),
              onError: (e) => setEmptyError(isApiError(e) && e.status === 404 ? MAILBOX_DEV_ONLY : e.message),
            });
          }}
        >
          <Trash2 aria-hidden="true" className="size-5" /> Empty the mailbox
        </Button>
      </div>
      <FormAlert message={emptyError} />
      {messages.length === 0 ? (
        <EmptyState message="No e-mails caught yet. Ask for a password reset or send an invitation, then check again." />
      ) : (
        <div className="grid grid-cols-1 min-w-0 gap-4 md:grid-cols-[minmax(0,20rem)_minmax(0,1fr)]">
          <ul aria-label="E-mails, newest first" className="flex min-w-0 flex-col gap-2">
            {messages.map((m) => {
              const current = m.id === selected?.id;
              return (
                <li key={m.id}>
                  <button
                    type="button"
                    aria-current={current ? 'true' : undefined}
                    onClick={() => setSelectedId(m.id)}
                    className={cn(
                      'flex min-h-tap w-full min-w-0 flex-col items-start rounded border px-3 py-2 text-left',
                      current ? 'border-accent bg-accent-soft' : 'border-line bg-surface hover:bg-surface-raised',
                    )}
                  >
                    <span className="w-full truncate font-bold">{m.subject || '(no subject)'}</span>
                    <span className="w-full truncate text-sm">To {m.to.join(', ')}</span>
                    <span className="tabular-figures text-xs text-ink-muted">{formatDateTime(m.date)}</span>
                  </button>
                </li>
              );
            })}
          </ul>
          {selected ? <MessageView message={selected} /> : null}
        </div>
      )}
    </div>
  );
}
