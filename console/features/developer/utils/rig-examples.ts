import nodeSource from '../../../../examples/rig-loop.mjs?raw';
import shellSource from '../../../../examples/rig-loop.sh?raw';
import pythonSource from '../../../../examples/rig_loop.py?raw';
import { sectionBetween, withBaseUrl } from './base-url';

export type RigExample = {
  id: 'shell' | 'python' | 'node';
  label: string;
  fileName: string;
  runs: string;
  needs: string;
  source: string;
};

// The files in examples/ are bundled verbatim at build time, so the console always shows what the repository
// ships (and what the example tests run against the real API).
const EXAMPLES: RigExample[] = [
  { id: 'shell', label: 'Shell + curl', fileName: 'rig-loop.sh', runs: './rig-loop.sh run capture.wav', needs: 'bash, curl; openssl to verify webhooks; jq or python3 optional', source: shellSource },
  { id: 'python', label: 'Python', fileName: 'rig_loop.py', runs: 'python3 rig_loop.py run capture.wav', needs: 'Python 3.8+, standard library only', source: pythonSource },
  { id: 'node', label: 'Node + undici', fileName: 'rig-loop.mjs', runs: 'node rig-loop.mjs run capture.wav', needs: 'Node.js 20+, npm install undici', source: nodeSource },
];

/** Every rig example with the organisation's base URL in place of the placeholder address. */
export function rigExamplesFor(baseUrl: string): RigExample[] {
  return EXAMPLES.map((example) => ({ ...example, source: withBaseUrl(example.source, baseUrl) }));
}

/** The Node example's signature check, shown on its own in the quick start. */
export function nodeWebhookVerifier(): string {
  return sectionBetween(nodeSource, 'const TOLERANCE_SECONDS', 'function verifyWebhookCommand');
}
