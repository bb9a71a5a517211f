import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { EXAMPLE_BASE_URL_PLACEHOLDER, normaliseBaseUrl, sectionBetween, withBaseUrl } from './base-url';
import { quickStartCurl } from './quick-start';

const example = (name: string) => readFileSync(new URL(`../../../../examples/${name}`, import.meta.url), 'utf8');
const EXAMPLE_FILES = ['rig-loop.sh', 'rig_loop.py', 'rig-loop.mjs'];
const ORIGIN = 'https://sweepline.kestrelbay.example';

describe('base URL in the rig examples', () => {
  it.each(EXAMPLE_FILES)('%s uses the placeholder the console replaces', (name) => {
    // If an example stops naming the placeholder, the console would silently show the wrong server.
    expect(example(name)).toContain(`SWEEPLINE_BASE_URL=${EXAMPLE_BASE_URL_PLACEHOLDER}`);
  });

  it.each(EXAMPLE_FILES)('%s shows the organisation’s own origin after substitution, and nothing else changes', (name) => {
    const source = example(name);
    const shown = withBaseUrl(source, `${ORIGIN}/`);
    expect(shown).toContain(`SWEEPLINE_BASE_URL=${ORIGIN} `);
    expect(shown).not.toContain(EXAMPLE_BASE_URL_PLACEHOLDER);
    expect(shown.split(ORIGIN).join(EXAMPLE_BASE_URL_PLACEHOLDER)).toBe(source);
  });

  it('drops trailing slashes, since the examples append /v1/…', () => {
    expect(normaliseBaseUrl('http://127.0.0.1:41234//')).toBe('http://127.0.0.1:41234');
    expect(quickStartCurl('http://127.0.0.1:41234/')).toMatch(/^export SWEEPLINE_BASE_URL=http:\/\/127\.0\.0\.1:41234\n/);
  });
});

describe('sectionBetween', () => {
  it('cuts the signature verifier out of the Node example', () => {
    const verifier = sectionBetween(example('rig-loop.mjs'), 'const TOLERANCE_SECONDS', 'function verifyWebhookCommand');
    expect(verifier.startsWith('const TOLERANCE_SECONDS')).toBe(true);
    expect(verifier).toContain('export function verifyWebhook(');
    expect(verifier).toContain('timingSafeEqual');
    expect(verifier).not.toContain('verifyWebhookCommand');
    expect(verifier.endsWith('\n')).toBe(false);
  });

  it('is empty without the start marker and runs to the end without the end marker', () => {
    expect(sectionBetween('a\nb\n', 'zzz', 'b')).toBe('');
    expect(sectionBetween('a\nb\nc\n\n', 'b', 'nope')).toBe('b\nc');
  });
});
