import { sha256Hex } from '@server/lib/crypto';
import { randomBase62 } from '@server/lib/random';

/** 43 base62 characters carry 43 × log2(62) ≈ 256 bits, like an API key's secret. */
const TOKEN_LENGTH = 43;

/**
 * A fresh link token and the hash that is stored. SHA-256 suffices for a 256-bit random value (nothing to guess
 * from a dictionary) and lets the link be found by an indexed equality lookup.
 */
export function newInvitationToken(): { token: string; tokenHash: string } {
  const token = randomBase62(TOKEN_LENGTH);
  return { token, tokenHash: hashInvitationToken(token) };
}

export const hashInvitationToken = (token: string): string => sha256Hex(token);

export function acceptUrlOf(publicOrigin: string, token: string): string {
  return `${publicOrigin}/invitations/${token}`;
}
