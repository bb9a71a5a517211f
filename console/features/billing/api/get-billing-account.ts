import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { BillingAccount } from '@shared/schemas/billing';
import { billingKeys } from './keys';

export const getBillingAccount = () => apiClient.get<BillingAccount>('/billing/account');

export const getBillingAccountQueryOptions = () => queryOptions({ queryKey: billingKeys.account(), queryFn: getBillingAccount });

/** `pollMs` while the console waits for the provider's event after a checkout; false otherwise. */
export const useBillingAccount = (pollMs: number | false = false) =>
  useQuery({ ...getBillingAccountQueryOptions(), refetchInterval: pollMs });
