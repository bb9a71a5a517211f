import { isIP } from 'node:net';

/**
 * Parsing of literal IP addresses and the special-purpose ranges a webhook must never reach. The ranges are
 * from the IANA IPv4 and IPv6 Special-Purpose Address Registries (RFC 6890 and the RFCs named per row);
 * anything not "globally reachable" there is refused, plus multicast and broadcast, plus every IPv6 address
 * outside the global unicast block 2000::/3 (RFC 4291 §2.4). Row citations are from memory of the registries.
 */

export interface ParsedIp {
  family: 4 | 6;
  /** 4 or 16 bytes, network order. */
  bytes: Uint8Array;
}

export type BlockedAddressReason =
  | 'unspecified'
  | 'this_network'
  | 'private'
  | 'shared_address_space'
  | 'loopback'
  | 'link_local'
  | 'metadata'
  | 'ietf_protocol_assignments'
  | 'documentation'
  | 'benchmarking'
  | 'relay_anycast'
  | 'multicast'
  | 'reserved'
  | 'broadcast'
  | 'ipv4_compatible'
  | 'ipv4_translated'
  | 'nat64_local_use'
  | 'discard_only'
  | 'unique_local'
  | 'site_local';

interface BlockedRange {
  network: ParsedIp;
  prefixLength: number;
  reason: BlockedAddressReason;
}

function parseIpv4(text: string): Uint8Array | null {
  const parts = text.split('.');
  if (parts.length !== 4 || !parts.every((part) => /^\d{1,3}$/.test(part) && Number(part) <= 255)) return null;
  return Uint8Array.from(parts.map(Number));
}

function parseIpv6(text: string): Uint8Array | null {
  const halves = text.split('::');
  if (halves.length > 2) return null;
  const groupsOf = (half: string): number[] | null => {
    if (half === '') return [];
    const groups: number[] = [];
    const pieces = half.split(':');
    for (const [index, piece] of pieces.entries()) {
      if (index === pieces.length - 1 && piece.includes('.')) {
        const ipv4 = parseIpv4(piece);
        if (!ipv4) return null;
        groups.push((ipv4[0] << 8) | ipv4[1], (ipv4[2] << 8) | ipv4[3]);
      } else if (/^[0-9a-fA-F]{1,4}$/.test(piece)) {
        groups.push(parseInt(piece, 16));
      } else {
        return null;
      }
    }
    return groups;
  };
  const head = groupsOf(halves[0]);
  const tail = halves.length === 2 ? groupsOf(halves[1]) : [];
  if (!head || !tail) return null;
  const missing = 8 - head.length - tail.length;
  if (halves.length === 2 ? missing < 1 : missing !== 0) return null;
  const groups = [...head, ...new Array<number>(missing).fill(0), ...tail];
  const bytes = new Uint8Array(16);
  groups.forEach((group, index) => {
    bytes[index * 2] = group >> 8;
    bytes[index * 2 + 1] = group & 0xff;
  });
  return bytes;
}

/** A literal IPv4 or IPv6 address (brackets and an IPv6 zone index are accepted and dropped); null otherwise. */
export function parseIpAddress(text: string): ParsedIp | null {
  const bare = text.replace(/^\[(.*)\]$/, '$1').replace(/%.*$/, '');
  const family = isIP(bare);
  if (family === 4) {
    const bytes = parseIpv4(bare);
    return bytes ? { family: 4, bytes } : null;
  }
  if (family === 6) {
    const bytes = parseIpv6(bare);
    return bytes ? { family: 6, bytes } : null;
  }
  return null;
}

export function formatIpAddress(ip: ParsedIp): string {
  if (ip.family === 4) return Array.from(ip.bytes).join('.');
  const groups: string[] = [];
  for (let index = 0; index < 16; index += 2) groups.push(((ip.bytes[index] << 8) | ip.bytes[index + 1]).toString(16));
  return groups.join(':');
}

function range(cidr: string, reason: BlockedAddressReason): BlockedRange {
  const [address, prefix] = cidr.split('/');
  const network = parseIpAddress(address);
  if (!network) throw new Error(`Bad range literal ${cidr}`);
  return { network, prefixLength: Number(prefix), reason };
}

