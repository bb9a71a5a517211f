/**
 * Quoted-printable (RFC 2045 §6.7): "=XX" is one octet, "=" at a line end is a soft break that joins lines,
 * trailing blanks on a line are padding.
 */
export function decodeQuotedPrintable(encoded: string): Buffer {
  const withoutSoftBreaks = encoded.replace(/[ \t]+(?=\r?\n)/g, '').replace(/=\r?\n/g, '');
  const bytes: number[] = [];
  for (let index = 0; index < withoutSoftBreaks.length; index++) {
    const character = withoutSoftBreaks[index];
    const hex = withoutSoftBreaks.slice(index + 1, index + 3);
    if (character === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(parseInt(hex, 16));
      index += 2;
    } else {
      // Lenient on a stray "=" the way common readers are (RFC 2045 §6.7 note 1). Input read as latin1
      // maps one character to one octet; anything wider can only come from a header and is kept as UTF-8.
      const code = character.charCodeAt(0);
      if (code < 256) bytes.push(code);
      else bytes.push(...Buffer.from(character, 'utf8'));
    }
  }
  return Buffer.from(bytes);
}

/** Undoes a Content-Transfer-Encoding; 7bit, 8bit, binary and unknown values pass through. */
export function decodeTransferEncoding(body: Buffer, transferEncoding: string | undefined): Buffer {
  switch ((transferEncoding ?? '7bit').trim().toLowerCase()) {
    case 'base64':
      return Buffer.from(body.toString('latin1').replace(/[^A-Za-z0-9+/=]/g, ''), 'base64');
    case 'quoted-printable':
      return decodeQuotedPrintable(body.toString('latin1'));
    default:
      return body;
  }
}

/** Bytes to text in the declared charset; an unknown label falls back to UTF-8 rather than failing. */
export function decodeCharset(bytes: Uint8Array, charset: string | undefined): string {
  const label = (charset ?? 'utf-8').trim().toLowerCase();
  try {
    return new TextDecoder(label).decode(bytes);
  } catch {
    return new TextDecoder('utf-8').decode(bytes);
  }
}
