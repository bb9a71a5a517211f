// After a checkout the provider sends the browser back to /usage?checkout=<session id> (or =canceled). The plan
// changes only when the provider's signed event reaches the server, so the page polls until it has.

const STORAGE_KEY = 'sweepline.checkout-plan';

export type CheckoutReturn = { kind: 'none' } | { kind: 'canceled' } | { kind: 'completed'; sessionId: string };

export function checkoutReturnOf(search: URLSearchParams): CheckoutReturn {
  const value = search.get('checkout');
  if (!value) return { kind: 'none' };
  if (value === 'canceled') return { kind: 'canceled' };
  return { kind: 'completed', sessionId: value };
}

/** Kept in the tab only, to name the plan while the page waits. */
export function rememberCheckoutPlan(planId: string): void {
  try {
    sessionStorage.setItem(STORAGE_KEY, planId);
  } catch {
    // Storage may be blocked; the page then waits for "a paid plan" instead of a named one.
  }
}

export function recalledCheckoutPlan(): string | null {
  try {
    return sessionStorage.getItem(STORAGE_KEY);
  } catch {
    return null;
  }
}

export function forgetCheckoutPlan(): void {
  try {
    sessionStorage.removeItem(STORAGE_KEY);
  } catch {
    // Nothing to forget.
  }
}

/** The wait is over once the organisation has a subscription (on the chosen plan, when known). */
export function checkoutApplied(account: { planId: string; hasSubscription: boolean }, expectedPlanId: string | null): boolean {
  return account.hasSubscription && (expectedPlanId === null || account.planId === expectedPlanId);
}

export const CHECKOUT_POLL_MS = 1_500;
export const CHECKOUT_WAIT_LIMIT_MS = 60_000;
