import { describe, expect, it } from 'vitest';
import { renderOpenApiDocument } from '@server/contract/generate';

interface Header {
  required?: boolean;
  description?: string;
  schema?: { type?: string };
}
interface Operation {
  'x-required-permission'?: string;
  security: unknown[];
  parameters?: { in: string; name: string }[];
  responses: Record<string, { headers?: Record<string, Header> }>;
}

const document = JSON.parse(renderOpenApiDocument()) as { paths: Record<string, Record<string, Operation>> };
const operations = Object.entries(document.paths).flatMap(([path, methods]) => Object.entries(methods).map(([method, operation]) => ({ path, method, operation })));
const takesIdempotencyKey = (operation: Operation) => (operation.parameters ?? []).some((p) => p.in === 'header' && p.name === 'idempotency-key');

describe('response headers in openapi/openapi.json', () => {
  it('documents Location on every create: each 201, and each 202 of a POST that takes an Idempotency-Key', () => {
    // RFC 9110 §15.3.2 (201 Created) and §10.2.2: Location names the primary resource the request created.
    const creates = operations.filter(({ method, operation }) => method === 'post' && (operation.responses['201'] || (operation.responses['202'] && takesIdempotencyKey(operation))));
    expect(creates.length).toBeGreaterThanOrEqual(9);
    for (const { path, operation } of creates) {
      const status = operation.responses['201'] ? '201' : '202';
      const location = operation.responses[status].headers?.Location;
      expect(location, `POST ${path} ${status}`).toBeDefined();
      expect(location!.required, `POST ${path} ${status}`).toBe(true);
    }
  });

  it('documents Retry-After on every 429', () => {
    // RFC 6585 §4: a 429 MAY carry Retry-After; IETF draft-ietf-httpapi-ratelimit-headers: clients obey it over RateLimit.
    const throttled = operations.filter(({ operation }) => operation.responses['429']);
    expect(throttled.length).toBeGreaterThan(20);
    for (const { path, method, operation } of throttled) expect(operation.responses['429'].headers?.['Retry-After'], `${method} ${path}`).toBeDefined();
  });

  it('documents RateLimit and RateLimit-Policy on the successes of every authenticated operation, never on 401/403', () => {
    // IETF draft-ietf-httpapi-ratelimit-headers: the two fields describe the caller's quota policy and what is left.
    const authenticated = operations.filter(({ operation }) => operation.security.length > 0 && operation.responses['429']);
    for (const { path, method, operation } of authenticated) {
      for (const [status, response] of Object.entries(operation.responses)) {
        const names = Object.keys(response.headers ?? {});
        if (status === '401' || status === '403') expect(names, `${method} ${path} ${status}`).not.toContain('RateLimit');
        else expect(names, `${method} ${path} ${status}`).toEqual(expect.arrayContaining(['RateLimit', 'RateLimit-Policy']));
      }
    }
  });

  it('documents Idempotent-Replayed (optional) on the successes of every operation taking an Idempotency-Key', () => {
    // Marker header of a replayed response (server/http/idempotency.ts sendReplay); a vendor practice, no standard.
    const idempotent = operations.filter(({ operation }) => takesIdempotencyKey(operation));
    expect(idempotent.length).toBeGreaterThanOrEqual(5);
    for (const { path, method, operation } of idempotent) {
      for (const [status, response] of Object.entries(operation.responses)) {
        if (!status.startsWith('2')) continue;
        const header = response.headers?.['Idempotent-Replayed'];
        expect(header, `${method} ${path} ${status}`).toBeDefined();
        expect(header!.required).toBe(false);
      }
    }
  });
});
