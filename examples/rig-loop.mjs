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
// sends the *same* key, so the server replays its first answer instead of creating a second stimulus, capture or
// analysis. A new key is made only for a genuinely new request.

import { createHmac, randomUUID, timingSafeEqual } from 'node:crypto';
import { openAsBlob, readFileSync, realpathSync, writeFileSync } from 'node:fs';
import { basename, join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { fetch, FormData } from 'undici';

// --- What this rig measures. Edit for your set-up. ------------------------------------------------------------
// The capture you upload must be a recording of exactly this stimulus (same rate, length and sweep): the server
// regenerates the sweep from these parameters to deconvolve the capture.
const STIMULUS = {
  type: 'sweep',
  name: 'KB-65 woofer sweep 20 Hz - 20 kHz',
  parameters: { startHz: 20, stopHz: 20000, approximateDurationSeconds: 2, sampleRateHz: 48000, levelDbfs: -12 },
};
const CHANNELS = { measurement: 0, reference: 1 }; // capture channel roles: microphone, loopback (null if none)
const CONDITIONS = { distanceM: 1.0, driveVoltageVrms: 2.83, nominalImpedanceOhm: 8, temperatureC: 20 };
const DUT = {
  model: process.env.SWEEPLINE_DUT_MODEL ?? 'KB-65 woofer',
  serial: process.env.SWEEPLINE_DUT_SERIAL ?? 'KB65-24-000123',
  lot: process.env.SWEEPLINE_DUT_LOT ?? 'KB65-L24-07',
};
const TAGS = ['line-1'];
// response_and_distortion takes { response: {...}, distortion: {...} }; {} = engine defaults (see the API reference).
const OPTIONS = {};
// Where the downloaded stimulus WAV is saved for the rig's player.
const STIMULUS_DIR = process.env.SWEEPLINE_STIMULUS_DIR ?? '.';
// How long the analysis POST may wait for the result (Prefer: wait=N, at most 60 s); 0 = answer 202 at once and poll.
const WAIT_SECONDS = process.env.SWEEPLINE_WAIT_SECONDS ?? '10';

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
    const backoffMs = 2 ** (attempt - 1) * 1000; // 1, 2, 4, 8 s
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
      console.error(`  network error (${error.cause?.code ?? error.message}), retrying in ${backoffMs / 1000}s (same Idempotency-Key)`);
      await sleep(backoffMs);
      continue;
    }
    if (response.ok) return response;
    // 409: the first try with this key is still being processed; 429: rate limit or quota; 5xx: server trouble.
    const retryable = response.status === 409 || response.status === 429 || response.status >= 500;
    const problem = await response.json().catch(() => ({}));
    if (!retryable || attempt === MAX_TRIES) throw new ApiError(response.status, problem);
    const waitMs = retryAfterMs(response.headers, backoffMs);
    console.error(`  HTTP ${response.status}, retrying in ${waitMs / 1000}s (same Idempotency-Key)`);
    await sleep(waitMs);
  }
}

