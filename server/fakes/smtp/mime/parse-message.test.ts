import { describe, expect, it } from 'vitest';
import { decodeQuotedPrintable } from './body-decoding';
import { decodeEncodedWords } from './encoded-words';
import { parseEmail, splitMultipart } from './parse-message';

describe('decodeEncodedWords', () => {
  // RFC 2047 §8, the subject example: two adjacent B-encoded words in different charsets on folded lines.
  it('joins adjacent encoded words and drops the whitespace between them', () => {
    const folded = '=?ISO-8859-1?B?SWYgeW91IGNhbiByZWFkIHRoaXMgeW8=?=    =?ISO-8859-2?B?dSB1bmRlcnN0YW5kIHRoZSBleGFtcGxlLg==?=';
    expect(decodeEncodedWords(folded)).toBe('If you can read this you understand the example.');
  });

  // RFC 2047 §8, the table of encoded-word displays.
  it.each([
    ['(=?ISO-8859-1?Q?a?=)', '(a)'],
    ['(=?ISO-8859-1?Q?a?= b)', '(a b)'],
    ['(=?ISO-8859-1?Q?a?= =?ISO-8859-1?Q?b?=)', '(ab)'],
    ['(=?ISO-8859-1?Q?a?=  =?ISO-8859-1?Q?b?=)', '(ab)'],
    ['(=?ISO-8859-1?Q?a_b?=)', '(a b)'],
    ['(=?ISO-8859-1?Q?a?= =?ISO-8859-2?Q?_b?=)', '(a b)'],
  ])('%s displays as %s', (encoded, displayed) => {
    expect(decodeEncodedWords(encoded)).toBe(displayed);
  });

  // ISO-8859-1 0xE9 is "é" (ISO/IEC 8859-1 code table); UTF-8 of "é" is C3 A9 (RFC 3629 §3).
  it('decodes the declared charset', () => {
    expect(decodeEncodedWords('=?ISO-8859-1?Q?Ren=E9e?= Okafor')).toBe('Renée Okafor');
    expect(decodeEncodedWords('=?UTF-8?Q?Ren=C3=A9e?=')).toBe('Renée');
  });

  it('leaves plain text alone', () => {
    expect(decodeEncodedWords('Plain subject = no words ?= here')).toBe('Plain subject = no words ?= here');
  });
});

describe('decodeQuotedPrintable', () => {
  // RFC 2045 §6.7 rule (5): a trailing "=" is a soft line break, the example sentence.
  it('joins soft line breaks', () => {
    const encoded = "Now's the time =\r\nfor all folk to come=\r\n to the aid of their country.";
    expect(decodeQuotedPrintable(encoded).toString('latin1')).toBe("Now's the time for all folk to come to the aid of their country.");
  });

  // RFC 2045 §6.7 rules (1) and (3): "=3D" is "=", trailing blanks before a hard break are padding.
  it('decodes octets and drops trailing padding', () => {
    expect(decodeQuotedPrintable('a=3Db   \r\nc').toString('latin1')).toBe('a=b\r\nc');
  });
});

// RFC 2046 §5.1.1 sample message (addresses replaced with invented ones).
const RFC_2046_SAMPLE = [
  'From: Test Desk <desk@kestrelbay.example>',
  'To: Line Two <line2@kestrelbay.example>',
  'Date: Sun, 21 Mar 1993 23:56:48 -0800',
  'Subject: Sample message',
  'MIME-Version: 1.0',
  'Content-type: multipart/mixed; boundary="simple boundary"',
  '',
  'This is the preamble.  It is to be ignored, though it',
  'is a handy place for composition agents to include an',
  'explanatory note to non-MIME conformant readers.',
  '',
  '--simple boundary',
  '',
  'This is implicitly typed plain US-ASCII text.',
  'It does NOT end with a linebreak.',
  '--simple boundary',
  'Content-type: text/plain; charset=us-ascii',
  '',
  'This is explicitly typed plain US-ASCII text.',
  'It DOES end with a linebreak.',
  '',
  '--simple boundary--',
  '',
  'This is the epilogue.  It is also to be ignored.',
].join('\r\n');

describe('parseEmail on the RFC 2046 sample', () => {
  it('splits the two body parts without preamble or epilogue', () => {
    const body = Buffer.from(RFC_2046_SAMPLE.slice(RFC_2046_SAMPLE.indexOf('\r\n\r\n') + 4), 'latin1');
    const parts = splitMultipart(body, 'simple boundary').map((part) => part.toString('latin1'));
    expect(parts).toEqual([
      '\r\nThis is implicitly typed plain US-ASCII text.\r\nIt does NOT end with a linebreak.',
      'Content-type: text/plain; charset=us-ascii\r\n\r\nThis is explicitly typed plain US-ASCII text.\r\nIt DOES end with a linebreak.\r\n',
    ]);
  });

  it('reads headers, addresses and the first text part', () => {
    const email = parseEmail(Buffer.from(RFC_2046_SAMPLE, 'latin1'));
    expect(email.subject).toBe('Sample message');
    expect(email.from).toEqual([{ name: 'Test Desk', address: 'desk@kestrelbay.example' }]);
    expect(email.to).toEqual([{ name: 'Line Two', address: 'line2@kestrelbay.example' }]);
    // -0800 is eight hours behind UTC (RFC 5322 §3.3 zone).
    expect(email.date?.toISOString()).toBe('1993-03-22T07:56:48.000Z');
    expect(email.text).toBe('This is implicitly typed plain US-ASCII text.\r\nIt does NOT end with a linebreak.');
    expect(email.html).toBeNull();
  });
});
