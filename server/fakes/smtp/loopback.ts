import { isIP } from 'node:net';

/** 127.0.0.0/8, ::1 and their IPv4-mapped IPv6 forms. */
export function isLoopbackAddress(address: string | undefined): boolean {
  if (!address) return false;
  const unmapped = address.toLowerCase().replace(/^::ffff:/, '');
  if (isIP(unmapped) === 4) return unmapped.startsWith('127.');
  return unmapped === '::1';
}
