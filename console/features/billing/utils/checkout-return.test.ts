import { describe, expect, it } from 'vitest';
import { checkoutApplied, checkoutReturnOf } from './checkout-return';

describe('checkout return', () => {
  it('reads the provider\'s return parameter', () => {
    expect(checkoutReturnOf(new URLSearchParams(''))).toEqual({ kind: 'none' });
    expect(checkoutReturnOf(new URLSearchParams('checkout=canceled'))).toEqual({ kind: 'canceled' });
    expect(checkoutReturnOf(new URLSearchParams('checkout=cs_test_kb65'))).toEqual({ kind: 'completed', sessionId: 'cs_test_kb65' });
  });

  it('waits until the subscription is there, on the chosen plan when it is known', () => {
    expect(checkoutApplied({ planId: 'bench', hasSubscription: false }, 'line')).toBe(false);
    expect(checkoutApplied({ planId: 'line', hasSubscription: true }, 'line')).toBe(true);
    expect(checkoutApplied({ planId: 'plant', hasSubscription: true }, 'line')).toBe(false);
    expect(checkoutApplied({ planId: 'plant', hasSubscription: true }, null)).toBe(true);
  });
});
