import { describe, expect, it } from 'vitest';
import { ConfigError, DEV_SESSION_SECRET, loadConfig } from './env';

describe('loadConfig', () => {
  it('gives safe local defaults', () => {
    const config = loadConfig({});
    expect(config.host).toBe('127.0.0.1');
    expect(config.port).toBe(4620);
    expect(config.publicOrigin).toBe('http://127.0.0.1:4620');
    expect(config.sessionLifetimeSeconds).toBe(12 * 3600);
    expect(config.seedDemo).toBe(true);
  });

  it('lists every bad variable at once', () => {
    try {
      loadConfig({ SWEEPLINE_PORT: 'eighty', LOG_LEVEL: 'chatty', DATABASE_URL: 'postgres://x' });
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(ConfigError);
      const problems = (error as ConfigError).problems.join('\n');
      expect(problems).toMatch(/SWEEPLINE_PORT/);
      expect(problems).toMatch(/LOG_LEVEL/);
      expect(problems).toMatch(/DATABASE_URL/);
    }
  });

  it('refuses to start in production with the default or a short secret', () => {
    const base = { NODE_ENV: 'production', DATABASE_URL: 'mysql://u:p@db.internal:3306/s', PUBLIC_ORIGIN: 'https://sweepline.example' };
    expect(() => loadConfig(base)).toThrow(/SESSION_SECRET/);
    expect(() => loadConfig({ ...base, SESSION_SECRET: DEV_SESSION_SECRET })).toThrow(/SESSION_SECRET/);
    expect(() => loadConfig({ ...base, SESSION_SECRET: 'short-secret' })).toThrow(/SESSION_SECRET/);
    const config = loadConfig({ ...base, SESSION_SECRET: 'x'.repeat(48) });
    expect(config.seedDemo).toBe(false);
    expect(config.validateResponses).toBe(false);
  });

  it('requires a database URL and public origin in production', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(48) })).toThrow(/DATABASE_URL[\s\S]*PUBLIC_ORIGIN/);
  });
});
