import { Router } from 'express';
import { pageOf } from '../objects/list';
import type { FakeSubscription } from '../objects/subscription';
import type { ProviderState } from '../state';
import { listOptions, onlyParams, optionalString } from './params';
import { missingObject, ProviderRequestError } from './provider-request-error';
import { idParam, paramsOf } from './route-helpers';

const SUBSCRIPTION_STATUSES = ['active', 'past_due', 'unpaid', 'canceled', 'incomplete', 'incomplete_expired', 'trialing', 'all', 'ended'];

function matchesStatusFilter(subscription: FakeSubscription, status: string | undefined): boolean {
  if (status === undefined) return subscription.status !== 'canceled';
  if (status === 'all') return true;
  if (status === 'ended') return subscription.status === 'canceled' || subscription.status === 'incomplete_expired';
  return subscription.status === status;
}

/** Subscriptions and invoices: read-only here, they change through the checkout and portal pages. */
export function billingRoutes(state: ProviderState): Router {
  const router = Router();

  router.get('/v1/subscriptions', (request, response) => {
    const params = paramsOf(request);
    onlyParams(params, ['customer', 'price', 'status', 'limit', 'starting_after']);
    const customer = optionalString(params, 'customer');
    if (customer !== undefined && !state.customers.has(customer)) throw missingObject('customer', customer, 'customer');
    const price = optionalString(params, 'price');
    const status = optionalString(params, 'status');
    if (status !== undefined && !SUBSCRIPTION_STATUSES.includes(status)) {
      throw new ProviderRequestError(400, 'invalid_request_error', `Invalid status: must be one of ${SUBSCRIPTION_STATUSES.join(', ')}`, 'parameter_invalid', 'status');
    }
    const subscriptions = [...state.subscriptions.values()].filter(
      (subscription) =>
        (customer === undefined || subscription.customer === customer) &&
        (price === undefined || subscription.items.data.some((item) => item.price.id === price)) &&
        matchesStatusFilter(subscription, status),
    );
    response.json(pageOf(subscriptions, '/v1/subscriptions', listOptions(params)));
  });

  router.get('/v1/subscriptions/:id', (request, response) => {
    const subscription = state.subscriptions.get(idParam(request));
    if (!subscription) throw missingObject('subscription', idParam(request));
    response.json(subscription);
  });

  router.get('/v1/invoices', (request, response) => {
    const params = paramsOf(request);
    onlyParams(params, ['customer', 'subscription', 'status', 'limit', 'starting_after']);
    const customer = optionalString(params, 'customer');
    if (customer !== undefined && !state.customers.has(customer)) throw missingObject('customer', customer, 'customer');
    const subscription = optionalString(params, 'subscription');
    const status = optionalString(params, 'status');
    const invoices = [...state.invoices.values()].filter(
      (invoice) =>
        (customer === undefined || invoice.customer === customer) &&
        (subscription === undefined || invoice.parent.subscription_details.subscription === subscription) &&
        (status === undefined || invoice.status === status),
    );
    response.json(pageOf(invoices, '/v1/invoices', listOptions(params)));
  });

  router.get('/v1/invoices/:id', (request, response) => {
    const invoice = state.invoices.get(idParam(request));
    if (!invoice) throw missingObject('invoice', idParam(request));
    response.json(invoice);
  });

  router.get('/v1/events/:id', (request, response) => {
    const event = state.events.find((candidate) => candidate.id === idParam(request));
    if (!event) throw missingObject('event', idParam(request));
    response.json(event);
  });

  return router;
}
