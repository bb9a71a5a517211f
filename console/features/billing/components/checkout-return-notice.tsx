import { Alert } from '@console/components/ui/alert';
import { Button } from '@console/components/ui/button';
import { Spinner } from '@console/components/ui/spinner';
import type { CheckoutReturn } from '../utils/checkout-return';

export type CheckoutWait = 'waiting' | 'applied' | 'timed_out';

type CheckoutReturnNoticeProps = {
  checkout: CheckoutReturn;
  wait: CheckoutWait;
  planName: string | null;
  onCheckAgain: () => void;
  onDismiss: () => void;
};

/** What happened at the provider's checkout, and whether its confirmation has reached Sweepline yet. */
export function CheckoutReturnNotice({ checkout, wait, planName, onCheckAgain, onDismiss }: CheckoutReturnNoticeProps) {
  if (checkout.kind === 'none') return null;
  if (checkout.kind === 'canceled') {
    return (
      <Alert tone="info" title="Checkout canceled" role="status">
        <p>Nothing was charged and the plan is unchanged.</p>
        <DismissButton onDismiss={onDismiss} />
      </Alert>
    );
  }
  if (wait === 'applied') {
    return (
      <Alert tone="success" title={planName ? `You are now on ${planName}` : 'The new plan is active'} role="status">
        <p>The payment provider confirmed the subscription; the new limits apply from now on.</p>
        <DismissButton onDismiss={onDismiss} />
      </Alert>
    );
  }
  if (wait === 'timed_out') {
    return (
      <Alert tone="warning" title="Still waiting for the payment provider" role="status">
        <p>The payment went through the checkout, but its confirmation has not reached Sweepline yet. This can take a few minutes.</p>
        <Button variant="secondary" size="sm" className="mt-2" onClick={onCheckAgain}>
          Check again
        </Button>
      </Alert>
    );
  }
  return (
    <div role="status" className="flex items-center gap-2 rounded-md border border-ink-200 bg-surface px-4 py-3 text-sm text-ink-700">
      <Spinner className="text-signal-700" />
      <span>Payment received. Waiting for the payment provider to confirm {planName ? `the ${planName} plan` : 'the new plan'}…</span>
    </div>
  );
}

function DismissButton({ onDismiss }: { onDismiss: () => void }) {
  return (
    <Button variant="secondary" size="sm" className="mt-2" onClick={onDismiss}>
      Dismiss
    </Button>
  );
}
