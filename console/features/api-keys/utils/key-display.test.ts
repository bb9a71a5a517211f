import { describe, expect, it } from 'vitest';
import { grantableScopes, maskedKey } from './key-display';

describe('maskedKey', () => {
  it('never shows more than the prefix and last four characters', () => {
    expect(maskedKey({ prefix: 'swl_live_Ab12', lastFour: 'wXyZ' })).toBe('swl_live_Ab12…wXyZ');
  });
});

describe('grantableScopes', () => {
  // Common practice, no source: a delegated credential cannot exceed its creator's rights.
  it('offers only what the creator may do', () => {
    const scopes = [
      { name: 'analyses:read', description: 'Read analyses' },
      { name: 'analyses:write', description: 'Start analyses' },
      { name: 'members:manage', description: 'Manage members' },
    ];
    expect(grantableScopes(scopes, ['analyses:read', 'members:manage']).map((scope) => scope.name)).toEqual([
      'analyses:read',
      'members:manage',
    ]);
    expect(grantableScopes(scopes, [])).toEqual([]);
  });
});
