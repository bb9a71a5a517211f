import { LOCAL_FAKE_WEBHOOK_SECRET, type BillingConfig } from '@server/billing/billing-config';
import { createBillingService, type BillingService } from '@server/billing/billing-service';
import type { AppConfig } from '@server/config/env';
import type { AppDeps } from '@server/deps';
import { createMailer, type Mailer } from '@server/email/mailer';
import { mailerConfigFromSmtpUrl } from '@server/email/mailer-config';
import { startLocalFakes, type LocalFakes } from '@server/fakes/start-local-fakes';
import type { Outbox } from '@server/fakes/smtp/outbox';
import { organisationPlanBillingStore } from '@server/modules/usage/organisation-plan-billing-store';

/** Our route for the payment provider's signed events. */
export const PROVIDER_WEBHOOK_PATH = '/v1/billing/provider-webhook';

/** The hosted services a process talks to (e-mail relay, payment provider), and the local fakes standing in. */
export interface HostedServices {
  mailer?: Mailer;
  billing?: BillingService;
  /** The local SMTP catcher's messages, when it is the relay in use (development and tests only). */
  devOutbox?: Outbox;
  /** The fakes themselves, when started here (tests drive the payment fake's hosted pages through it). */
  fakes?: LocalFakes;
  /** Where each service points, for the start-up banner. */
  summary: string[];
  /** Once the server listens: the payment fake sends its signed events to our webhook route there. */
  announceBaseUrl(baseUrl: string): void;
  stop(): Promise<void>;
}

export interface HostedServicesOptions {
  /** Override the configured fake ports (tests pass 0 for free ports). */
  smtpFakePort?: number;
  paymentsFakePort?: number;
  paymentsStatePath?: string;
  /** Start the fakes even when the configuration says not to (test helpers). */
  forceLocalFakes?: boolean;
}

function needsFakes(config: AppConfig, options: HostedServicesOptions): boolean {
  const wanted = options.forceLocalFakes ?? config.hosted.localFakes;
  return wanted && (config.hosted.smtpUrl === null || config.hosted.payments === null);
}

/**
 * Builds the mailer and the billing service from the configuration. What is not configured is taken by the
 * local fakes when they are enabled (development, tests), and is otherwise absent: features that need it answer
 * with a 503 problem that names the missing setting.
 */
export async function startHostedServices(
  deps: Pick<AppDeps, 'config' | 'db' | 'clock'>,
  options: HostedServicesOptions = {},
): Promise<HostedServices> {
  const { hosted } = deps.config;
  const fakes = needsFakes(deps.config, options)
    ? await startLocalFakes({
        smtpPort: options.smtpFakePort ?? hosted.smtpFakePort,
        paymentsPort: options.paymentsFakePort ?? hosted.paymentsFakePort,
        paymentsWebhookSecret: LOCAL_FAKE_WEBHOOK_SECRET,
        paymentsStatePath: options.paymentsStatePath,
      })
    : undefined;

  const summary: string[] = [];
  const smtpUrl = hosted.smtpUrl ?? fakes?.smtp.url ?? null;
  const mailer = smtpUrl ? createMailer(mailerConfigFromSmtpUrl(smtpUrl, hosted.mailFrom)) : undefined;
  summary.push(
    hosted.smtpUrl ? 'E-mail: SMTP relay from SMTP_URL' : fakes ? `E-mail: local catcher ${fakes.smtp.url} (messages on the console's Outbox page)` : 'E-mail: not configured (set SMTP_URL)',
  );

  const billingConfig: BillingConfig | null = hosted.payments
    ? { secretKey: hosted.payments.secretKey, webhookSecret: hosted.payments.webhookSecret, apiBaseUrl: hosted.payments.apiBaseUrl ?? undefined }
    : fakes
      ? { webhookSecret: LOCAL_FAKE_WEBHOOK_SECRET, apiBaseUrl: fakes.payments.baseUrl }
      : null;
  const billing = billingConfig ? createBillingService(billingConfig, organisationPlanBillingStore(deps)) : undefined;
  const paymentsUseFake = !hosted.payments && fakes !== undefined;
  summary.push(
    hosted.payments
      ? 'Payments: provider key from PAYMENTS_SECRET_KEY'
      : paymentsUseFake
        ? `Payments: local provider fake ${fakes.payments.baseUrl} (test cards only, no money moves)`
        : 'Payments: not configured (set PAYMENTS_SECRET_KEY and PAYMENTS_WEBHOOK_SECRET)',
  );

  return {
    mailer,
    billing,
    devOutbox: !hosted.smtpUrl && fakes ? fakes.smtp.outbox : undefined,
    fakes,
    summary,
    announceBaseUrl(baseUrl) {
      if (paymentsUseFake) fakes.payments.setWebhookUrl(`${baseUrl}${PROVIDER_WEBHOOK_PATH}`);
    },
    async stop() {
      mailer?.close();
      await fakes?.stop();
    },
  };
}
