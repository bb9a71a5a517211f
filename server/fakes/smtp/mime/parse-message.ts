import addressparser from 'nodemailer/lib/addressparser';
import { parseHeaderValue } from 'nodemailer/lib/mime-funcs';
import { decodeCharset, decodeTransferEncoding } from './body-decoding';
import { decodeEncodedWords } from './encoded-words';
import { headerValue, splitHeadersAndBody, type HeaderField } from './header-block';

export interface EmailAddress {
  name: string;
  address: string;
}

export interface AttachmentSummary {
  filename: string | null;
  contentType: string;
  sizeBytes: number;
}

export interface ParsedEmail {
  headers: HeaderField[];
  messageId: string | null;
  date: Date | null;
  subject: string;
  from: EmailAddress[];
  to: EmailAddress[];
  cc: EmailAddress[];
  replyTo: EmailAddress[];
  text: string | null;
  html: string | null;
  attachments: AttachmentSummary[];
}

interface BodyParts {
  text: string | null;
  html: string | null;
  attachments: AttachmentSummary[];
}

// Deeper nesting than this is not something our own mail or any ordinary client produces.
const MAX_MULTIPART_DEPTH = 8;

/**
 * Reads an RFC 5322 message with MIME bodies (RFC 2045/2046): the first text/plain and text/html parts become
 * `text` and `html`, other leaves are listed as attachments. Enough for reading what the product sends.
 */
export function parseEmail(raw: Buffer): ParsedEmail {
  const { headers, body } = splitHeadersAndBody(raw);
  const parts: BodyParts = { text: null, html: null, attachments: [] };
  collectParts(headers, body, parts, 0);
  const dateHeader = headerValue(headers, 'date');
  const date = dateHeader ? new Date(dateHeader) : null;
  return {
    headers,
    messageId: headerValue(headers, 'message-id') ?? null,
    date: date && !Number.isNaN(date.getTime()) ? date : null,
    subject: decodeEncodedWords(headerValue(headers, 'subject') ?? ''),
    from: addressesOf(headers, 'from'),
    to: addressesOf(headers, 'to'),
    cc: addressesOf(headers, 'cc'),
    replyTo: addressesOf(headers, 'reply-to'),
    ...parts,
  };
}

function addressesOf(headers: readonly HeaderField[], name: string): EmailAddress[] {
  const value = headers
    .filter((field) => field.name === name)
    .map((field) => field.value)
    .join(', ');
  if (!value) return [];
  // Parse first, decode after: a decoded display name may itself contain commas or angle brackets.
  return addressparser(value, { flatten: true }).map((entry) => ({
    name: decodeEncodedWords(entry.name),
    address: entry.address ?? '',
  }));
}

function collectParts(headers: readonly HeaderField[], body: Buffer, parts: BodyParts, depth: number): void {
  const contentType = parseHeaderValue(headerValue(headers, 'content-type') ?? 'text/plain; charset=us-ascii');
  const mediaType = contentType.value.toLowerCase() || 'text/plain';
  const boundary = contentType.params.boundary;
  if (mediaType.startsWith('multipart/') && boundary && depth < MAX_MULTIPART_DEPTH) {
    for (const child of splitMultipart(body, boundary)) {
      const split = splitHeadersAndBody(child);
      collectParts(split.headers, split.body, parts, depth + 1);
    }
    return;
  }
  const disposition = parseHeaderValue(headerValue(headers, 'content-disposition') ?? '');
  const filename = disposition.params.filename ?? contentType.params.name ?? null;
  const decoded = decodeTransferEncoding(body, headerValue(headers, 'content-transfer-encoding'));
  const isAttachment = disposition.value.toLowerCase() === 'attachment' || filename !== null;
  if (!isAttachment && mediaType === 'text/plain' && parts.text === null) {
    parts.text = decodeCharset(decoded, contentType.params.charset);
  } else if (!isAttachment && mediaType === 'text/html' && parts.html === null) {
    parts.html = decodeCharset(decoded, contentType.params.charset);
  } else {
    parts.attachments.push({ filename: filename ? decodeEncodedWords(filename) : null, contentType: mediaType, sizeBytes: decoded.length });
  }
}

/**
 * Body parts between "--boundary" delimiter lines; the preamble before the first and everything after the
 * closing "--boundary--" are dropped (RFC 2046 §5.1.1). The line break before a delimiter belongs to it.
 */
export function splitMultipart(body: Buffer, boundary: string): Buffer[] {
  const text = body.toString('latin1');
  const delimiter = `--${boundary}`;
  const parts: Buffer[] = [];
  let searchFrom = 0;
  let partStart = -1;
  for (;;) {
    const found = text.indexOf(delimiter, searchFrom);
    if (found === -1) break;
    const atLineStart = found === 0 || text[found - 1] === '\n';
    if (!atLineStart) {
      searchFrom = found + delimiter.length;
      continue;
    }
    if (partStart !== -1) {
      const lineBreakLength = text[found - 2] === '\r' ? 2 : 1;
      parts.push(body.subarray(partStart, Math.max(partStart, found - lineBreakLength)));
    }
    const afterDelimiter = found + delimiter.length;
    if (text.startsWith('--', afterDelimiter)) break;
    const lineEnd = text.indexOf('\n', afterDelimiter);
    if (lineEnd === -1) break;
    partStart = lineEnd + 1;
    searchFrom = partStart;
  }
  return parts;
}
