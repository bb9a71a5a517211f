import { useState } from 'react';
import { Alert } from '@console/components/ui/alert';
import { Panel } from '@console/components/ui/panel';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { cn } from '@console/utils/cn';
import { formatDateTime, formatRelativeTime } from '@console/utils/format-date';
import type { OutboxMessageSummary } from '@shared/schemas/dev-outbox';
import { useOutbox } from '../api/get-outbox';
import { useOutboxMessage } from '../api/get-outbox-message';
import { LinkedText } from './linked-text';

function MessageList({ messages, selectedId, onSelect }: { messages: OutboxMessageSummary[]; selectedId: string; onSelect: (id: string) => void }) {
  return (
    <ul className="divide-y divide-ink-100" aria-label="Caught e-mails">
      {messages.map((message) => {
        const selected = message.id === selectedId;
        return (
          <li key={message.id}>
            <button
              type="button"
              onClick={() => onSelect(message.id)}
              aria-current={selected || undefined}
              className={cn(
                'relative block w-full px-5 py-3 text-left hover:bg-ink-50',
                selected && 'bg-ink-50 before:absolute before:inset-y-2 before:left-0 before:w-0.5 before:rounded-full before:bg-signal-600',
              )}
            >
              <span className="block truncate text-sm font-bold text-ink-900">{message.subject || '(no subject)'}</span>
              <span className="block truncate text-xs text-ink-700">To {message.to.join(', ')}</span>
              <span className="block font-mono text-xs text-ink-500" title={formatDateTime(message.receivedAt)}>
                {formatRelativeTime(message.receivedAt)}
              </span>
            </button>
          </li>
        );
      })}
    </ul>
  );
}

function MessageDetail({ messageId }: { messageId: string }) {
  const message = useOutboxMessage(messageId);
  if (message.isPending) return <LoadingState label="Opening the e-mail…" />;
  if (message.isError) return <ErrorState error={message.error} onRetry={() => message.refetch()} />;
  const { data } = message;
  return (
    <article aria-labelledby="outbox-message-subject" className="space-y-4">
      <header className="space-y-1 border-b border-ink-100 pb-3">
        <h2 id="outbox-message-subject" className="text-base font-bold text-ink-900">
          {data.subject || '(no subject)'}
        </h2>
        <dl className="grid grid-cols-[4rem_minmax(0,1fr)] gap-x-2 text-xs text-ink-700">
          <dt className="font-semibold text-ink-500">From</dt>
          <dd className="break-all">{data.from.join(', ')}</dd>
          <dt className="font-semibold text-ink-500">To</dt>
          <dd className="break-all">{data.to.join(', ')}</dd>
          <dt className="font-semibold text-ink-500">Received</dt>
          <dd>{formatDateTime(data.receivedAt)}</dd>
        </dl>
      </header>
      {data.links.length > 0 && (
        <div className="space-y-1">
          <p className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">Links</p>
          <ul className="space-y-1 text-sm">
            {data.links.map((link) => (
              <li key={link}>
                <a href={link} className="break-all font-semibold text-ink-800 underline underline-offset-2 hover:text-signal-800">
                  {link}
                </a>
              </li>
            ))}
          </ul>
        </div>
      )}
      <div className="rounded-md border border-ink-200 bg-ink-50 px-4 py-3 font-mono text-xs leading-relaxed whitespace-pre-wrap text-ink-800">
        {data.text ? <LinkedText text={data.text} /> : 'This e-mail has no plain-text part.'}
      </div>
    </article>
  );
}

export function OutboxView() {
  const outbox = useOutbox();
  const [chosenId, setChosenId] = useState<string | null>(null);

  if (outbox.isPending) return <LoadingState label="Loading caught e-mails…" />;
  if (outbox.isError) return <ErrorState error={outbox.error} onRetry={() => outbox.refetch()} />;
  if (outbox.data === null) {
    return (
      <Alert tone="info" title="No outbox on this server">
        This server sends e-mail through a real mail relay (or none), so there is nothing caught to show.
      </Alert>
    );
  }
  const messages = outbox.data;
  if (messages.length === 0) {
    return (
      <Panel flush>
        <EmptyState title="No e-mails caught yet">Invite someone from the Members page and the e-mail shows up here.</EmptyState>
      </Panel>
    );
  }
  const selectedId = chosenId && messages.some((message) => message.id === chosenId) ? chosenId : messages[0]!.id;
  return (
    <div className="grid items-start gap-6 lg:grid-cols-[20rem_minmax(0,1fr)]">
      <Panel title="Caught e-mails" description={`${messages.length} kept until the server restarts`} flush>
        <MessageList messages={messages} selectedId={selectedId} onSelect={setChosenId} />
      </Panel>
      <Panel>
        <MessageDetail messageId={selectedId} />
      </Panel>
    </div>
  );
}
