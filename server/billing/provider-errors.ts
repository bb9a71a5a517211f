import Stripe from 'stripe';
import { BillingError } from './billing-error';

/**
 * Runs one provider call and turns SDK failures into BillingErrors: a missing object is named, anything else
 * is the provider's problem (502), never blamed on our API client.
 */
export async function callProvider<T>(what: string, call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    if (error instanceof BillingError) throw error;
    if (error instanceof Stripe.errors.StripeError) {
      if (error.code === 'resource_missing') {
        throw new BillingError('billing_object_missing', `The payment provider does not know this object (${what}): ${error.message}`, {
          status: 409,
          cause: error,
        });
      }
      throw new BillingError('payment_provider_error', `The payment provider refused ${what}: ${error.message}`, { status: 502, cause: error });
    }
    throw new BillingError('payment_provider_unreachable', `The payment provider could not be reached for ${what}.`, { status: 502, cause: error });
  }
}
