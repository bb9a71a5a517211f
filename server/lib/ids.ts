import { randomBase62 } from './random';

/** Type prefixes of every id we hand out; ids are opaque to clients. */
export const ID_PREFIXES = {
  user: 'usr',
  organisation: 'org',
  membership: 'mem',
  apiKey: 'key',
  auditEvent: 'aud',
  signInFailure: 'sif',
  request: 'req',
  stimulus: 'stm',
  capture: 'cap',
  analysis: 'ana',
  calibration: 'cal',
  mask: 'msk',
  webhookEndpoint: 'whe',
  webhookDelivery: 'whd',
  webhookEvent: 'evt',
  webhookAttempt: 'wha',
  invitation: 'inv',
  session: 'ses',
} as const;

export type IdKind = keyof typeof ID_PREFIXES;

/** 20 base62 characters ≈ 119 random bits: collisions are not a practical concern. */
export function newId(kind: IdKind): string {
  return `${ID_PREFIXES[kind]}_${randomBase62(20)}`;
}

/** Longest id newId produces; column widths use it. */
export const ID_MAX_LENGTH = 32;