// Most specific first, so the reported reason names the narrowest match (e.g. "metadata" before "link_local").
const BLOCKED_IPV4: readonly BlockedRange[] = [
  // Instance-metadata and container-credential endpoints of common cloud hosts (common practice, no source).
  range('169.254.169.254/32', 'metadata'),
  range('169.254.170.2/32', 'metadata'),
  range('100.100.100.200/32', 'metadata'),
  range('255.255.255.255/32', 'broadcast'), // RFC 919 / RFC 8190
  range('0.0.0.0/8', 'this_network'), // RFC 791 (includes 0.0.0.0)
  range('10.0.0.0/8', 'private'), // RFC 1918
  range('100.64.0.0/10', 'shared_address_space'), // RFC 6598 (carrier-grade NAT)
  range('127.0.0.0/8', 'loopback'), // RFC 1122
  range('169.254.0.0/16', 'link_local'), // RFC 3927
  range('172.16.0.0/12', 'private'), // RFC 1918
  range('192.0.0.0/24', 'ietf_protocol_assignments'), // RFC 6890
  range('192.0.2.0/24', 'documentation'), // RFC 5737 TEST-NET-1
  range('192.31.196.0/24', 'relay_anycast'), // RFC 7535 AS112-v4
  range('192.52.193.0/24', 'relay_anycast'), // RFC 7450 AMT
  range('192.88.99.0/24', 'relay_anycast'), // RFC 7526 (deprecated 6to4 relay)
  range('192.168.0.0/16', 'private'), // RFC 1918
  range('192.175.48.0/24', 'relay_anycast'), // RFC 7534 direct delegation AS112
  range('198.18.0.0/15', 'benchmarking'), // RFC 2544
  range('198.51.100.0/24', 'documentation'), // RFC 5737 TEST-NET-2
  range('203.0.113.0/24', 'documentation'), // RFC 5737 TEST-NET-3
  range('224.0.0.0/4', 'multicast'), // RFC 5771
  range('240.0.0.0/4', 'reserved'), // RFC 1112
];

const BLOCKED_IPV6: readonly BlockedRange[] = [
  range('fd00:ec2::254/128', 'metadata'), // IPv6 instance-metadata endpoint (common practice, no source)
  range('::/128', 'unspecified'), // RFC 4291
  range('::1/128', 'loopback'), // RFC 4291
  range('::/96', 'ipv4_compatible'), // RFC 4291 §2.5.5.1 (deprecated)
  range('::ffff:0:0:0/96', 'ipv4_translated'), // RFC 2765
  range('64:ff9b:1::/48', 'nat64_local_use'), // RFC 8215
  range('100::/64', 'discard_only'), // RFC 6666
  range('2001::/23', 'ietf_protocol_assignments'), // RFC 2928 (includes Teredo 2001::/32, ORCHID)
  range('2001:db8::/32', 'documentation'), // RFC 3849
  range('3fff::/20', 'documentation'), // RFC 9637
  range('5f00::/16', 'reserved'), // RFC 9602 (SRv6 SIDs)
  range('fc00::/7', 'unique_local'), // RFC 4193
  range('fe80::/10', 'link_local'), // RFC 4291
  range('fec0::/10', 'site_local'), // RFC 3879 (deprecated)
  range('ff00::/8', 'multicast'), // RFC 4291
];

const GLOBAL_UNICAST_IPV6 = range('2000::/3', 'reserved');

function inRange(ip: ParsedIp, blocked: BlockedRange): boolean {
  if (ip.family !== blocked.network.family) return false;
  const fullBytes = Math.floor(blocked.prefixLength / 8);
  for (let index = 0; index < fullBytes; index += 1) {
    if (ip.bytes[index] !== blocked.network.bytes[index]) return false;
  }
  const remainingBits = blocked.prefixLength % 8;
  if (remainingBits === 0) return true;
  const mask = (0xff << (8 - remainingBits)) & 0xff;
  return (ip.bytes[fullBytes] & mask) === (blocked.network.bytes[fullBytes] & mask);
}

/**
 * IPv4 carried inside an IPv6 address that a host or gateway will turn back into IPv4: IPv4-mapped
 * (::ffff:0:0/96, RFC 4291 §2.5.5.2), NAT64 well-known prefix (64:ff9b::/96, RFC 6052) and 6to4
 * (2002::/16, RFC 3056). The embedded address is judged like any IPv4 address.
 */
export function embeddedIpv4(ip: ParsedIp): ParsedIp | null {
  if (ip.family !== 6) return null;
  const b = ip.bytes;
  const zeros = (from: number, to: number) => b.slice(from, to).every((byte) => byte === 0);
  if (zeros(0, 10) && b[10] === 0xff && b[11] === 0xff) return { family: 4, bytes: b.slice(12, 16) };
  if (b[0] === 0x00 && b[1] === 0x64 && b[2] === 0xff && b[3] === 0x9b && zeros(4, 12)) return { family: 4, bytes: b.slice(12, 16) };
  if (b[0] === 0x20 && b[1] === 0x02) return { family: 4, bytes: b.slice(2, 6) };
  return null;
}

/** The reason an address must not be reached, or null when it is globally reachable. */
export function blockedAddressReason(ip: ParsedIp): BlockedAddressReason | null {
  const embedded = embeddedIpv4(ip);
  if (embedded) return blockedAddressReason(embedded);
  const table = ip.family === 4 ? BLOCKED_IPV4 : BLOCKED_IPV6;
  const listed = table.find((blocked) => inRange(ip, blocked))?.reason;
  if (listed) return listed;
  if (ip.family === 6 && !inRange(ip, GLOBAL_UNICAST_IPV6)) return 'reserved';
  return null;
}
