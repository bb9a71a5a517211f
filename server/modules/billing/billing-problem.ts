import { isProblemCode, PROBLEMS, type ProblemCode } from '@shared/problems';
import { isBillingError } from '@server/billing/billing-error';
import type { BillingService } from '@server/billing/billing-service';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';

/** The billing problems a route may answer with, for its OpenAPI entry. */
export const PROVIDER_PROBLEMS: ProblemCode[] = ['billing_not_configured', 'billing_object_missing', 'payment_provider_error', 'payment_provider_unreachable'];

/** The payment provider is optional: without it, billing routes answer 503 and say what to set. */
export function requireBilling(deps: Pick<AppDeps, 'billing'>): BillingService {
  if (deps.billing) return deps.billing;
  throw new ApiProblem(
    'billing_not_configured',
    'No payment provider is configured on this server. Set PAYMENTS_SECRET_KEY and PAYMENTS_WEBHOOK_SECRET ' +
      '(or, in development, SWEEPLINE_LOCAL_FAKES=true for the local payment fake).',
    { extensions: { missingSettings: ['PAYMENTS_SECRET_KEY', 'PAYMENTS_WEBHOOK_SECRET'] } },
  );
}

/**
 * Turns a BillingError into the problem of the same code. A code the table lacks, or whose status differs, is a
 * provider failure on our side of the wire (502), never the caller's fault.
 */
export function toBillingProblem(error: unknown): unknown {
  if (!isBillingError(error)) return error;
  if (isProblemCode(error.code) && PROBLEMS[error.code].status === error.status) {
    return new ApiProblem(error.code, error.message, { cause: error });
  }
  if (error.code === 'billing_not_configured') return new ApiProblem('billing_not_configured', error.message, { cause: error });
  return new ApiProblem('payment_provider_error', error.message, { cause: error });
}

/** Runs a billing call and rethrows its failures as problems. */
export async function asProblem<T>(call: () => Promise<T>): Promise<T> {
  try {
    return await call();
  } catch (error) {
    throw toBillingProblem(error);
  }
}
