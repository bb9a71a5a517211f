import { formatMoney } from '../money';
import type { FakePortalSession } from '../objects/sessions';
import { productNameOf, type ProviderState } from '../state';
import { escapeHtml, page } from './html';

const DATE_FORMAT = new Intl.DateTimeFormat('en-GB', { timeZone: 'UTC', day: 'numeric', month: 'long', year: 'numeric' });

function formatDate(unixSeconds: number): string {
  return DATE_FORMAT.format(new Date(unixSeconds * 1000));
}

export function portalPage(state: ProviderState, session: FakePortalSession): string {
  const customer = state.customers.get(session.customer);
  const subscriptions = [...state.subscriptions.values()].filter((subscription) => subscription.customer === session.customer && subscription.status !== 'canceled');
  const paidPrices = [...state.prices.values()].filter((price) => price.active && price.type === 'recurring' && price.unit_amount > 0);

  const sections = subscriptions.map((subscription) => {
    const item = subscription.items.data[0];
    const current = `${productNameOf(state, item.price.product)}, ${formatMoney(item.price.unit_amount, item.price.currency)} per month`;
    const base = `/portal/${escapeHtml(session.id)}/subscriptions/${escapeHtml(subscription.id)}`;
    const switches = paidPrices
      .filter((price) => price.id !== item.price.id && price.currency === item.price.currency)
      .map((price) => {
        const label = `Switch to ${productNameOf(state, price.product)} (${formatMoney(price.unit_amount, price.currency)} per month)`;
        return `<form method="post" action="${base}/change"><input type="hidden" name="price" value="${escapeHtml(price.id)}"><button type="submit" class="secondary">${escapeHtml(label)}</button></form>`;
      });
    return [
      `<h2>Current plan</h2><dl><dt>Plan</dt><dd>${escapeHtml(current)}</dd><dt>Renews</dt><dd>${escapeHtml(formatDate(item.current_period_end))}</dd></dl>`,
      ...switches,
      `<form method="post" action="${base}/cancel"><button type="submit" class="danger">Cancel subscription now</button></form>`,
    ].join('\n');
  });

  const invoices = [...state.invoices.values()]
    .filter((invoice) => invoice.customer === session.customer)
    .sort((a, b) => b.created - a.created)
    .map(
      (invoice) =>
        `<tr><td><a href="/invoices/${escapeHtml(invoice.id)}">${escapeHtml(invoice.number)}</a></td><td>${escapeHtml(formatDate(invoice.created))}</td>` +
        `<td>${escapeHtml(formatMoney(invoice.amount_paid, invoice.currency))}</td><td>${escapeHtml(invoice.status)}</td></tr>`,
    );

  const returnLink = session.return_url ? `<p><a href="${escapeHtml(session.return_url)}">Return to Sweepline</a></p>` : '';
  return page(
    'Billing portal',
    [
      `<h1>Billing for ${escapeHtml(customer?.name ?? customer?.email ?? session.customer)}</h1>`,
      sections.length > 0 ? sections.join('\n') : '<p>No active subscription.</p>',
      invoices.length > 0 ? `<h2>Invoices</h2><table><thead><tr><th>Number</th><th>Date</th><th>Paid</th><th>Status</th></tr></thead><tbody>${invoices.join('')}</tbody></table>` : '',
      returnLink,
    ].join('\n'),
  );
}
