import { ApiProblem } from '@server/http/api-problem';

export const MAX_PREFER_WAIT_SECONDS = 60;

/** The `wait` preference of an RFC 7240 Prefer header in seconds (capped at 60), or null when absent. */
export function preferredWaitSeconds(header: string | string[] | undefined): number | null {
  const value = Array.isArray(header) ? header.join(',') : header;
  if (!value) return null;
  for (const preference of value.split(',')) {
    const match = /^\s*wait\s*=\s*"?(\d+)"?\s*(;.*)?$/i.exec(preference);
    if (match) return Math.min(Number(match[1]), MAX_PREFER_WAIT_SECONDS);
    if (/^\s*wait\s*=/i.test(preference)) {
      throw new ApiProblem('validation_failed', 'Prefer: wait takes whole seconds, e.g. "Prefer: wait=10".', {
        errors: [{ in: 'header', pointer: '#/prefer', detail: 'wait=N with N a whole number of seconds, at most 60.' }],
      });
    }
  }
  return null;
}
