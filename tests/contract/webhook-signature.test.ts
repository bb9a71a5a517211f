import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { signWebhook } from '@server/webhooks/signature';
import { generateWebhookSecret } from '@server/webhooks/webhook-secret';

/**
 * The rig examples carry their own Standard Webhooks verifiers (Python standard library, Node, bash + openssl).
 * Here each one judges messages signed by the server's signer, so a receiver built from the examples accepts
 * exactly what Sweepline sends and refuses tampered, replayed and foreign messages.
 */
const examples = fileURLToPath(new URL('../../examples/', import.meta.url));
const hasOpenssl = spawnSync('openssl', ['version']).status === 0;
const scratch = mkdtempSync(join(tmpdir(), 'sweepline-webhook-contract-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const verifiers = [
  { name: 'python3 examples/rig_loop.py', command: 'python3', args: [join(examples, 'rig_loop.py')], available: true },
  { name: 'node examples/rig-loop.mjs', command: process.execPath, args: [join(examples, 'rig-loop.mjs')], available: true },
  { name: 'bash examples/rig-loop.sh', command: 'bash', args: [join(examples, 'rig-loop.sh')], available: hasOpenssl },
];

interface Message {
  id: string;
  timestamp: string;
  signature: string;
  body: string;
}

const nowSeconds = () => Math.floor(Date.now() / 1000);
// Non-ASCII and a trailing newline: the bytes must reach the HMAC unchanged.
const BODY = JSON.stringify({
  type: 'analysis.succeeded',
  timestamp: '2026-06-01T08:00:00.000Z',
  data: { id: 'ana_4Tq9', kind: 'response_and_distortion', status: 'succeeded', note: 'dB SPL re 20 µPa', url: '/v1/analyses/ana_4Tq9' },
}) + '\n';

function sign(secrets: string[], timestampSeconds = nowSeconds(), body = BODY): Message {
  const headers = signWebhook({ messageId: 'evt_5Hk2QmZ', timestampSeconds, body, secrets });
  return { id: headers['webhook-id'], timestamp: headers['webhook-timestamp'], signature: headers['webhook-signature'], body };
}

type Verifier = (typeof verifiers)[number];

/** Headers and secret through the environment, body on stdin (the default mode of each example). */
function viaEnvironment(verifier: Verifier, message: Message, secret: string) {
  const result = spawnSync(verifier.command, [...verifier.args, 'verify-webhook'], {
    input: Buffer.from(message.body, 'utf8'),
    env: {
      PATH: process.env.PATH,
      SWEEPLINE_WEBHOOK_ID: message.id,
      SWEEPLINE_WEBHOOK_TIMESTAMP: message.timestamp,
      SWEEPLINE_WEBHOOK_SIGNATURE: message.signature,
      SWEEPLINE_WEBHOOK_SECRET: secret,
    },
    encoding: 'utf8',
    timeout: 20_000,
  });
  return { status: result.status, stdout: result.stdout.trim(), stderr: result.stderr.trim() };
}

/** Everything as flags, body from a file. */
function viaFlags(verifier: Verifier, message: Message, secret: string) {
  const bodyFile = join(scratch, `body-${Math.random().toString(36).slice(2)}.json`);
  writeFileSync(bodyFile, message.body);
  const flags = ['--id', message.id, '--timestamp', message.timestamp, '--signature', message.signature, '--secret', secret, '--body-file', bodyFile];
  const result = spawnSync(verifier.command, [...verifier.args, 'verify-webhook', ...flags], {
    env: { PATH: process.env.PATH },
    encoding: 'utf8',
    timeout: 20_000,
  });
  return { status: result.status, stdout: result.stdout.trim(), stderr: result.stderr.trim() };
}

describe.each(verifiers)('$name verify-webhook', (verifier) => {
  const run = it.skipIf(!verifier.available);
  const current = generateWebhookSecret();
  const previous = generateWebhookSecret();

  run('accepts a message from the server signer (env + stdin, and flags + file)', () => {
    const message = sign([current]);
    expect(viaEnvironment(verifier, message, current)).toEqual({ status: 0, stdout: 'valid (secret #1)', stderr: '' });
    expect(viaFlags(verifier, message, current)).toMatchObject({ status: 0, stdout: 'valid (secret #1)' });
  });

  run('accepts either secret during a rotation (two signatures in the header)', () => {
    const message = sign([current, previous]);
    expect(message.signature.split(' ')).toHaveLength(2);
    expect(viaEnvironment(verifier, message, previous)).toMatchObject({ status: 0, stdout: 'valid (secret #1)' });
    expect(viaEnvironment(verifier, sign([current]), `${previous} ${current}`)).toMatchObject({ status: 0, stdout: 'valid (secret #2)' });
  });

  run('refuses a tampered body, a changed timestamp and a foreign secret', () => {
    const message = sign([current]);
    const tamperedBody = { ...message, body: message.body.replace('ana_4Tq9', 'ana_4Tq8') };
    const shiftedTimestamp = { ...message, timestamp: String(Number(message.timestamp) - 1) };
    for (const [candidate, secret] of [
      [tamperedBody, current],
      [shiftedTimestamp, current],
      [message, generateWebhookSecret()],
    ] as const) {
      const outcome = viaEnvironment(verifier, candidate, secret);
      expect(outcome.status).toBe(1);
      expect(outcome.stderr).toBe('invalid: no signature matches');
    }
  });

  run('refuses timestamps more than 5 minutes old or ahead, even when correctly signed', () => {
    for (const offsetSeconds of [-400, 400]) {
      const outcome = viaEnvironment(verifier, sign([current], nowSeconds() + offsetSeconds), current);
      expect(outcome.status).toBe(1);
      expect(outcome.stderr).toContain('tolerance');
    }
    // Within the window either way is fine (a little margin for the child process start-up).
    expect(viaEnvironment(verifier, sign([current], nowSeconds() - 240), current).status).toBe(0);
    expect(viaEnvironment(verifier, sign([current], nowSeconds() + 240), current).status).toBe(0);
  });

  run('refuses the published Standard Webhooks vector as a replay (valid signature, timestamp of 2021)', () => {
    // libraries/javascript/src/webhook.test.ts, "sign function works".
    const published = {
      id: 'msg_p5jXN8AQM9LWM0D4loKWxJek',
      timestamp: '1614265330',
      signature: 'v1,g0hM9SsE+OTPJTGt/tmIKtSyZlE3uFJELVlNIOLJ1OE=',
      body: '{"test": 2432232314}',
    };
    const outcome = viaEnvironment(verifier, published, 'whsec_MfKQ9r8GKYqrTwjUPD8ILPZIo2LaLaSw');
    expect(outcome.status).toBe(1);
    expect(outcome.stderr).toContain('tolerance');
  });

  run('refuses a message without a signature header and reports usage errors with exit code 2', () => {
    const message = { ...sign([current]), signature: '' };
    expect(viaEnvironment(verifier, message, current).status).toBe(1);
    expect(viaEnvironment(verifier, sign([current]), '').status).toBe(2);
  });
});
