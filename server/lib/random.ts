import { randomBytes } from 'node:crypto';

const BASE62 = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';

/**
 * `length` characters drawn uniformly from base62 using a CSPRNG. Bytes ≥ 248 are discarded so every
 * character is equally likely (248 = 4 × 62); each character carries log2(62) ≈ 5.95 bits.
 */
export function randomBase62(length: number): string {
  let out = '';
  while (out.length < length) {
    for (const byte of randomBytes(length * 2)) {
      if (byte >= 248) continue;
      out += BASE62[byte % 62];
      if (out.length === length) break;
    }
  }
  return out;
}
