import { useEffect, useRef, useState } from 'react';
import { useQueryClient, type QueryClient } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { Alert } from '@console/components/ui/alert';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { useBillingAccount, getBillingAccountQueryOptions } from '@console/features/billing/api/get-billing-account';
import { getPlansQueryOptions, usePlans } from '@console/features/billing/api/get-plans';
import { billingKeys } from '@console/features/billing/api/keys';
import { CheckoutReturnNotice, type CheckoutWait } from '@console/features/billing/components/checkout-return-notice';
import { CurrentPlan } from '@console/features/billing/components/current-plan';
import { InvoicesTable } from '@console/features/billing/components/invoices-table';
import { PlanCatalogue } from '@console/features/billing/components/plan-catalogue';
import {
  CHECKOUT_POLL_MS,
  CHECKOUT_WAIT_LIMIT_MS,
  checkoutApplied,
  checkoutReturnOf,
  forgetCheckoutPlan,
  recalledCheckoutPlan,
} from '@console/features/billing/utils/checkout-return';
import { getDailyUsageQueryOptions } from '@console/features/usage/api/get-daily-usage';
import { getUsageQueryOptions } from '@console/features/usage/api/get-usage';
import { usageKeys } from '@console/features/usage/api/keys';
import { DailyUsageChart } from '@console/features/usage/components/daily-usage-chart';
import { UsageMeters } from '@console/features/usage/components/usage-meters';
import { hasPermission } from '@console/lib/authorization';

const BILLING_PERMISSION = 'billing:manage';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, BILLING_PERMISSION)) {
    void queryClient.prefetchQuery(getUsageQueryOptions());
    void queryClient.prefetchQuery(getDailyUsageQueryOptions());
    void queryClient.prefetchQuery(getPlansQueryOptions());
    void queryClient.prefetchQuery(getBillingAccountQueryOptions());
  }
  return null;
};

/** After the provider's checkout: polls the billing state until the provider's event has changed the plan. */
function useCheckoutWait(waitingFor: boolean) {
  const queryClient = useQueryClient();
  const [wait, setWait] = useState<CheckoutWait>(waitingFor ? 'waiting' : 'applied');
  const startedAt = useRef(Date.now());
  const account = useBillingAccount(waitingFor && wait === 'waiting' ? CHECKOUT_POLL_MS : false);
  const expectedPlanId = useRef(recalledCheckoutPlan()).current;

  useEffect(() => {
    if (!waitingFor || wait !== 'waiting' || !account.data) return;
    if (checkoutApplied(account.data, expectedPlanId)) {
      setWait('applied');
      forgetCheckoutPlan();
      void queryClient.invalidateQueries({ queryKey: usageKeys.all });
      void queryClient.invalidateQueries({ queryKey: billingKeys.plans() });
      void queryClient.invalidateQueries({ queryKey: billingKeys.invoices() });
    } else if (Date.now() - startedAt.current > CHECKOUT_WAIT_LIMIT_MS) {
      setWait('timed_out');
    }
  }, [waitingFor, wait, account.data, account.dataUpdatedAt, expectedPlanId, queryClient]);

  const checkAgain = () => {
    startedAt.current = Date.now();
    setWait('waiting');
    void account.refetch();
  };
  return { wait, account, checkAgain };
}

export default function UsageRoute() {
  const { data: session } = useSession();
  if (!session) return null;
  if (!hasPermission(session, BILLING_PERMISSION)) {
    return (
      <>
        <PageHeader eyebrow="Organisation" title="Usage & plan" />
        <Alert tone="info" title="Your role does not manage the plan">
          Owners and admins of {session.activeOrganisation.name} see usage against the plan, change the plan and read invoices.
        </Alert>
      </>
    );
  }
  return <UsageAndPlan organisationName={session.activeOrganisation.name} />;
}

function UsageAndPlan({ organisationName }: { organisationName: string }) {
  const [searchParams, setSearchParams] = useSearchParams();
  const checkout = checkoutReturnOf(searchParams);
  const { wait, account, checkAgain } = useCheckoutWait(checkout.kind === 'completed');
  const plans = usePlans();
  const nameOf = (planId: string | null | undefined) => plans.data?.data.find((plan) => plan.id === planId)?.name ?? null;

  return (
    <>
      <PageHeader
        eyebrow="Organisation"
        title="Usage & plan"
        description={`What ${organisationName} has used this period against its plan, and the plans to move to.`}
      />
      <div className="space-y-6">
        <CheckoutReturnNotice
          checkout={checkout}
          wait={wait}
          planName={wait === 'applied' ? nameOf(account.data?.planId) : nameOf(recalledCheckoutPlan())}
          onCheckAgain={checkAgain}
          onDismiss={() => setSearchParams({}, { replace: true })}
        />
        <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
          <Panel title="This period" description="Owners and admins get an e-mail at 80 % and at 100 % of each quota.">
            <UsageMeters />
          </Panel>
          <Panel title="Current plan">
            <CurrentPlan account={account} />
          </Panel>
        </div>
        <Panel title="Daily usage" description="Per UTC day of the current period.">
          <DailyUsageChart />
        </Panel>
        <Panel title="Plans" description="A change to a paid plan goes through the payment provider's checkout and applies once it confirms.">
          <PlanCatalogue account={account.data} />
        </Panel>
        <Panel title="Invoices" flush>
          <InvoicesTable enabled={account.data?.billingAvailable ?? false} />
        </Panel>
      </div>
    </>
  );
}
