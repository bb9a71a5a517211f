import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { PROBLEM_CODES } from '@shared/problems';
import { OPENAPI_FILE, renderOpenApiDocument } from '@server/contract/generate';
import { v1Routes } from '@server/modules/routes';

describe('openapi/openapi.json', () => {
  it('is exactly what the code generates (run `npm run openapi` and commit the result)', () => {
    const committed = readFileSync(OPENAPI_FILE, 'utf8');
    expect(committed).toBe(renderOpenApiDocument());
  });

  it('documents every route with security, its permission and its problems', () => {
    const document = JSON.parse(renderOpenApiDocument()) as {
      openapi: string;
      paths: Record<string, Record<string, { security: unknown[]; description: string; responses: Record<string, unknown>; 'x-required-permission'?: string }>>;
      components: { securitySchemes: Record<string, unknown>; schemas: { Problem: { properties: { code: { enum: string[] } } } } };
    };
    expect(document.openapi).toBe('3.1.0');
    expect(Object.keys(document.components.securitySchemes).sort()).toEqual(['apiKey', 'sessionCookie']);
    expect(document.components.schemas.Problem.properties.code.enum).toEqual(PROBLEM_CODES);
    for (const route of v1Routes) {
      const operation = document.paths[`/v1${route.path}`]?.[route.method];
      expect(operation, `${route.method} ${route.path}`).toBeDefined();
      expect(operation.responses['500']).toBeDefined();
      if (route.access.kind === 'public') {
        expect(operation.security).toEqual([]);
      } else {
        expect(operation.security.length).toBeGreaterThan(0);
        expect(operation.responses['401']).toBeDefined();
      }
      if (route.access.kind === 'permission') {
        expect(operation['x-required-permission']).toBe(route.access.permission);
        expect(operation.description).toContain(`\`${route.access.permission}\``);
        expect(operation.responses['403']).toBeDefined();
      }
    }
  });
});
