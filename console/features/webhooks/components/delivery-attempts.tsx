import { formatDateTime } from '@console/utils/format-date';
import type { WebhookDelivery } from '@shared/schemas/webhooks';
import { attemptOutcomeText } from '../utils/delivery-display';

/** Every attempt of one delivery, oldest first: when, what came back, how long it took. */
export function DeliveryAttempts({ delivery }: { delivery: WebhookDelivery }) {
  if (delivery.attemptLog.length === 0) {
    return <p className="text-xs text-ink-600">No attempt yet; the dispatcher sends it within a few seconds.</p>;
  }
  return (
    <ol className="space-y-2" aria-label={`Attempts of delivery ${delivery.id}`}>
      {delivery.attemptLog.map((attempt) => (
        <li key={attempt.attemptNumber} className="rounded-md border border-ink-200 bg-surface px-3 py-2 text-xs">
          <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
            <span className="font-semibold text-ink-900">Attempt {attempt.attemptNumber}</span>
            <time dateTime={attempt.attemptedAt} className="text-ink-600">
              {formatDateTime(attempt.attemptedAt)}
            </time>
            <span className="text-ink-800">{attemptOutcomeText(attempt.outcome)}</span>
            <span className="font-mono text-ink-700">HTTP {attempt.responseStatus ?? '—'}</span>
            <span className="font-mono text-ink-600">{attempt.durationMs} ms</span>
          </div>
          {attempt.error && (
            <p className="mt-1 text-danger-700">
              <span className="font-mono">{attempt.error.code}</span>: {attempt.error.message}
            </p>
          )}
          {attempt.responseExcerpt && (
            <pre className="mt-1 max-h-24 overflow-auto rounded-sm bg-ink-50 px-2 py-1 font-mono text-[11px] whitespace-pre-wrap text-ink-700">
              {attempt.responseExcerpt}
            </pre>
          )}
        </li>
      ))}
    </ol>
  );
}
