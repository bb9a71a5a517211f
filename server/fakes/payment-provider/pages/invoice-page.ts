import { formatMoney } from '../money';
import type { FakeInvoice } from '../objects/invoice';
import { escapeHtml, page } from './html';

export function invoicePage(invoice: FakeInvoice): string {
  const lines = invoice.lines.data.map(
    (line) => `<tr><td>${escapeHtml(line.description)}</td><td>${escapeHtml(formatMoney(line.amount, line.currency))}</td></tr>`,
  );
  return page(
    `Invoice ${invoice.number}`,
    [
      `<h1>Invoice ${escapeHtml(invoice.number)}</h1>`,
      `<dl><dt>Billed to</dt><dd>${escapeHtml(invoice.customer_name ?? invoice.customer_email ?? invoice.customer)}</dd>`,
      `<dt>Status</dt><dd>${escapeHtml(invoice.status)}</dd><dt>Total</dt><dd>${escapeHtml(formatMoney(invoice.total, invoice.currency))}</dd></dl>`,
      `<table><thead><tr><th>Item</th><th>Amount</th></tr></thead><tbody>${lines.join('')}</tbody></table>`,
    ].join('\n'),
  );
}

export function messagePage(title: string, message: string, link?: { href: string; label: string }): string {
  const linkHtml = link ? `<p><a href="${escapeHtml(link.href)}">${escapeHtml(link.label)}</a></p>` : '';
  return page(title, `<h1>${escapeHtml(title)}</h1>\n<p>${escapeHtml(message)}</p>\n${linkHtml}`);
}
