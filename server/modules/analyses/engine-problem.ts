import { isEngineError, type EngineError } from '@shared/dsp';
import type { ProblemCode } from '@shared/problems';
import { ApiProblem } from '@server/http/api-problem';
import { jsonPointer } from '@server/http/validation';

/** "options.smoothing.octaveFraction" or "capture.channels[0]" → ["options", "smoothing", "octaveFraction"] / [..., "0"]. */
export function enginePathSegments(field: string): string[] {
  return field.split('.').flatMap((part) => part.split(/[[\]]/).filter(Boolean));
}

/**
 * An EngineError as a 422 problem: the engine's stable code travels as `engineCode`, its field as a JSON pointer
 * into the request body (after `rewrite` maps the engine's names to the request's, e.g. "sweep" → "parameters").
 */
export function problemFromEngineError(
  error: EngineError,
  options: { code?: ProblemCode; rewrite?: (segments: string[]) => string[]; prefix?: string } = {},
): ApiProblem {
  const segments = error.field ? (options.rewrite ?? ((s) => s))(enginePathSegments(error.field)) : null;
  return new ApiProblem(options.code ?? 'invalid_parameters', `${options.prefix ?? ''}${error.message}`, {
    extensions: { engineCode: error.code, ...(error.details ? { details: error.details } : {}) },
    ...(segments ? { errors: [{ in: 'body' as const, pointer: jsonPointer(segments), detail: error.message }] } : {}),
  });
}

/** Runs `work`, turning an EngineError into the 422 problem above. */
export function withEngineErrors<T>(work: () => T, options: Parameters<typeof problemFromEngineError>[1] = {}): T {
  try {
    return work();
  } catch (error) {
    if (isEngineError(error)) throw problemFromEngineError(error, options);
    throw error;
  }
}
