import { fetch } from 'undici';

export interface HostedPageForm {
  action: string;
  fields: Record<string, string>;
  /** The submit button's text, e.g. "Pay €290.00 and subscribe". */
  label: string;
}

/**
 * The plain POST forms of a hosted checkout or portal page. No script runs on those pages, so submitting a
 * form this way is exactly what a browser does; API tests can follow the flows without one.
 */
export function formsOnPage(html: string): HostedPageForm[] {
  return [...html.matchAll(/<form method="post" action="([^"]+)">([\s\S]*?)<\/form>/g)].map(([, action, inner]) => ({
    action,
    fields: Object.fromEntries([...inner.matchAll(/<input type="hidden" name="([^"]+)" value="([^"]*)">/g)].map(([, name, value]) => [name, value])),
    label: /<button[^>]*>([^<]*)<\/button>/.exec(inner)?.[1] ?? '',
  }));
}

/** Fetches a hosted page and returns its forms. */
export async function fetchPageForms(url: string): Promise<HostedPageForm[]> {
  const response = await fetch(url);
  if (response.status !== 200) throw new Error(`GET ${url} answered ${response.status}`);
  return formsOnPage(await response.text());
}

/** Submits a form without following the redirect, so the caller can check where it leads. */
export async function submitPageForm(pageUrl: string, form: HostedPageForm) {
  return fetch(new URL(form.action, pageUrl), {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams(form.fields).toString(),
    redirect: 'manual',
  });
}
