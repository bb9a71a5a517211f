import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { PlanCatalogue } from '@shared/schemas/billing';
import { billingKeys } from './keys';

export const getPlans = () => apiClient.get<PlanCatalogue>('/billing/plans');

export const getPlansQueryOptions = () => queryOptions({ queryKey: billingKeys.plans(), queryFn: getPlans, staleTime: 60_000 });

export const usePlans = () => useQuery(getPlansQueryOptions());
