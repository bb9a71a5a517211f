import { Router } from 'express';
import { buildCheckoutSession, publicCheckoutSession, type FakeCheckoutLineItem } from '../objects/sessions';
import type { ProviderState } from '../state';
import {
  onlyParams,
  optionalArray,
  optionalInteger,
  optionalMetadata,
  optionalObject,
  optionalString,
  requiredString,
  requireHttpUrl,
  type Params,
} from './params';
import { missingObject, ProviderRequestError } from './provider-request-error';
import { idParam, paramsOf } from './route-helpers';

const SESSION_PARAMS = [
  'mode',
  'customer',
  'customer_email',
  'client_reference_id',
  'line_items',
  'success_url',
  'cancel_url',
  'metadata',
  'subscription_data',
  'payment_method_types',
  'locale',
  'allow_promotion_codes',
];

function badRequest(message: string, param: string): ProviderRequestError {
  return new ProviderRequestError(400, 'invalid_request_error', message, 'parameter_invalid', param);
}

function readLineItems(state: ProviderState, params: Params): FakeCheckoutLineItem[] {
  const raw = optionalArray(params, 'line_items') ?? [];
  if (raw.length === 0) throw badRequest('A subscription checkout needs at least one line item.', 'line_items');
  return raw.map((entry, index) => {
    const line = (entry ?? {}) as Params;
    onlyParams(line, ['price', 'quantity']);
    const priceId = requiredString(line, 'price');
    const price = state.prices.get(priceId);
    if (!price) throw missingObject('price', priceId, `line_items[${index}][price]`);
    if (!price.active || price.type !== 'recurring') {
      throw badRequest(`The price ${priceId} is not an active recurring price.`, `line_items[${index}][price]`);
    }
    return { price: priceId, quantity: optionalInteger(line, 'quantity', { min: 1, max: 999 }) ?? 1 };
  });
}

export function checkoutRoutes(state: ProviderState): Router {
  const router = Router();

  router.post('/v1/checkout/sessions', (request, response) => {
    const params = paramsOf(request);
    onlyParams(params, SESSION_PARAMS);
    const mode = requiredString(params, 'mode');
    if (mode !== 'subscription') throw badRequest('This local fake supports subscription checkouts only (mode=subscription).', 'mode');
    const customer = optionalString(params, 'customer') ?? null;
    if (customer && !state.customers.has(customer)) throw missingObject('customer', customer, 'customer');
    const lineItems = readLineItems(state, params);
    const prices = lineItems.map((line) => state.prices.get(line.price)!);
    const currency = prices[0].currency;
    if (prices.some((price) => price.currency !== currency)) throw badRequest('All line items must use the same currency.', 'line_items');
    const subscriptionData = optionalObject(params, 'subscription_data') ?? {};
    onlyParams(subscriptionData, ['metadata', 'description']);

    const session = buildCheckoutSession({
      baseUrl: state.baseUrl,
      customer,
      customerEmail: optionalString(params, 'customer_email') ?? null,
      clientReferenceId: optionalString(params, 'client_reference_id') ?? null,
      successUrl: requireHttpUrl(requiredString(params, 'success_url'), 'success_url'),
      cancelUrl: (() => {
        const cancelUrl = optionalString(params, 'cancel_url');
        return cancelUrl === undefined ? null : requireHttpUrl(cancelUrl, 'cancel_url');
      })(),
      lineItems,
      amountTotal: lineItems.reduce((sum, line, index) => sum + prices[index].unit_amount * line.quantity, 0),
      currency,
      metadata: optionalMetadata(params, 'metadata') ?? {},
      subscriptionMetadata: optionalMetadata(subscriptionData, 'metadata') ?? {},
    });
    state.checkoutSessions.set(session.id, session);
    response.json(publicCheckoutSession(session));
  });

  router.get('/v1/checkout/sessions/:id', (request, response) => {
    const session = state.checkoutSessions.get(idParam(request));
    if (!session) throw missingObject('checkout.session', idParam(request));
    response.json(publicCheckoutSession(session));
  });

  return router;
}
