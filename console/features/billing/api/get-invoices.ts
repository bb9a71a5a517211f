import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { InvoiceList } from '@shared/schemas/billing';
import { billingKeys } from './keys';

export const getInvoices = () => apiClient.get<InvoiceList>('/billing/invoices');

export const getInvoicesQueryOptions = () => queryOptions({ queryKey: billingKeys.invoices(), queryFn: getInvoices });

export const useInvoices = (enabled = true) => useQuery({ ...getInvoicesQueryOptions(), enabled });
