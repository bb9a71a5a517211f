import { decodeCharset, decodeQuotedPrintable } from './body-decoding';

const ENCODED_WORD = /=\?([^?*\s]+)(?:\*[^?\s]+)?\?([BbQq])\?([^?\s]*)\?=/g;
// Whitespace between two adjacent encoded words is not displayed (RFC 2047 §6.2).
const SPACE_BETWEEN_ENCODED_WORDS = /(\?=)\s+(?==\?[^?*\s]+(?:\*[^?\s]+)?\?[BbQq]\?)/g;

function decodeWord(charset: string, encoding: string, encodedText: string): string {
  const bytes =
    encoding.toUpperCase() === 'B'
      ? Buffer.from(encodedText, 'base64')
      : // In the Q encoding "_" stands for a space (RFC 2047 §4.2 rule 2).
        decodeQuotedPrintable(encodedText.replace(/_/g, ' '));
  return decodeCharset(bytes, charset);
}

/** Decodes RFC 2047 encoded words in an unstructured header value (Subject, display names). */
export function decodeEncodedWords(value: string): string {
  return value.replace(SPACE_BETWEEN_ENCODED_WORDS, '$1').replace(ENCODED_WORD, (_word, charset: string, encoding: string, text: string) =>
    decodeWord(charset, encoding, text),
  );
}
