import type { EmailContent } from './email-content';
import { formatCount, formatGigabytes, formatPercent, formatUtcDateTime } from './format';
import { htmlActionLink, htmlDocument, htmlParagraph, PRODUCT_NAME, textDocument } from './layout';

/** The metered quantities that have a monthly limit. */
export type UsageMetric = 'analyses' | 'audio_minutes' | 'storage_bytes';

/** The two points at which admins are told. */
export type UsageThresholdPercent = 80 | 100;

export interface UsageThresholdEmailInput {
  organisationName: string;
  planName: string;
  metric: UsageMetric;
  /** In the metric's own unit: a count, minutes or bytes. */
  used: number;
  limit: number;
  thresholdPercent: UsageThresholdPercent;
  /** When the current period ends and the monthly counters start again. */
  periodEndsAt: Date;
  /** Console page with usage and plan. */
  usageUrl: string;
}

const METRIC_NOUNS: Record<UsageMetric, string> = {
  analyses: 'analyses',
  audio_minutes: 'audio minutes',
  storage_bytes: 'storage',
};

const CONSEQUENCES: Record<UsageMetric, string> = {
  analyses: 'New analyses are refused',
  audio_minutes: 'New analyses are refused',
  storage_bytes: 'New uploads are refused',
};

function formatAmount(metric: UsageMetric, value: number): string {
  if (metric === 'storage_bytes') return formatGigabytes(value);
  if (metric === 'audio_minutes') return `${formatCount(value)} min`;
  return formatCount(value);
}

export function usageThresholdEmail(input: UsageThresholdEmailInput): EmailContent {
  const { organisationName, planName, metric, used, limit, thresholdPercent, periodEndsAt, usageUrl } = input;
  const noun = METRIC_NOUNS[metric];
  const reached = thresholdPercent >= 100;
  const subject = reached
    ? `${organisationName} has reached its ${noun} limit on ${PRODUCT_NAME}`
    : `${organisationName} has used ${formatPercent(thresholdPercent)} of its ${noun} on ${PRODUCT_NAME}`;
  const resetsAt = formatUtcDateTime(periodEndsAt);
  const status =
    `${organisationName} has used ${formatAmount(metric, used)} of the ${formatAmount(metric, limit)} of ${noun} ` +
    `included in the ${planName} plan (${formatPercent((used / limit) * 100)}).`;
  const outlook = reached
    ? `${CONSEQUENCES[metric]} until the period resets on ${resetsAt}, or until the organisation moves to a larger plan. ` +
      'Results already computed stay available.'
    : `The period resets on ${resetsAt}. Nothing changes for now; at ${formatPercent(100)} ${CONSEQUENCES[metric].toLowerCase()} until the reset.`;
  const footer = `You receive this because you are an administrator of ${organisationName} on ${PRODUCT_NAME}.`;

  const text = textDocument(['Hello,', status, outlook, `Usage and plan:\n${usageUrl}`], footer);
  const html = htmlDocument(
    subject,
    [htmlParagraph('Hello,'), htmlParagraph(status), htmlParagraph(outlook), htmlActionLink('See usage and plan', usageUrl)],
    footer,
  );
  return { subject, text, html };
}
