#!/usr/bin/env node
// Sweepline rig loop in Node.js (20 or later) with undici (`npm install undici`).
//
//   export SWEEPLINE_BASE_URL=http://127.0.0.1:4620     # your Sweepline server
//   export SWEEPLINE_API_KEY=swl_test_...                # a key with captures:write, analyses:write/read
//   node rig-loop.mjs run path/to/capture.wav            # the whole loop
//   node rig-loop.mjs verify-webhook --body-file body.json   # check one received webhook (see below)
//
// The loop: create a sweep stimulus -> download its WAV -> (the rig plays it and records the DUT) -> upload the
// capture -> ask for an analysis and wait for it -> print the headline figures and the verdict.
//
// Every POST that creates something carries an Idempotency-Key. If the line drops and the script retries, it
// sends the *same* key, so the server replays its first answer instead of creating a second capture or
// analysis. A new key is made only for a genuinely new request.

import { createHmac, randomUUID, timingSafeEqual } from 'node:crypto';
import { openAsBlob, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { basename } from 'node:path';
import { pathToFileURL } from 'node:url';
import { fetch, FormData } from 'undici';

// --- What this rig measures. Edit for your set-up. ------------------------------------------------------------
// The capture you upload must be a recording of exactly this stimulus (same rate, length and sweep).
const STIMULUS = { kind: 'sweep', startHz: 20, stopHz: 20000, durationSeconds: 2, sampleRateHz: 48000, levelDbfs: -12 };
const CHANNELS = { measurement: 0, reference: 1 }; // input channel roles in the capture WAV; drop reference if none
const CONDITIONS = { distanceM: 1.0, driveVoltageVrms: 2.83, nominalImpedanceOhm: 8 };
const DUT = {
  model: process.env.SWEEPLINE_DUT_MODEL ?? 'KB-65',
  serial: process.env.SWEEPLINE_DUT_SERIAL ?? 'KB65-24-000123',
  lot: process.env.SWEEPLINE_DUT_LOT ?? 'KB65-L24-07',
};
const OPTIONS = {}; // engine defaults; smoothing, gating, harmonic orders etc. are described in the API reference

const SAFETY_CAUTION = `SAFETY before playing the stimulus:
  * Start at a low level and raise it step by step; a full-scale sweep can destroy a tweeter.
  * Never play test signals into headphones or an ear simulator while a person is wearing them.
  * Cap the amplifier's drive voltage for each DUT (its rated power into its nominal impedance).
  * Protect your own hearing near loud drivers; follow your lab's procedures and local regulations.`;

const TERMINAL_STATES = new Set(['succeeded', 'failed', 'canceled']);
const POLL_DEADLINE_MS = 300_000;
const MAX_TRIES = 5; // per request, for dropped connections, 409 (still running), 429 and 5xx

class ApiError extends Error {
  constructor(status, problem) {
    super(`${problem.title ?? `HTTP ${status}`} (${status}) ${problem.detail ?? ''}`);
    this.status = status;
    this.problem = problem;
  }
}

function config() {
  const baseUrl = (process.env.SWEEPLINE_BASE_URL ?? '').replace(/\/+$/, '');
  const apiKey = process.env.SWEEPLINE_API_KEY ?? '';
  if (!baseUrl || !apiKey) {
    console.error('Set SWEEPLINE_BASE_URL and SWEEPLINE_API_KEY in the environment.');
    process.exit(2);
  }
  return { baseUrl, apiKey };
}

const sleep = (ms) => new Promise((resolve) => setTimeout(resolve, ms));

function retryAfterMs(headers, defaultMs) {
  const value = headers.get('retry-after') ?? '';
  return /^\d+$/.test(value) ? Number(value) * 1000 : defaultMs;
}

/** One HTTP exchange, retried with the same headers (and so the same Idempotency-Key) when it is safe to. */
async function call(apiKey, url, { method = 'GET', headers = {}, body } = {}) {
  for (let attempt = 1; ; attempt += 1) {
    let response;
    try {
      // `body` is rebuilt per try (a FormData or string can be sent again; a stream could not).
      response = await fetch(url, {
        method,
        headers: { authorization: `Bearer ${apiKey}`, accept: 'application/json', ...headers },
        body: typeof body === 'function' ? await body() : body,
        signal: AbortSignal.timeout(60_000),
      });
    } catch (error) {
      if (attempt === MAX_TRIES) throw error;
      const waitMs = 2 ** attempt * 1000;
      console.error(`  network error (${error.cause?.code ?? error.message}), retrying in ${waitMs / 1000}s (same Idempotency-Key)`);
      await sleep(waitMs);
      continue;
    }
    if (response.ok) return response;
    const retryable = response.status === 409 || response.status === 429 || response.status >= 500;
    const problem = await response.json().catch(() => ({}));
    if (!retryable || attempt === MAX_TRIES) throw new ApiError(response.status, problem);
    const waitMs = retryAfterMs(response.headers, 2 ** attempt * 1000);
    console.error(`  HTTP ${response.status}, retrying in ${waitMs / 1000}s (same Idempotency-Key)`);
    await sleep(waitMs);
  }
}

function postJson(apiKey, url, document, extraHeaders = {}) {
  return call(apiKey, url, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'idempotency-key': randomUUID(), ...extraHeaders },
    body: JSON.stringify(document),
  });
}

