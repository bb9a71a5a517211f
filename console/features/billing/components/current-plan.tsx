import { ProblemAlert } from '@console/components/ui/alert';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { formatDate } from '@console/utils/format-date';
import type { BillingAccount } from '@shared/schemas/billing';
import { usePlans } from '../api/get-plans';
import { useOpenBillingPortal } from '../api/open-hosted-page';
import { formatMoney } from '../utils/format-money';

type CurrentPlanProps = { account: { data?: BillingAccount; isPending: boolean; isError: boolean; error: unknown; refetch: () => unknown } };

const statusWords: Record<string, string> = { active: 'Active', trialing: 'Trial', past_due: 'Payment overdue', canceled: 'Canceled', unpaid: 'Unpaid' };

/** The plan the organisation is on, its subscription state, and the way to the billing portal. */
export function CurrentPlan({ account }: CurrentPlanProps) {
  const plans = usePlans();
  const portal = useOpenBillingPortal();
  if (account.isPending || plans.isPending) return <LoadingState label="Loading plan…" />;
  if (account.isError || plans.isError) return <ErrorState error={account.error ?? plans.error} onRetry={() => account.refetch()} />;
  const state = account.data!;
  const plan = plans.data.data.find((candidate) => candidate.id === state.planId);

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <p className="text-2xl font-extrabold text-ink-900" data-testid="current-plan-name">
          {plan?.name ?? state.planId}
        </p>
        {plan && (
          <p className="text-sm text-ink-600">
            {plan.monthlyPriceMinor === 0 ? 'Free' : `${formatMoney(plan.monthlyPriceMinor, plan.currency)} per month`}
          </p>
        )}
        {state.subscriptionStatus && (
          <Badge tone={state.subscriptionStatus === 'active' ? 'ok' : state.subscriptionStatus === 'past_due' ? 'warning' : 'neutral'}>
            {statusWords[state.subscriptionStatus] ?? state.subscriptionStatus}
          </Badge>
        )}
      </div>
      {state.currentPeriodEndsAt && <p className="text-sm text-ink-600">Paid until {formatDate(state.currentPeriodEndsAt)}; renews monthly.</p>}
      {!state.billingAvailable ? (
        <p className="text-sm text-ink-600">
          This server has no payment provider configured, so the plan cannot be changed here. An operator sets PAYMENTS_SECRET_KEY and
          PAYMENTS_WEBHOOK_SECRET.
        </p>
      ) : (
        <div className="space-y-2">
          <Button
            variant="secondary"
            disabled={!state.hasBillingAccount || portal.isSuccess}
            isPending={portal.isPending}
            onClick={() => portal.mutate()}
            aria-describedby="manage-billing-hint"
          >
            Manage billing
          </Button>
          <p id="manage-billing-hint" className="text-xs text-ink-500">
            {state.hasBillingAccount
              ? 'Payment details, plan changes and cancellation, on the payment provider\'s page.'
              : 'Available after the first change to a paid plan.'}
          </p>
        </div>
      )}
      {portal.isError && <ProblemAlert error={portal.error} />}
    </div>
  );
}