/** POST a JSON document with a fresh Idempotency-Key; call() reuses that key for every retry of this request. */
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
  const { startHz, stopHz, sampleRateHz } = stimulus.parameters;
  console.log(`stimulus ${stimulus.id}: ${startHz}-${stopHz} Hz sweep, ${stimulus.totalDurationSeconds.toFixed(3)} s at ${sampleRateHz} Hz`);
  const audio = await call(apiKey, `${baseUrl}/v1/stimuli/${encodeURIComponent(stimulus.id)}/audio?encoding=float32`, {
    headers: { accept: 'audio/wav' },
  });
  const stimulusPath = join(STIMULUS_DIR, `stimulus-${stimulus.id}.wav`);
  const wav = Buffer.from(await audio.arrayBuffer());
  writeFileSync(stimulusPath, wav);
  console.log(`saved ${stimulusPath} (${wav.length} bytes)`);

  // 2. Playback and recording happen on the rig, outside this script. Show the server's cautions first.
  console.log('SAFETY before playing the stimulus:');
  for (const caution of stimulus.cautions ?? []) console.log(`  * ${caution}`);
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
  console.log(`capture ${capture.id} uploaded (${capture.channelCount} ch, ${capture.durationSeconds.toFixed(3)} s)`);
  for (const warning of capture.warnings ?? []) console.log(`  capture warning ${warning.code}: ${warning.message}`);

  // 4. Ask for the analysis; Prefer: wait=N (RFC 7240) returns the finished result at once (200) when it is
  //    done within N seconds, else 202 with Location.
  const analysisRequest = {
    kind: 'response_and_distortion',
    captureId: capture.id,
    stimulusId: stimulus.id,
    channels: CHANNELS,
    conditions: CONDITIONS,
    options: OPTIONS,
    dut: DUT,
    tags: TAGS,
  };
  let response = await postJson(apiKey, `${baseUrl}/v1/analyses`, analysisRequest, { prefer: `wait=${WAIT_SECONDS}` });
  let analysis = await response.json();
  const monitorUrl = new URL(response.headers.get('location') ?? `/v1/analyses/${analysis.id}`, `${baseUrl}/`).href;

  // 5. Not finished yet (202): poll the status monitor, as often as Retry-After says.
  const deadline = Date.now() + POLL_DEADLINE_MS;
  while (!TERMINAL_STATES.has(analysis.status)) {
    if (Date.now() > deadline) throw new Error(`analysis ${analysis.id} still ${analysis.status} after ${POLL_DEADLINE_MS / 1000} s`);
    await sleep(retryAfterMs(response.headers, 2000));
    response = await call(apiKey, monitorUrl);
    analysis = await response.json();
    console.log(`  analysis ${analysis.id}: ${analysis.status} (${Math.round(analysis.progress * 100)} %)`);
  }
  return printHeadline(analysis);
}

// --- The headline: the figures a production line usually logs, from result.figures ----------------------------

const fixed = (value, digits) => (typeof value === 'number' ? value.toFixed(digits) : 'n/a');
const line = (label, text) => console.log(`  ${label.padEnd(28)} ${text}`);

/** A band edge: found at a frequency, or not inside the measured range (then the edge examined is not the limit). */
function limitPoint(point) {
  if (point?.status === 'found') return `${fixed(point.frequencyHz, 1)} Hz`;
  if (point?.status === 'beyond_measured_range') return `beyond ${fixed(point.measuredEdgeHz, 1)} Hz`;
  if (point?.status === 'outside_at_reference_band') return `none (already outside at ${fixed(point.atHz, 1)} Hz)`;
  return 'n/a';
}

/** A distortion summary value: percent at a frequency, "≤" when it is only an upper bound (noise floor). */
function distortionValue(value) {
  if (!value || typeof value.valuePercent !== 'number') return 'n/a';
  return `${value.isUpperBound ? '<= ' : ''}${fixed(value.valuePercent, 4)} % at ${fixed(value.frequencyHz, 1)} Hz`;
}

function printHeadline(analysis) {
  console.log(`analysis ${analysis.id} ${analysis.status}`);
  if (analysis.status !== 'succeeded') {
    console.log(`  ${analysis.error?.title ?? 'no result'}: ${analysis.error?.detail ?? ''}`);
    return 1;
  }
  const figures = analysis.result?.figures ?? {};
  const conventions = analysis.result?.conventions ?? {};
  const bandLimits = figures.bandLimits;
  if (bandLimits) {
    line('reference level', `${fixed(bandLimits.reference.levelDb, 2)} dB (${bandLimits.reference.description})`);
    for (const limit of bandLimits.limits) line(`-${limit.dropDb} dB points`, `${limitPoint(limit.lower)} .. ${limitPoint(limit.upper)}`);
  }
  if (conventions.magnitudeReference) line('magnitude reference', conventions.magnitudeReference);
  const distortion = figures.distortion;
  if (distortion) {
    // thdHeadline says which THD definition the lab reports (thd_f re the fundamental, or thd_r re the total).
    const name = distortion.thdHeadline === 'thd_r' ? 'THD_R' : 'THD_F';
    const summary = distortion.thdHeadline === 'thd_r' ? distortion.thdR : distortion.thdF;
    line(`${name} at reference`, distortionValue(summary?.atReference));
    line(`${name} maximum`, distortionValue(summary?.maximum));
  }
  line('delay', `${fixed(figures.delayMs, 3)} ms, polarity ${figures.polarity ?? 'n/a'}`);
  line('verdict', analysis.verdict ?? 'none (no tolerance mask)');
  for (const warning of analysis.warnings ?? []) console.log(`  warning ${warning.code}: ${warning.message}`);
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
