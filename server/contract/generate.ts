import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildOpenApiDocument } from './document';

export const OPENAPI_FILE = fileURLToPath(new URL('../../openapi/openapi.json', import.meta.url));

export function packageVersion(): string {
  return (JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string }).version;
}

/** The exact text committed in openapi/openapi.json. */
export function renderOpenApiDocument(): string {
  return `${JSON.stringify(buildOpenApiDocument({ version: packageVersion() }), null, 2)}\n`;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  mkdirSync(dirname(OPENAPI_FILE), { recursive: true });
  writeFileSync(OPENAPI_FILE, renderOpenApiDocument());
  process.stdout.write(`Wrote ${OPENAPI_FILE}\n`);
}
