import { formatMoney } from '../money';
import type { FakeCheckoutSession } from '../objects/sessions';
import { productNameOf, type ProviderState } from '../state';
import { escapeHtml, page } from './html';

export function checkoutPage(state: ProviderState, session: FakeCheckoutSession): string {
  const customer = session.customer ? state.customers.get(session.customer) : undefined;
  const lines = session._lineItems.map((line) => {
    const price = state.prices.get(line.price);
    const name = price ? productNameOf(state, price.product) : line.price;
    const amount = price ? `${formatMoney(price.unit_amount, price.currency)} per month` : '';
    return `<tr><td>${escapeHtml(name)}</td><td>${line.quantity}</td><td>${escapeHtml(amount)}</td></tr>`;
  });
  const total = formatMoney(session.amount_total, session.currency);
  const billedTo = customer?.name ?? customer?.email ?? session.customer_email ?? 'new customer';
  const cancelLink = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : '';
  return page(
    'Test checkout',
    [
      '<h1>Subscribe</h1>',
      `<p class="amount">${escapeHtml(total)} per month</p>`,
      '<table><thead><tr><th>Plan</th><th>Qty</th><th>Price</th></tr></thead>',
      `<tbody>${lines.join('')}</tbody></table>`,
      `<dl><dt>Billed to</dt><dd>${escapeHtml(billedTo)}</dd><dt>Payment</dt><dd>Test card, always accepted</dd></dl>`,
      `<form method="post" action="/checkout/${escapeHtml(session.id)}/pay"><button type="submit">Pay ${escapeHtml(total)} and subscribe</button></form>`,
      cancelLink,
    ].join('\n'),
  );
}
