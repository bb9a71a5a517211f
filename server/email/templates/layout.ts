import { escapeHtml } from './escape-html';

export const PRODUCT_NAME = 'Sweepline';

/** One paragraph of HTML from plain text. */
export function htmlParagraph(text: string): string {
  return `<p style="margin:0 0 16px 0">${escapeHtml(text)}</p>`;
}

/** A button-like link; the URL is repeated as text below it for mail clients that strip styles. */
export function htmlActionLink(label: string, url: string): string {
  const href = escapeHtml(url);
  return (
    `<p style="margin:0 0 8px 0"><a href="${href}" style="display:inline-block;padding:10px 18px;` +
    `background:#0f4c5c;color:#ffffff;text-decoration:none;border-radius:4px">${escapeHtml(label)}</a></p>` +
    `<p style="margin:0 0 16px 0;font-size:13px;color:#555555">Or copy this address into your browser: ` +
    `<a href="${href}" style="color:#0f4c5c">${href}</a></p>`
  );
}

/** Wraps HTML body fragments (already escaped) in a plain, single-column message. */
export function htmlDocument(title: string, bodyFragments: readonly string[], footer: string): string {
  return [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    `<title>${escapeHtml(title)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#f4f4f1;font-family:Helvetica,Arial,sans-serif;font-size:15px;line-height:1.5;color:#1d1d1b">',
    '<div style="max-width:560px;margin:0 auto;background:#ffffff;padding:24px;border-radius:6px">',
    `<p style="margin:0 0 20px 0;font-weight:bold;letter-spacing:0.04em;color:#0f4c5c">${PRODUCT_NAME}</p>`,
    ...bodyFragments,
    `<p style="margin:24px 0 0 0;font-size:12px;color:#6b6b66">${escapeHtml(footer)}</p>`,
    '</div></body></html>',
  ].join('\n');
}

/** Plain-text version: paragraphs separated by blank lines, then the footer. */
export function textDocument(paragraphs: readonly string[], footer: string): string {
  return [...paragraphs, `-- \n${footer}`].join('\n\n') + '\n';
}
