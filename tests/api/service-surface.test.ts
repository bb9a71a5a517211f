import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { healthSchema } from '@shared/schemas/health';
import { createApp } from '@server/app';
import { buildOpenApiDocument } from '@server/contract/document';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let consoleDir: string;
beforeAll(async () => {
  context = await createTestContext();
  consoleDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sweepline-console-'));
  fs.mkdirSync(path.join(consoleDir, 'assets'));
  fs.writeFileSync(path.join(consoleDir, 'index.html'), '<!doctype html><title>Sweepline console</title><script type="module" src="/assets/app-1a2b.js"></script>');
  fs.writeFileSync(path.join(consoleDir, 'assets', 'app-1a2b.js'), 'console.log("console")');
});
afterAll(async () => {
  await context?.close();
  fs.rmSync(consoleDir, { recursive: true, force: true });
});

describe('GET /v1/health', () => {
  it('reports the service and database without credentials', async () => {
    const response = await request(context.app).get('/v1/health');
    expect(response.status).toBe(200);
    const health = healthSchema.parse(response.body);
    expect(health.status).toBe('ok');
    expect(health.database.status).toBe('ok');
    expect(health.database.latencyMs).toBeGreaterThanOrEqual(0);
    expect(health.version).toBe(context.deps.config.version);
  });
});

describe('security headers', () => {
  it('sends a CSP without inline or eval scripts, and the usual hardening headers', async () => {
    const response = await request(context.app).get('/v1/health');
    const csp = response.headers['content-security-policy'];
    const scriptSrc = /script-src ([^;]+)/.exec(csp)![1];
    expect(scriptSrc.trim()).toBe("'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toContain('upgrade-insecure-requests'); // http://127.0.0.1 would break
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['x-powered-by']).toBeUndefined();
    expect(response.headers['strict-transport-security']).toBeUndefined();
    expect(response.headers['cache-control']).toBe('no-store');
  });

  it('adds HSTS and upgrade-insecure-requests when served over https', async () => {
    const httpsApp = createApp({ ...context.deps, config: { ...context.deps.config, publicOrigin: 'https://sweepline.example' } });
    const response = await request(httpsApp).get('/v1/health');
    expect(response.headers['strict-transport-security']).toMatch(/max-age=\d+/);
    expect(response.headers['content-security-policy']).toContain('upgrade-insecure-requests');

    const signUp = await request(httpsApp)
      .post('/v1/auth/sign-up')
      .set('Origin', 'https://sweepline.example')
      .send({ email: 'secure@kestrelbay.example', password: 'kb-h40-headphone-pass', displayName: 'Sam', organisationName: 'KB' });
    expect(signUp.status).toBe(201);
    expect(([] as string[]).concat(signUp.headers['set-cookie']).join(';')).toMatch(/swl_session=[^;]+;.*Secure/i);
  });

  it('echoes a caller\'s request id when it looks like one and makes its own otherwise', async () => {
    const echoed = await request(context.app).get('/v1/health').set('X-Request-Id', 'rig-KB65-000123-7');
    expect(echoed.headers['x-request-id']).toBe('rig-KB65-000123-7');
    const replaced = await request(context.app).get('/v1/health').set('X-Request-Id', '<script>');
    expect(replaced.headers['x-request-id']).toMatch(/^req_[0-9A-Za-z]{20}$/);
  });
});

describe('/docs', () => {
  it('serves Swagger UI whose scripts are all files (allowed by script-src \'self\')', async () => {
    const redirect = await request(context.app).get('/docs');
    expect(redirect.status).toBe(301);
    expect(redirect.headers.location).toBe('/docs/');

    const page = await request(context.app).get('/docs/');
    expect(page.status).toBe(200);
    expect(page.text).toContain('swagger-ui');
    const scripts = [...page.text.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attributes, inline] of scripts) {
      expect(attributes).toMatch(/src=/);
      expect(inline.trim()).toBe('');
    }
    for (const src of scripts.map(([, attributes]) => /src=["']\.\/([^"']+)["']/.exec(attributes)![1])) {
      const asset = await request(context.app).get(`/docs/${src}`);
      expect(asset.status, src).toBe(200);
      expect(asset.headers['content-type']).toMatch(/javascript/);
    }
    const init = await request(context.app).get('/docs/swagger-ui-init.js');
    expect(init.text).toContain('Sweepline API');
    expect(init.text).toContain('"validatorUrl": null');
  });

  it('serves the same document as the generator', async () => {
    const response = await request(context.app).get('/docs/openapi.json');
    expect(response.body).toEqual(JSON.parse(JSON.stringify(buildOpenApiDocument({ version: context.deps.config.version }))));
  });
});

describe('console', () => {
  it('serves the built console, client-side routes and long-cached assets', async () => {
    const app = createApp(context.deps, { consoleDir });
    const index = await request(app).get('/').set('Accept', 'text/html');
    expect(index.status).toBe(200);
    expect(index.text).toContain('Sweepline console');
    const deepLink = await request(app).get('/api-keys').set('Accept', 'text/html,application/xhtml+xml');
    expect(deepLink.text).toContain('Sweepline console');
    const asset = await request(app).get('/assets/app-1a2b.js');
    expect(asset.status).toBe(200);
    expect(asset.headers['cache-control']).toMatch(/immutable/);
    const missingAsset = await request(app).get('/assets/gone.js');
    expect(missingAsset.status).toBe(404);
    // API paths never fall through to the console.
    const api = await request(app).get('/v1/unknown').set('Accept', 'text/html');
    expect(api.headers['content-type']).toMatch(/problem\+json/);
  });

  it('says so when the console has not been built', async () => {
    const response = await request(context.app).get('/').set('Accept', 'text/html');
    expect(response.status).toBe(200);
    expect(response.text).toContain('has not been built');
  });
});
