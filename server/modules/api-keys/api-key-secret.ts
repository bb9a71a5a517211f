import { API_KEY_SECRET_PREFIX } from '@shared/schemas/api-keys';
import { sha256Hex } from '@server/lib/crypto';
import { randomBase62 } from '@server/lib/random';

/** 43 base62 characters carry 43 × log2(62) ≈ 256.0 bits, as much as 32 random bytes. */
export const SECRET_RANDOM_LENGTH = 43;
/** Random characters kept in the stored, displayed prefix (≈ 47.6 bits: enough to find the row). */
const PREFIX_RANDOM_LENGTH = 8;

const SECRET_FORMAT = new RegExp(`^${API_KEY_SECRET_PREFIX}[0-9A-Za-z]{${SECRET_RANDOM_LENGTH}}$`);

export interface NewApiKeySecret {
  secret: string;
  prefix: string;
  lastFour: string;
  secretHash: string;
}

export function generateApiKeySecret(): NewApiKeySecret {
  const secret = `${API_KEY_SECRET_PREFIX}${randomBase62(SECRET_RANDOM_LENGTH)}`;
  return { secret, ...describeSecret(secret) };
}

/**
 * SHA-256 is enough for a 256-bit random secret (no dictionary to search), and fast enough to run on every
 * request; passwords, by contrast, get argon2id.
 */
export function describeSecret(secret: string): Omit<NewApiKeySecret, 'secret'> {
  return {
    prefix: secret.slice(0, API_KEY_SECRET_PREFIX.length + PREFIX_RANDOM_LENGTH),
    lastFour: secret.slice(-4),
    secretHash: sha256Hex(secret),
  };
}

export function hasSecretFormat(candidate: string): boolean {
  return SECRET_FORMAT.test(candidate);
}
