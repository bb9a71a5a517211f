import { normaliseBaseUrl } from './base-url';

/** Step 2 of the quick start: prove the key works, then define a first stimulus. */
export function quickStartCurl(baseUrl: string): string {
  return [
    `export SWEEPLINE_BASE_URL=${normaliseBaseUrl(baseUrl)}`,
    'export SWEEPLINE_API_KEY=swl_live_…   # the key’s secret, shown once at creation',
    '',
    '# Which key is this, and what may it do?',
    'curl -sS "$SWEEPLINE_BASE_URL/v1/api-keys/current" \\',
    '  -H "Authorization: Bearer $SWEEPLINE_API_KEY"',
    '',
    '# A 20 Hz – 20 kHz sweep at a low level; the answer carries the safety cautions.',
    'curl -sS -X POST "$SWEEPLINE_BASE_URL/v1/stimuli" \\',
    '  -H "Authorization: Bearer $SWEEPLINE_API_KEY" \\',
    "  -H 'Content-Type: application/json' \\",
    '  -H "Idempotency-Key: $(cat /proc/sys/kernel/random/uuid)" \\',
    `  --data '{"type":"sweep","name":"KB-65 woofer sweep","parameters":{"startHz":20,"stopHz":20000,"approximateDurationSeconds":2,"sampleRateHz":48000,"levelDbfs":-20}}'`,
  ].join('\n');
}

/** Step 3: check one received delivery with the verifier built into each rig example. */
export const VERIFY_WEBHOOK_COMMANDS = [
  'export SWEEPLINE_WEBHOOK_SECRET=whsec_…   # shown once when the endpoint was created',
  '',
  '# the delivery’s webhook-id, webhook-timestamp and webhook-signature headers; its raw body in body.json',
  'node rig-loop.mjs verify-webhook --id "$WEBHOOK_ID" --timestamp "$WEBHOOK_TIMESTAMP" \\',
  '  --signature "$WEBHOOK_SIGNATURE" --body-file body.json',
  '# the same flags work with: python3 rig_loop.py verify-webhook, ./rig-loop.sh verify-webhook',
].join('\n');