async function run(capturePath) {
  const { baseUrl, apiKey } = config();

  // 1. The stimulus, defined by parameters; the server renders the same WAV every time.
  const stimulus = await (await postJson(apiKey, `${baseUrl}/v1/stimuli`, STIMULUS)).json();
  console.log(`stimulus ${stimulus.id}: ${STIMULUS.startHz}-${STIMULUS.stopHz} Hz sweep, ${STIMULUS.durationSeconds} s at ${STIMULUS.sampleRateHz} Hz`);
  const audio = await call(apiKey, `${baseUrl}/v1/stimuli/${encodeURIComponent(stimulus.id)}/audio?encoding=float32`, {
    headers: { accept: 'audio/wav' },
  });
  const stimulusPath = `stimulus-${stimulus.id}.wav`;
  const wav = Buffer.from(await audio.arrayBuffer());
  writeFileSync(stimulusPath, wav);
  console.log(`saved ${stimulusPath} (${wav.length} bytes)`);

  // 2. Playback and recording happen on the rig, outside this script.
  console.log(SAFETY_CAUTION);
  console.log(`-> the rig would now play ${stimulusPath} through the DUT and record it; this script uses ${capturePath} instead.`);

  // 3. Upload the capture. One key for this upload, reused by every retry of it.
  const captureBlob = await openAsBlob(capturePath, { type: 'audio/wav' });
  const uploadForm = () => {
    const form = new FormData();
    form.append('file', captureBlob, basename(capturePath));
    return form;
  };
  const capture = await (
    await call(apiKey, `${baseUrl}/v1/captures`, { method: 'POST', headers: { 'idempotency-key': randomUUID() }, body: uploadForm })
  ).json();
  console.log(`capture ${capture.id} uploaded (${captureBlob.size} bytes)`);

  // 4. Ask for the analysis; Prefer: wait=10 (RFC 7240) returns the result at once when it is quick.
  const analysisRequest = {
    kind: 'response_and_distortion',
    captureId: capture.id,
    stimulusId: stimulus.id,
    channels: CHANNELS,
    conditions: CONDITIONS,
    dut: DUT,
    options: OPTIONS,
  };
  let response = await postJson(apiKey, `${baseUrl}/v1/analyses`, analysisRequest, { prefer: 'wait=10' });
  let analysis = await response.json();
  const monitorUrl = new URL(response.headers.get('location') ?? `/v1/analyses/${analysis.id}`, `${baseUrl}/`).href;

  // 5. Not finished yet (202): poll the status monitor, as often as Retry-After says.
  const deadline = Date.now() + POLL_DEADLINE_MS;
  while (!TERMINAL_STATES.has(analysis.status)) {
    if (Date.now() > deadline) throw new Error(`analysis ${analysis.id} still ${analysis.status} after ${POLL_DEADLINE_MS / 1000} s`);
    await sleep(retryAfterMs(response.headers, 2000));
    response = await call(apiKey, monitorUrl);
    analysis = await response.json();
    console.log(`  analysis ${analysis.id}: ${analysis.status}`);
  }
  return printHeadline(analysis);
}

const isHeadline = (name) => /sensitivity|thd|band|limit/i.test(name);

function printHeadline(analysis) {
  console.log(`analysis ${analysis.id} ${analysis.status}`);
  if (analysis.status !== 'succeeded') {
    console.log(`  ${analysis.error?.title ?? 'no result'}: ${analysis.error?.detail ?? ''}`);
    return 1;
  }
  const result = analysis.result ?? {};
  const figures = Object.entries(result.figures ?? {}).filter(([, value]) => ['number', 'string'].includes(typeof value));
  const headline = figures.filter(([name]) => isHeadline(name));
  for (const [name, value] of headline.length > 0 ? headline : figures) console.log(`  ${name.padEnd(36)} ${value}`);
  let verdict = result.verdict ?? analysis.verdict;
  if (verdict && typeof verdict === 'object') {
    verdict = Object.entries(verdict)
      .filter(([, value]) => typeof value !== 'object')
      .map(([key, value]) => `${key}=${value}`)
      .join(', ');
  }
  console.log(`  ${'verdict'.padEnd(36)} ${verdict ?? 'none (no tolerance mask)'}`);
  for (const warning of result.warnings ?? []) console.log(`  warning ${warning.code}: ${warning.message}`);
  return 0;
}

