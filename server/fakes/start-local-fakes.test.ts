import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createBillingClient } from '@server/billing/billing-client';
import { LOCAL_FAKE_WEBHOOK_SECRET } from '@server/billing/billing-config';
import { createMailer } from '@server/email/mailer';
import { mailerConfigFromSmtpUrl } from '@server/email/mailer-config';
import { toOutboxEntry } from './smtp/outbox-view';
import { startLocalFakes, type LocalFakes } from './start-local-fakes';

let fakes: LocalFakes;

beforeAll(async () => {
  fakes = await startLocalFakes({ paymentsWebhookSecret: LOCAL_FAKE_WEBHOOK_SECRET });
});

afterAll(async () => {
  await fakes.stop();
});

describe('startLocalFakes', () => {
  it('gives the mailer and the billing client addresses they can use at once', async () => {
    const mailer = createMailer(mailerConfigFromSmtpUrl(fakes.smtp.url, 'Sweepline <no-reply@sweepline.example>'));
    await mailer.sendMail({
      to: 'Anouk de Vries <anouk@kestrelbay.example>',
      subject: 'Calibration KB-M10 expires soon',
      text: 'Open http://127.0.0.1:5173/calibrations/cal_01 to renew it.\nDetails: http://127.0.0.1:5173/rigs/rig_02',
    });
    mailer.close();
    const entry = toOutboxEntry(await fakes.smtp.outbox.waitFor((email) => email.subject.startsWith('Calibration')));
    expect(entry).toMatchObject({
      from: ['Sweepline <no-reply@sweepline.example>'],
      to: ['anouk@kestrelbay.example'],
      links: ['http://127.0.0.1:5173/calibrations/cal_01', 'http://127.0.0.1:5173/rigs/rig_02'],
    });

    const stripe = createBillingClient({ webhookSecret: LOCAL_FAKE_WEBHOOK_SECRET, apiBaseUrl: fakes.payments.baseUrl });
    expect((await stripe.prices.list({ limit: 10 })).data).toHaveLength(3);
  });
});
