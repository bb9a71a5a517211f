import { describe, expect, it } from 'vitest';
import { safeRedirectTarget } from './paths';

describe('safeRedirectTarget', () => {
  // OWASP Unvalidated Redirects and Forwards Cheat Sheet: only allow known local destinations.
  it('keeps console paths', () => {
    expect(safeRedirectTarget('/api-keys')).toBe('/api-keys');
    expect(safeRedirectTarget('/members?tab=all')).toBe('/members?tab=all');
  });

  it('refuses other origins and server routes', () => {
    expect(safeRedirectTarget('https://elsewhere.example/')).toBe('/');
    expect(safeRedirectTarget('//elsewhere.example/')).toBe('/');
    expect(safeRedirectTarget('/\\elsewhere.example')).toBe('/');
    expect(safeRedirectTarget('/v1/api-keys')).toBe('/');
    expect(safeRedirectTarget('/docs')).toBe('/');
    expect(safeRedirectTarget(null)).toBe('/');
  });
});
