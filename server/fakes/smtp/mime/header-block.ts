export interface HeaderField {
  /** Lower-case field name. */
  name: string;
  /** Unfolded raw value, encoded words still encoded. */
  value: string;
}

export interface SplitEntity {
  headers: HeaderField[];
  body: Buffer;
}

/** Splits an entity at the first empty line (RFC 5322 §2.1); an entity without one is all headers. */
export function splitHeadersAndBody(entity: Buffer): SplitEntity {
  // A body part may start with the empty line itself: no headers, everything is body (RFC 2046 §5.1.1).
  const leadingBreak = entity[0] === 0x0a ? 1 : entity[0] === 0x0d && entity[1] === 0x0a ? 2 : 0;
  if (leadingBreak > 0) return { headers: [], body: entity.subarray(leadingBreak) };
  const crlfEnd = entity.indexOf('\r\n\r\n');
  const lfEnd = entity.indexOf('\n\n');
  let headerEnd: number;
  let bodyStart: number;
  if (crlfEnd !== -1 && (lfEnd === -1 || crlfEnd < lfEnd)) {
    headerEnd = crlfEnd;
    bodyStart = crlfEnd + 4;
  } else if (lfEnd !== -1) {
    headerEnd = lfEnd;
    bodyStart = lfEnd + 2;
  } else {
    headerEnd = entity.length;
    bodyStart = entity.length;
  }
  // Header bytes outside ASCII are read as UTF-8 (RFC 6532 allows it); the body stays bytes.
  return {
    headers: parseHeaderFields(entity.subarray(0, headerEnd).toString('utf8')),
    body: entity.subarray(bodyStart),
  };
}

/** Unfolds continuation lines (RFC 5322 §2.2.3) and splits each field at its first colon. */
export function parseHeaderFields(headerText: string): HeaderField[] {
  const fields: HeaderField[] = [];
  for (const line of headerText.split(/\r?\n/)) {
    if (/^[ \t]/.test(line) && fields.length > 0) {
      fields[fields.length - 1].value += line;
      continue;
    }
    const colon = line.indexOf(':');
    if (colon <= 0) continue;
    fields.push({ name: line.slice(0, colon).trim().toLowerCase(), value: line.slice(colon + 1) });
  }
  return fields.map((field) => ({ name: field.name, value: field.value.trim() }));
}

/** First value of a field, as receivers read a duplicated single-instance field. */
export function headerValue(fields: readonly HeaderField[], name: string): string | undefined {
  return fields.find((field) => field.name === name)?.value;
}
