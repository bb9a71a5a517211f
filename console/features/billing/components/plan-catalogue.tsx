import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { cn } from '@console/utils/cn';
import type { BillingAccount, Plan } from '@shared/schemas/billing';
import { formatBytes, formatCount } from '@console/utils/format-quantity';
import { usePlans } from '../api/get-plans';
import { useOpenBillingPortal, useStartCheckout } from '../api/open-hosted-page';
import { formatMoney } from '../utils/format-money';
import { rememberCheckoutPlan } from '../utils/checkout-return';

function limitLines(plan: Plan): string[] {
  const { limits } = plan;
  return [
    `${formatCount(limits.analysesPerMonth)} analyses per month`,
    `${formatCount(limits.audioMinutesPerMonth)} audio minutes per month`,
    `${formatBytes(limits.storageBytes)} storage`,
    `${formatCount(limits.requestsPerMinute)} requests per minute`,
    `Uploads up to ${formatCount(limits.maxUploadDurationSeconds)} s, ${limits.maxUploadChannels} channels, ${formatCount(limits.maxUploadSampleRateHz / 1000)} kHz`,
  ];
}

/**
 * The plans side by side. A first paid plan is bought through the provider's hosted checkout; an organisation that
 * already pays changes or cancels its plan in the billing portal, so it never holds two subscriptions.
 */
export function PlanCatalogue({ account }: { account: BillingAccount | undefined }) {
  const plans = usePlans();
  const checkout = useStartCheckout();
  const portal = useOpenBillingPortal();
  if (plans.isPending) return <LoadingState label="Loading plans…" />;
  if (plans.isError) return <ErrorState error={plans.error} onRetry={() => plans.refetch()} />;
  const { data: catalogue } = plans;
  const paying = account?.hasSubscription ?? false;
  const busy = checkout.isPending || portal.isPending || checkout.isSuccess || portal.isSuccess;

  return (
    <div className="space-y-4">
      {(checkout.isError || portal.isError) && <ProblemAlert error={checkout.error ?? portal.error} />}
      <ul className="grid gap-4 lg:grid-cols-3">
        {catalogue.data.map((plan) => {
          const current = plan.id === catalogue.currentPlanId;
          const free = plan.monthlyPriceMinor === 0;
          return (
            <li
              key={plan.id}
              aria-labelledby={`plan-${plan.id}`}
              className={cn('flex flex-col rounded-lg border p-5', current ? 'border-ink-700 bg-ink-50' : 'border-ink-200 bg-surface')}
            >
              <div className="flex items-start justify-between gap-3">
                <h3 id={`plan-${plan.id}`} className="text-lg font-extrabold text-ink-900">
                  {plan.name}
                </h3>
                {current && <Badge tone="accent">Current plan</Badge>}
              </div>
              <p className="mt-1 text-sm text-ink-600">{plan.summary}</p>
              <p className="mt-3">
                <span className="text-2xl font-extrabold text-ink-900">{free ? 'Free' : formatMoney(plan.monthlyPriceMinor, plan.currency)}</span>
                {!free && <span className="text-sm text-ink-600"> per month</span>}
              </p>
              <ul className="mt-3 flex-1 space-y-1 text-sm text-ink-700">
                {limitLines(plan).map((line) => (
                  <li key={line} className="flex gap-2">
                    <span aria-hidden="true" className="text-ok-600">
                      ✓
                    </span>
                    {line}
                  </li>
                ))}
              </ul>
              <div className="mt-4">
                {current ? null : !catalogue.billingAvailable ? (
                  <p className="text-xs text-ink-500">Plan changes need a payment provider configured on the server.</p>
                ) : paying ? (
                  <Button variant="secondary" className="w-full" disabled={busy} isPending={portal.isPending} onClick={() => portal.mutate()}>
                    {free ? `Return to ${plan.name} in the billing portal` : `Switch to ${plan.name} in the billing portal`}
                  </Button>
                ) : free ? null : (
                  <Button
                    className="w-full"
                    disabled={busy}
                    isPending={checkout.isPending && checkout.variables?.planId === plan.id}
                    onClick={() => {
                      rememberCheckoutPlan(plan.id);
                      checkout.mutate({ planId: plan.id });
                    }}
                  >
                    Change to {plan.name}
                  </Button>
                )}
              </div>
            </li>
          );
        })}
      </ul>
      <p className="text-xs text-ink-500">
        Prices exclude any taxes the payment provider adds for your country. Payment happens on the provider's page; Sweepline
        never sees card details.
      </p>
    </div>
  );
}
