/** How the billing layer reaches the payment provider. */
export interface BillingConfig {
  /** A real provider secret key (sk_test_… or sk_live_…). Absent: talk to the local fake at `apiBaseUrl`. */
  secretKey?: string;
  /** Signing secret of our webhook endpoint at the provider (whsec_…); the local fake signs with it too. */
  webhookSecret: string;
  /** Overrides the provider's API address, e.g. `http://127.0.0.1:4243` for the local fake. */
  apiBaseUrl?: string;
}

/** The key our code presents to the local fake; the fake accepts nothing else by default. */
export const LOCAL_FAKE_SECRET_KEY = 'sk_test_sweepline_local_fake';
/** Development default signing secret shared by the fake and the server; never valid at the real provider. */
export const LOCAL_FAKE_WEBHOOK_SECRET = 'whsec_sweepline_local_fake_only';
