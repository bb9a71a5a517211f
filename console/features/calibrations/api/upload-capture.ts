import { buildApiUrl } from '@console/lib/api-client';
import { ApiProblem, networkProblem, toProblemBody } from '@console/lib/api-problem';
import type { Capture } from '@shared/schemas/captures';

/**
 * Uploads a WAV as multipart/form-data (part `file`), which the JSON client does not send. The same
 * Idempotency-Key on a retry replays the first upload instead of storing the file twice.
 */
export async function uploadCapture(file: File, idempotencyKey: string): Promise<Capture> {
  const body = new FormData();
  body.append('file', file, file.name);
  let response: Response;
  try {
    response = await fetch(buildApiUrl('/captures'), {
      method: 'POST',
      body,
      credentials: 'same-origin',
      headers: { Accept: 'application/json, application/problem+json', 'Idempotency-Key': idempotencyKey },
    });
  } catch {
    throw networkProblem();
  }
  const parsed: unknown = await response.json().catch(() => undefined);
  if (!response.ok) throw new ApiProblem(toProblemBody(response.status, response.statusText, parsed));
  return parsed as Capture;
}
