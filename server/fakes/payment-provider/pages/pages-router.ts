import express, { Router, type NextFunction, type Request, type Response } from 'express';
import { unixSeconds } from '../ids';
import { cancelSubscriptionNow, changeSubscriptionPrice, completeCheckout, FlowError, isCheckoutExpired } from '../flows';
import type { FakePortalSession } from '../objects/sessions';
import type { ProviderState } from '../state';
import { deliverEvents } from '../webhooks/events';
import { checkoutPage } from './checkout-page';
import { PAGE_SECURITY_HEADERS, STYLESHEET, STYLESHEET_PATH } from './html';
import { invoicePage, messagePage } from './invoice-page';
import { portalPage } from './portal-page';

function sendPage(response: Response, html: string, status = 200): void {
  response.status(status).set(PAGE_SECURITY_HEADERS).type('html').send(html);
}

function notFound(response: Response, what: string): void {
  sendPage(response, messagePage('Not found', `This ${what} does not exist on the local payment provider.`), 404);
}

/** The provider substitutes the session id into a success URL that asks for it. */
function successRedirect(successUrl: string, sessionId: string): string {
  return successUrl.replaceAll('{CHECKOUT_SESSION_ID}', encodeURIComponent(sessionId));
}

function livePortalSession(state: ProviderState, request: Request, response: Response): FakePortalSession | undefined {
  const session = state.portalSessions.get(String(request.params.sessionId));
  if (!session) {
    notFound(response, 'portal session');
    return undefined;
  }
  if (unixSeconds() > session._expiresAt) {
    sendPage(response, messagePage('Portal session expired', 'Open the billing portal again from Sweepline.', session.return_url ? { href: session.return_url, label: 'Return to Sweepline' } : undefined), 410);
    return undefined;
  }
  return session;
}

/** The hosted pages a browser visits: checkout, billing portal, invoice. */
export function pagesRouter(state: ProviderState): Router {
  const router = Router();
  const form = express.urlencoded({ extended: false, limit: '10kb' });

  router.get(STYLESHEET_PATH, (_request, response) => {
    response.set(PAGE_SECURITY_HEADERS).type('css').send(STYLESHEET);
  });

  router.get('/checkout/:sessionId', (request, response) => {
    const session = state.checkoutSessions.get(request.params.sessionId);
    if (!session) return notFound(response, 'checkout');
    if (session.status === 'complete') {
      return sendPage(response, messagePage('Already paid', 'This checkout is complete.', { href: successRedirect(session.success_url, session.id), label: 'Continue' }));
    }
    if (isCheckoutExpired(session)) {
      return sendPage(response, messagePage('Checkout expired', 'Start the plan change again from Sweepline.', session.cancel_url ? { href: session.cancel_url, label: 'Go back' } : undefined), 410);
    }
    sendPage(response, checkoutPage(state, session));
  });

  router.post('/checkout/:sessionId/pay', form, async (request, response) => {
    const session = state.checkoutSessions.get(request.params.sessionId);
    if (!session) return notFound(response, 'checkout');
    const events = completeCheckout(state, session);
    await deliverEvents(state, events);
    response.redirect(303, successRedirect(session.success_url, session.id));
  });

  router.get('/portal/:sessionId', (request, response) => {
    const session = livePortalSession(state, request, response);
    if (session) sendPage(response, portalPage(state, session));
  });

  router.post('/portal/:sessionId/subscriptions/:subscriptionId/:action', form, async (request, response) => {
    const session = livePortalSession(state, request, response);
    if (!session) return;
    const subscription = state.subscriptions.get(request.params.subscriptionId);
    if (!subscription || subscription.customer !== session.customer) return notFound(response, 'subscription');
    let events;
    if (request.params.action === 'change') {
      const price = state.prices.get(String(request.body?.price ?? ''));
      if (!price || !price.active || price.unit_amount <= 0) return notFound(response, 'plan');
      events = changeSubscriptionPrice(state, subscription, price);
    } else if (request.params.action === 'cancel') {
      events = cancelSubscriptionNow(state, subscription);
    } else {
      return notFound(response, 'action');
    }
    await deliverEvents(state, events);
    response.redirect(303, session.return_url ?? `/portal/${session.id}`);
  });

  router.get('/invoices/:invoiceId', (request, response) => {
    const invoice = state.invoices.get(request.params.invoiceId);
    if (!invoice) return notFound(response, 'invoice');
    sendPage(response, invoicePage(invoice));
  });

  router.use((error: unknown, _request: Request, response: Response, next: NextFunction) => {
    if (error instanceof FlowError) return sendPage(response, messagePage('Cannot continue', error.message), error.status);
    next(error);
  });

  return router;
}
