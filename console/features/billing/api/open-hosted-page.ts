import { useMutation } from '@tanstack/react-query';
import { apiClient } from '@console/lib/api-client';
import type { CheckoutRequest, HostedBillingPage } from '@shared/schemas/billing';

export const startCheckout = (input: CheckoutRequest) => apiClient.post<HostedBillingPage>('/billing/checkout', input);

export const openBillingPortal = () => apiClient.post<HostedBillingPage>('/billing/portal');

/** The provider's pages are whole pages of their own: the browser leaves the console and comes back to /usage. */
const goTo = ({ url }: HostedBillingPage) => window.location.assign(url);

export const useStartCheckout = () => useMutation({ mutationFn: startCheckout, onSuccess: goTo });

export const useOpenBillingPortal = () => useMutation({ mutationFn: openBillingPortal, onSuccess: goTo });
