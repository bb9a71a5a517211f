const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => HTML_ESCAPES[character]);
}

export const STYLESHEET_PATH = '/assets/fake-provider.css';

/** Pages carry no script at all; forms are plain POSTs. */
export const PAGE_SECURITY_HEADERS = {
  'Content-Security-Policy': "default-src 'none'; style-src 'self'; base-uri 'none'; frame-ancestors 'none'",
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'no-referrer',
  'Cache-Control': 'no-store',
};

/** Page shell; `body` is HTML the caller has already escaped. */
export function page(title: string, body: string): string {
  return [
    '<!DOCTYPE html>',
    '<html lang="en"><head><meta charset="utf-8">',
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${escapeHtml(title)}</title>`,
    `<link rel="stylesheet" href="${STYLESHEET_PATH}">`,
    '</head><body><main>',
    '<p class="notice">Local payment provider for development and tests. No card is charged and no money moves.</p>',
    body,
    '</main></body></html>',
  ].join('\n');
}

export const STYLESHEET = `
body { margin: 0; background: #eef0ec; font: 16px/1.5 system-ui, sans-serif; color: #1d1d1b; }
main { max-width: 34rem; margin: 3rem auto; background: #fff; padding: 2rem; border-radius: 8px; }
.notice { margin: 0 0 1.5rem; padding: .5rem .75rem; background: #fff4d6; border-radius: 4px; font-size: .875rem; }
h1 { font-size: 1.375rem; margin: 0 0 1rem; }
.amount { font-size: 1.75rem; font-weight: 600; margin: 0 0 1rem; }
dl { display: grid; grid-template-columns: max-content 1fr; gap: .25rem 1rem; margin: 0 0 1.5rem; }
dt { color: #5c5c57; }
dd { margin: 0; }
form { margin: 0 0 .75rem; }
button { font: inherit; padding: .6rem 1.2rem; border: 0; border-radius: 4px; background: #23395b; color: #fff; cursor: pointer; }
button.secondary { background: #dfe3dc; color: #1d1d1b; }
button.danger { background: #8c2f1b; }
button:focus-visible, a:focus-visible { outline: 3px solid #e0a100; outline-offset: 2px; }
table { width: 100%; border-collapse: collapse; margin: 0 0 1.5rem; font-size: .9375rem; }
th, td { text-align: left; padding: .35rem .5rem; border-bottom: 1px solid #e2e4df; }
a { color: #23395b; }
`;
