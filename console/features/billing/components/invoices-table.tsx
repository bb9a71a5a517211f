import { Badge, type BadgeTone } from '@console/components/ui/badge';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { formatDate } from '@console/utils/format-date';
import { useInvoices } from '../api/get-invoices';
import { formatMoney } from '../utils/format-money';

const statusTones: Record<string, BadgeTone> = { paid: 'ok', open: 'warning', uncollectible: 'danger', void: 'neutral', draft: 'neutral' };

export function InvoicesTable({ enabled }: { enabled: boolean }) {
  const invoices = useInvoices(enabled);
  if (!enabled) return <EmptyState title="No invoices">Invoices appear here once a payment provider is configured and a plan is bought.</EmptyState>;
  if (invoices.isPending) return <LoadingState label="Loading invoices…" />;
  if (invoices.isError) return <ErrorState error={invoices.error} onRetry={() => invoices.refetch()} />;
  if (invoices.data.data.length === 0) {
    return <EmptyState title="No invoices yet">The first invoice is issued when you change to a paid plan.</EmptyState>;
  }
  return (
    <Table caption="Invoices, newest first">
      <thead>
        <tr>
          <Th>Invoice</Th>
          <Th>Service period</Th>
          <Th>Status</Th>
          <Th className="text-right">Amount</Th>
          <Th>
            <span className="sr-only">Link</span>
          </Th>
        </tr>
      </thead>
      <tbody>
        {invoices.data.data.map((invoice) => (
          <tr key={invoice.id}>
            <Td className="font-mono text-xs">{invoice.number ?? invoice.id}</Td>
            <Td>
              {formatDate(invoice.periodStart)} – {formatDate(invoice.periodEnd)}
            </Td>
            <Td>
              <Badge tone={statusTones[invoice.status ?? ''] ?? 'neutral'}>{invoice.status ?? 'unknown'}</Badge>
            </Td>
            <Td className="text-right font-mono">
              {formatMoney(invoice.status === 'paid' ? invoice.amountPaidMinor : invoice.amountDueMinor, invoice.currency)}
            </Td>
            <Td className="text-right">
              {invoice.hostedInvoiceUrl && (
                <a
                  href={invoice.hostedInvoiceUrl}
                  target="_blank"
                  rel="noreferrer"
                  className="text-sm font-semibold text-ink-700 underline-offset-2 hover:underline"
                >
                  View<span className="sr-only"> invoice {invoice.number ?? invoice.id}</span>
                </a>
              )}
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
