import { z } from 'zod';
import {
  billingAccountSchema,
  checkoutRequestSchema,
  hostedPageSchema,
  invoiceListSchema,
  planCatalogueSchema,
  providerWebhookAckSchema,
} from '@shared/schemas/billing';
import { defineRoute } from '@server/http/define-route';
import { PROVIDER_PROBLEMS } from './billing-problem';
import { billingAccount, listInvoicesFor, openPortalFor, planCatalogue, startCheckoutFor } from './billing.service';
import { PROVIDER_SIGNATURE_HEADER, receiveProviderWebhook } from './provider-webhook';

const NOT_CONFIGURED =
  'Without a payment provider configured on the server the answer is 503 `billing_not_configured`, naming the missing settings.';

export const billingRoutes = [
  defineRoute({
    method: 'get',
    path: '/billing/plans',
    operationId: 'listPlans',
    summary: 'Plan catalogue',
    description: 'Every plan with its monthly price and limits, and the plan the organisation is on. Served also without a payment provider.',
    tags: ['Billing'],
    permission: 'billing:manage',
    responses: { 200: { description: 'The catalogue.', schema: planCatalogueSchema } },
    handler: async ({ deps, principal }) => ({ status: 200, body: await planCatalogue(deps, principal.organisationId) }),
  }),
  defineRoute({
    method: 'get',
    path: '/billing/account',
    operationId: 'getBillingAccount',
    summary: 'Plan and subscription of the organisation',
    description:
      'The plan and subscription state as the payment provider\'s latest event left them. After a checkout, poll this (or ' +
      '`GET /v1/usage`) until `planId` shows the new plan: the change arrives by the provider\'s signed event, not by the redirect.',
    tags: ['Billing'],
    permission: 'billing:manage',
    responses: { 200: { description: 'The billing state.', schema: billingAccountSchema } },
    handler: async ({ deps, principal }) => ({ status: 200, body: await billingAccount(deps, principal.organisationId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/billing/checkout',
    operationId: 'startCheckout',
    summary: 'Start a checkout for a paid plan',
    description:
      'Returns the payment provider\'s hosted checkout page for a first paid subscription; send the browser there. It returns ' +
      'to the console\'s usage page (`/usage?checkout=…`). The plan changes once the provider\'s signed event has arrived. ' +
      'An organisation that already pays changes plan in the billing portal (409 `subscription_exists`). ' +
      NOT_CONFIGURED,
    tags: ['Billing'],
    permission: 'billing:manage',
    request: { body: checkoutRequestSchema },
    responses: { 200: { description: 'The hosted checkout page.', schema: hostedPageSchema } },
    problems: [...PROVIDER_PROBLEMS, 'plan_not_purchasable', 'subscription_exists', 'plan_price_missing'],
    handler: async ({ deps, principal, body }) => ({ status: 200, body: await startCheckoutFor(deps, principal, body.planId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/billing/portal',
    operationId: 'openBillingPortal',
    summary: 'Open the billing portal',
    description:
      'Returns a short-lived link to the payment provider\'s portal, where the plan is changed or cancelled and payment ' +
      'details are kept. Needs a billing account (made by the first checkout): else 409 `billing_account_missing`. ' +
      NOT_CONFIGURED,
    tags: ['Billing'],
    permission: 'billing:manage',
    responses: { 200: { description: 'The portal page.', schema: hostedPageSchema } },
    problems: [...PROVIDER_PROBLEMS, 'billing_account_missing'],
    handler: async ({ deps, principal }) => ({ status: 200, body: await openPortalFor(deps, principal.organisationId) }),
  }),
  defineRoute({
    method: 'get',
    path: '/billing/invoices',
    operationId: 'listInvoices',
    summary: 'Invoices',
    description: `The organisation's invoices from the payment provider, newest first, with a link to each. ${NOT_CONFIGURED}`,
    tags: ['Billing'],
    permission: 'billing:manage',
    responses: { 200: { description: 'The invoices.', schema: invoiceListSchema } },
    problems: PROVIDER_PROBLEMS,
    handler: async ({ deps, principal }) => ({ status: 200, body: { data: await listInvoicesFor(deps, principal.organisationId) } }),
  }),
  defineRoute({
    method: 'post',
    path: '/billing/provider-webhook',
    operationId: 'receiveProviderWebhook',
    summary: 'Payment provider events (called by the provider)',
    description:
      'Where the payment provider posts its signed events (register this URL and its signing secret, PAYMENTS_WEBHOOK_SECRET, ' +
      'at the provider). The signature is checked over the raw body. Subscription, checkout and invoice events set the ' +
      'organisation\'s plan from the subscription as the provider has it now, so repeated or out-of-order deliveries give the ' +
      'same result; other event types are acknowledged and ignored. A bad or missing signature is 400 and changes nothing; ' +
      'a provider or database failure is 5xx, which the provider retries. ' +
      NOT_CONFIGURED,
    tags: ['Billing'],
    auth: 'public',
    rateLimit: false,
    request: {
      headers: z.object({
        [PROVIDER_SIGNATURE_HEADER]: z.string().optional().meta({ description: 'The provider\'s signature over timestamp and raw body.' }),
      }),
      bodyContent: { 'application/json': z.object({ id: z.string(), type: z.string() }).loose().meta({ description: 'A provider event, verified byte for byte.' }) },
    },
    responses: { 200: { description: 'Received (applied or ignored).', schema: providerWebhookAckSchema } },
    problems: [...PROVIDER_PROBLEMS, 'webhook_signature_missing', 'webhook_signature_invalid', 'webhook_payload_invalid'],
    handler: async ({ deps, req }) => ({ status: 200, body: await receiveProviderWebhook(deps, req) }),
  }),
];
