import { startPaymentProviderFake, type PaymentProviderFake } from './payment-provider/start-payment-provider-fake';
import { startSmtpFake, type SmtpFake } from './smtp/start-smtp-fake';

export interface LocalFakesOptions {
  /** 0 = any free port (tests); a fixed port keeps URLs stable across `npm start` runs. */
  smtpPort?: number;
  paymentsPort?: number;
  paymentsWebhookSecret: string;
  /** Our server's provider-webhook route; may also be set later on `payments.setWebhookUrl`. */
  paymentsWebhookUrl?: string | null;
  /** Keeps the payment fake's customers and subscriptions across restarts (development). */
  paymentsStatePath?: string;
}

export interface LocalFakes {
  smtp: SmtpFake;
  payments: PaymentProviderFake;
  stop(): Promise<void>;
}

/** Both stand-ins for hosted services, on loopback, for `npm start` in development and for test suites. */
export async function startLocalFakes(options: LocalFakesOptions): Promise<LocalFakes> {
  const smtp = await startSmtpFake({ port: options.smtpPort ?? 0 });
  let payments: PaymentProviderFake;
  try {
    payments = await startPaymentProviderFake({
      port: options.paymentsPort ?? 0,
      webhookSecret: options.paymentsWebhookSecret,
      webhookUrl: options.paymentsWebhookUrl ?? null,
      statePath: options.paymentsStatePath,
    });
  } catch (error) {
    await smtp.stop();
    throw error;
  }
  return {
    smtp,
    payments,
    stop: async () => {
      await Promise.allSettled([smtp.stop(), payments.stop()]);
    },
  };
}
