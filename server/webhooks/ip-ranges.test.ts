import { isIPv6 } from 'node:net';
import { describe, expect, it } from 'vitest';
import { blockedAddressReason, embeddedIpv4, formatIpAddress, parseIpAddress } from './ip-ranges';

const reasonOf = (text: string) => {
  const parsed = parseIpAddress(text);
  if (!parsed) throw new Error(`test address ${text} does not parse`);
  return blockedAddressReason(parsed);
};

describe('parsing literal addresses', () => {
  it('reads the IPv6 text forms of RFC 4291 §2.2 to the same 16 bytes', () => {
    // RFC 4291 §2.2 examples: preferred form, "::" compression and mixed IPv4 notation.
    const preferred = parseIpAddress('2001:DB8:0:0:8:800:200C:417A');
    expect(parseIpAddress('2001:DB8::8:800:200C:417A')).toEqual(preferred);
    expect(formatIpAddress(preferred!)).toBe('2001:db8:0:0:8:800:200c:417a');
    expect(parseIpAddress('::13.1.68.3')?.bytes).toEqual(Uint8Array.from([...new Array(12).fill(0), 13, 1, 68, 3]));
    expect(parseIpAddress('::FFFF:129.144.52.38')?.bytes.slice(10)).toEqual(Uint8Array.from([0xff, 0xff, 129, 144, 52, 38]));
    expect(parseIpAddress('::')?.bytes).toEqual(new Uint8Array(16));
    expect(parseIpAddress('[fe80::1%eth0]')?.family).toBe(6);
  });

  it('agrees with node:net on what is an address', () => {
    for (const text of ['1.2.3.4', '255.255.255.255', '::1', '1::', '1:2:3:4:5:6:7:8', '1:2:3:4:5:6:1.2.3.4']) {
      expect(parseIpAddress(text), text).not.toBeNull();
    }
    for (const text of ['1.2.3', '256.1.1.1', '01.2.3.4x', '1:2:3:4:5:6:7:8:9', '1::2::3', ':::', 'example.test', '']) {
      expect(parseIpAddress(text), text).toBeNull();
      expect(isIPv6(text)).toBe(false);
    }
  });
});

describe('special-purpose addresses are refused (IANA special-purpose registries, RFC 6890)', () => {
  it.each([
    ['0.0.0.0', 'this_network'],
    ['0.1.2.3', 'this_network'],
    ['10.0.0.1', 'private'],
    ['172.16.0.1', 'private'],
    ['172.31.255.255', 'private'],
    ['192.168.1.10', 'private'],
    ['100.64.0.1', 'shared_address_space'],
    ['100.127.255.254', 'shared_address_space'],
    ['127.0.0.1', 'loopback'],
    ['127.255.255.254', 'loopback'],
    ['169.254.0.1', 'link_local'],
    ['169.254.169.254', 'metadata'],
    ['100.100.100.200', 'metadata'],
    ['192.0.0.8', 'ietf_protocol_assignments'],
    ['192.0.2.1', 'documentation'],
    ['198.51.100.7', 'documentation'],
    ['203.0.113.9', 'documentation'],
    ['198.18.0.1', 'benchmarking'],
    ['192.88.99.1', 'relay_anycast'],
    ['224.0.0.251', 'multicast'],
    ['239.255.255.250', 'multicast'],
    ['240.0.0.1', 'reserved'],
    ['255.255.255.255', 'broadcast'],
    ['::', 'unspecified'],
    ['::1', 'loopback'],
    ['::127.0.0.1', 'ipv4_compatible'],
    ['fe80::1', 'link_local'],
    ['fc00::1', 'unique_local'],
    ['fd12:3456:789a::1', 'unique_local'],
    ['fd00:ec2::254', 'metadata'],
    ['fec0::1', 'site_local'],
    ['ff02::1', 'multicast'],
    ['2001:db8::1', 'documentation'],
    ['2001::1', 'ietf_protocol_assignments'], // Teredo
    ['100::1', 'discard_only'],
    ['64:ff9b:1::1', 'nat64_local_use'],
    ['4000::1', 'reserved'], // outside global unicast 2000::/3
  ])('%s → %s', (address, reason) => {
    expect(reasonOf(address)).toBe(reason);
  });

  it('judges IPv4 carried inside IPv6 by the IPv4 address (mapped, NAT64, 6to4)', () => {
    expect(reasonOf('::ffff:127.0.0.1')).toBe('loopback');
    expect(reasonOf('::ffff:7f00:1')).toBe('loopback');
    expect(reasonOf('::ffff:a9fe:a9fe')).toBe('metadata'); // 169.254.169.254
    expect(reasonOf('::ffff:10.1.2.3')).toBe('private');
    expect(reasonOf('64:ff9b::192.168.0.1')).toBe('private');
    expect(reasonOf('2002:c0a8:0101::1')).toBe('private'); // 6to4 of 192.168.1.1
    expect(reasonOf('2002:7f00:0001::')).toBe('loopback');
    expect(embeddedIpv4(parseIpAddress('::ffff:81.2.69.142')!)).toEqual({ family: 4, bytes: Uint8Array.from([81, 2, 69, 142]) });
  });

  it('lets globally reachable unicast addresses through', () => {
    for (const address of ['81.2.69.142', '11.22.33.44', '172.32.0.1', '100.128.0.1', '192.169.0.1', '223.255.255.1', '2a02:c7f:1234::1', '::ffff:81.2.69.142', '64:ff9b::81.2.69.142', '2002:5102:458e::1']) {
      expect(reasonOf(address), address).toBeNull();
    }
  });
});
