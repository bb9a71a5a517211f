import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { EXAMPLE_BASE_URL_PLACEHOLDER } from './base-url';
import { nodeWebhookVerifier, rigExamplesFor } from './rig-examples';

const ORIGIN = 'http://127.0.0.1:41234';

describe('rig examples bundled as raw text', () => {
  it('are the repository files verbatim but for the base URL', () => {
    for (const example of rigExamplesFor(ORIGIN)) {
      const onDisk = readFileSync(new URL(`../../../../examples/${example.fileName}`, import.meta.url), 'utf8');
      expect(example.source).toBe(onDisk.split(EXAMPLE_BASE_URL_PLACEHOLDER).join(ORIGIN));
    }
  });

  it('offer shell, Python and Node, each with its own run command', () => {
    const examples = rigExamplesFor(ORIGIN);
    expect(examples.map((example) => example.id)).toEqual(['shell', 'python', 'node']);
    for (const example of examples) expect(example.runs).toContain(example.fileName);
  });

  it('include the Node signature verifier for the quick start', () => {
    expect(nodeWebhookVerifier()).toMatch(/^const TOLERANCE_SECONDS = 5 \* 60;/);
  });
});
