import { z } from 'zod';
import { timestampSchema } from './common';

const planIdSchema = z.string().min(1).max(16).meta({ description: 'Plan id: `bench` (free), `line` or `plant`.', example: 'line' });

export const planLimitsSchema = z
  .object({
    analysesPerMonth: z.number().int().nonnegative(),
    audioMinutesPerMonth: z.number().nonnegative(),
    storageBytes: z.number().int().nonnegative().meta({ description: 'Decimal bytes (1 GB = 10^9 bytes).' }),
    requestsPerMinute: z.number().int().nonnegative().meta({ description: 'Per API key or signed-in user.' }),
    maxUploadBytes: z.number().int().nonnegative(),
    maxUploadDurationSeconds: z.number().nonnegative(),
    maxUploadChannels: z.number().int().nonnegative(),
    maxUploadSampleRateHz: z.number().int().nonnegative(),
  })
  .meta({ id: 'PlanLimits', description: 'What a plan includes per month, and the limits of each upload.' });
export type PlanLimits = z.infer<typeof planLimitsSchema>;

export const planSchema = z
  .object({
    id: planIdSchema,
    name: z.string().meta({ example: 'Line' }),
    summary: z.string().meta({ example: 'For a lab or a production line with several rigs.' }),
    monthlyPriceMinor: z.number().int().nonnegative().meta({ description: 'Price per month in minor units (cents) of `currency`; 0 for the free plan.', example: 29000 }),
    currency: z.string().meta({ description: 'ISO 4217 code, lower case.', example: 'eur' }),
    limits: planLimitsSchema,
  })
  .meta({ id: 'Plan', description: 'One plan of the catalogue.' });
export type Plan = z.infer<typeof planSchema>;

export const planCatalogueSchema = z
  .object({
    data: z.array(planSchema),
    currentPlanId: planIdSchema,
    /** Whether checkout, portal and invoices can be used on this server. */
    billingAvailable: z
      .boolean()
      .meta({ description: 'False when the server has no payment provider configured: checkout, portal and invoices then answer 503.' }),
  })
  .meta({ id: 'PlanCatalogue', description: 'Every plan, cheapest first, and the plan the organisation is on.' });
export type PlanCatalogue = z.infer<typeof planCatalogueSchema>;

export const billingAccountSchema = z
  .object({
    planId: planIdSchema,
    subscriptionStatus: z
      .string()
      .nullable()
      .meta({ description: 'The payment provider\'s status word (active, past_due, canceled, …); null without a subscription.', example: 'active' }),
    currentPeriodEndsAt: timestampSchema.nullable().meta({ description: 'End of the paid period; null on the free plan.' }),
    hasBillingAccount: z.boolean().meta({ description: 'True once a checkout has created the organisation\'s customer at the provider (portal and invoices need it).' }),
    hasSubscription: z.boolean().meta({ description: 'True while the organisation pays for a plan; plan changes then go through the portal.' }),
    billingAvailable: z.boolean(),
  })
  .meta({ id: 'BillingAccount', description: 'The organisation\'s plan and subscription as the provider\'s last event left them.' });
export type BillingAccount = z.infer<typeof billingAccountSchema>;

export const checkoutRequestSchema = z
  .strictObject({ planId: planIdSchema })
  .meta({ id: 'CheckoutRequest', description: 'The paid plan to subscribe to.' });
export type CheckoutRequest = z.infer<typeof checkoutRequestSchema>;

export const hostedPageSchema = z
  .object({
    url: z.url().meta({ description: 'Short-lived page of the payment provider; send the browser there.', example: 'https://pay.example/checkout/cs_test_a1B2' }),
  })
  .meta({ id: 'HostedBillingPage' });
export type HostedBillingPage = z.infer<typeof hostedPageSchema>;

export const invoiceSchema = z
  .object({
    id: z.string().meta({ example: 'in_1Q2w3E4r5T6y' }),
    number: z.string().nullable().meta({ example: 'KB7Q2M4X-0001' }),
    status: z.string().nullable().meta({ description: 'draft, open, paid, uncollectible or void.', example: 'paid' }),
    currency: z.string().meta({ example: 'eur' }),
    amountDueMinor: z.number().int(),
    amountPaidMinor: z.number().int(),
    periodStart: timestampSchema.meta({ description: 'Start of the service period the invoice pays for.' }),
    periodEnd: timestampSchema,
    createdAt: timestampSchema,
    hostedInvoiceUrl: z.string().nullable().meta({ description: 'The provider\'s page to view or download the invoice.' }),
    planId: planIdSchema.nullable(),
  })
  .meta({ id: 'Invoice' });
export type Invoice = z.infer<typeof invoiceSchema>;

export const invoiceListSchema = z
  .object({ data: z.array(invoiceSchema) })
  .meta({ id: 'InvoiceList', description: 'The organisation\'s invoices, newest first (at most 24); empty before the first checkout.' });
export type InvoiceList = z.infer<typeof invoiceListSchema>;

export const providerWebhookAckSchema = z
  .object({
    received: z.literal(true),
    outcome: z.enum(['applied', 'ignored']),
    eventId: z.string(),
  })
  .meta({ id: 'ProviderWebhookAck' });
export type ProviderWebhookAck = z.infer<typeof providerWebhookAckSchema>;
