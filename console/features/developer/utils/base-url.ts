/** The server address the rig examples are written against; the console puts the organisation's own in its place. */
export const EXAMPLE_BASE_URL_PLACEHOLDER = 'http://127.0.0.1:4620';

/** The origin without a trailing slash, as the examples join it with "/v1/…". */
export function normaliseBaseUrl(origin: string): string {
  return origin.replace(/\/+$/, '');
}

/** An example's text with every occurrence of the placeholder address replaced by `baseUrl`. */
export function withBaseUrl(source: string, baseUrl: string): string {
  return source.split(EXAMPLE_BASE_URL_PLACEHOLDER).join(normaliseBaseUrl(baseUrl));
}

/**
 * The lines of `source` from the first line containing `startMarker` up to (not including) the first later line
 * containing `endMarker`, without trailing blank lines; empty when the start marker is missing.
 */
export function sectionBetween(source: string, startMarker: string, endMarker: string): string {
  const lines = source.split('\n');
  const start = lines.findIndex((line) => line.includes(startMarker));
  if (start < 0) return '';
  const endOffset = lines.slice(start + 1).findIndex((line) => line.includes(endMarker));
  const end = endOffset < 0 ? lines.length : start + 1 + endOffset;
  const section = lines.slice(start, end);
  while (section.length > 0 && section[section.length - 1].trim() === '') section.pop();
  return section.join('\n');
}