// --- Webhooks (Standard Webhooks v1.0.0) -------------------------------------------------------------------------
// Instead of polling, an organisation can register an endpoint; Sweepline then POSTs events such as
// analysis.succeeded. Verify each one on the raw body bytes BEFORE parsing the JSON (in Express:
// express.raw({ type: 'application/json' })), and use webhook-id to ignore a delivery you already processed.

const TOLERANCE_SECONDS = 5 * 60;

export class WebhookInvalid extends Error {}

/**
 * Throws WebhookInvalid unless one v1 signature matches one of `secrets` (whsec_...) and the timestamp is within
 * 5 minutes of now. `body` is the raw request body (Buffer). Returns the index of the matching secret.
 */
export function verifyWebhook(body, { id, timestamp, signature }, secrets, nowSeconds = Math.floor(Date.now() / 1000)) {
  if (!id || !timestamp || !signature) throw new WebhookInvalid('missing webhook-id, webhook-timestamp or webhook-signature');
  if (!/^\d+$/.test(timestamp)) throw new WebhookInvalid('webhook-timestamp is not Unix seconds');
  if (Math.abs(nowSeconds - Number(timestamp)) > TOLERANCE_SECONDS) {
    throw new WebhookInvalid('timestamp outside the 5-minute tolerance (replayed or clock skew)');
  }
  const signed = Buffer.concat([Buffer.from(`${id}.${timestamp}.`, 'utf8'), body]);
  const received = signature
    .split(' ')
    .filter((entry) => entry.startsWith('v1,'))
    .map((entry) => Buffer.from(entry.slice(3), 'base64'));
  for (const [index, secret] of secrets.entries()) {
    const key = Buffer.from(secret.replace(/^whsec_/, ''), 'base64');
    const expected = createHmac('sha256', key).update(signed).digest();
    // timingSafeEqual takes the same time wherever the bytes differ; lengths are public (32 bytes).
    if (received.some((candidate) => candidate.length === expected.length && timingSafeEqual(candidate, expected))) return index;
  }
  throw new WebhookInvalid('no signature matches');
}

function verifyWebhookCommand(args) {
  const usage = `verify-webhook [--id ID] [--timestamp TS] [--signature SIG] [--secret SECRET] [--body-file PATH]
  Flags default to SWEEPLINE_WEBHOOK_ID/_TIMESTAMP/_SIGNATURE/_SECRET; the body is read from stdin without
  --body-file. SWEEPLINE_WEBHOOK_SECRET may hold several secrets separated by spaces (rotation).`;
  const values = {
    id: process.env.SWEEPLINE_WEBHOOK_ID ?? '',
    timestamp: process.env.SWEEPLINE_WEBHOOK_TIMESTAMP ?? '',
    signature: process.env.SWEEPLINE_WEBHOOK_SIGNATURE ?? '',
    secret: process.env.SWEEPLINE_WEBHOOK_SECRET ?? '',
    'body-file': '',
  };
  for (let index = 0; index < args.length; index += 2) {
    const name = args[index].replace(/^--/, '');
    if (!args[index].startsWith('--') || !(name in values) || index + 1 >= args.length) {
      console.error(usage);
      return 2;
    }
    values[name] = args[index + 1];
  }
  if (!values.secret) {
    console.error('no secret: set SWEEPLINE_WEBHOOK_SECRET or pass --secret');
    return 2;
  }
  const body = readFileSync(values['body-file'] || 0); // 0 = stdin
  try {
    const index = verifyWebhook(body, values, values.secret.split(/\s+/).filter(Boolean));
    console.log(`valid (secret #${index + 1})`);
    return 0;
  } catch (error) {
    if (!(error instanceof WebhookInvalid)) throw error;
    console.error(`invalid: ${error.message}`);
    return 1;
  }
}

async function main(argv) {
  if (argv[0] === 'verify-webhook') return verifyWebhookCommand(argv.slice(1));
  if (argv[0] === 'run' && argv.length === 2) {
    try {
      return await run(argv[1]);
    } catch (error) {
      if (error instanceof ApiError) {
        console.error(`API error: ${error.message}`);
        for (const item of error.problem.errors ?? []) console.error(`  ${item.pointer}: ${item.detail}`);
        return 1;
      }
      if (error instanceof TypeError && error.message === 'fetch failed') {
        console.error(`cannot reach ${process.env.SWEEPLINE_BASE_URL}: ${error.cause?.code ?? error.cause?.message}`);
        return 1;
      }
      throw error;
    }
  }
  console.error('usage: node rig-loop.mjs run <capture.wav> | verify-webhook [flags]');
  return 2;
}

// Runs only when executed directly, so a receiver can `import { verifyWebhook } from './rig-loop.mjs'`.
if (process.argv[1] && import.meta.url === pathToFileURL(realpathSync(process.argv[1])).href) {
  process.exitCode = await main(process.argv.slice(2));
}
