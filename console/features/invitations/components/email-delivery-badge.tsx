import { Badge } from '@console/components/ui/badge';
import type { Invitation } from '@shared/schemas/invitations';

const labels: Record<Invitation['emailDelivery']['status'], { text: string; tone: 'ok' | 'danger' | 'warning' }> = {
  sent: { text: 'E-mail sent', tone: 'ok' },
  failed: { text: 'E-mail failed', tone: 'danger' },
  not_sent: { text: 'No e-mail sent', tone: 'warning' },
};

export function EmailDeliveryBadge({ delivery }: { delivery: Invitation['emailDelivery'] }) {
  const label = labels[delivery.status];
  return (
    <div className="space-y-0.5">
      <Badge tone={label.tone}>{label.text}</Badge>
      {delivery.detail && <p className="max-w-xs text-xs text-ink-600">{delivery.detail}</p>}
    </div>
  );
}
