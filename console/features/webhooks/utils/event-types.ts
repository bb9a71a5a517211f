import { WEBHOOK_EVENT_TYPE_NAMES } from '@shared/schemas/webhooks';

export type WebhookEventTypeName = (typeof WEBHOOK_EVENT_TYPE_NAMES)[number];

const descriptions: Record<WebhookEventTypeName, string> = {
  'analysis.succeeded': 'An analysis finished with a result (and a verdict when a mask was applied).',
  'analysis.failed': 'An analysis stopped with an error.',
  'quota.threshold': 'A monthly quota reached 80 % or 100 % (once per period each).',
};

/** Every event an endpoint can subscribe to, in the API's order, with a line saying when it is sent. */
export const WEBHOOK_EVENT_CHOICES = WEBHOOK_EVENT_TYPE_NAMES.map((name) => ({ name, description: descriptions[name] }));
