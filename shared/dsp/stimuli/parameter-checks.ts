import { EngineError } from '../errors';

/**
 * Small validators shared by the stimulus designs and the analysis options. Each throws an EngineError with a
 * stable code and the dotted field path of the offending parameter, so the API can point at the exact field.
 */
export function requireFiniteNumber(value: unknown, field: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new EngineError('parameter_not_a_number', `${field} must be a finite number, got ${String(value)}.`, { field });
  }
  return value;
}

export function requireNumberInRange(
  value: unknown,
  field: string,
  minimum: number,
  maximum: number,
  unit: string,
  code = 'parameter_out_of_range',
): number {
  const n = requireFiniteNumber(value, field);
  if (n < minimum || n > maximum) {
    throw new EngineError(code, `${field} must be between ${minimum} and ${maximum} ${unit}, got ${n}.`, {
      field,
      details: { minimum, maximum, value: n },
    });
  }
  return n;
}

export function requireInteger(value: unknown, field: string, minimum: number, maximum: number): number {
  const n = requireFiniteNumber(value, field);
  if (!Number.isInteger(n) || n < minimum || n > maximum) {
    throw new EngineError('parameter_out_of_range', `${field} must be an integer from ${minimum} to ${maximum}, got ${n}.`, {
      field,
      details: { minimum, maximum, value: n },
    });
  }
  return n;
}

export function requireObject(value: unknown, field: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    throw new EngineError('parameter_not_an_object', `${field} must be an object.`, { field });
  }
  return value as Record<string, unknown>;
}

export function requireOneOf<T extends string>(value: unknown, field: string, allowed: readonly T[]): T {
  if (typeof value !== 'string' || !(allowed as readonly string[]).includes(value)) {
    throw new EngineError('parameter_not_allowed', `${field} must be one of ${allowed.join(', ')}, got ${String(value)}.`, {
      field,
      details: { allowed: allowed.join(',') },
    });
  }
  return value as T;
}

/** Reject keys the caller did not mean (a typo would otherwise silently fall back to a default). */
export function rejectUnknownKeys(value: Record<string, unknown>, field: string, known: readonly string[]): void {
  for (const key of Object.keys(value)) {
    if (!known.includes(key)) {
      const path = field ? `${field}.${key}` : key;
      throw new EngineError('parameter_unknown', `Unknown parameter ${path}.`, { field: path });
    }
  }
}

/** Sample rates the engine accepts for stimuli and captures, in Hz. */
export const SAMPLE_RATE_LIMITS_HZ = { minimum: 8000, maximum: 768000 } as const;

export function requireSampleRateHz(value: unknown, field: string): number {
  const n = requireFiniteNumber(value, field);
  if (!Number.isInteger(n) || n < SAMPLE_RATE_LIMITS_HZ.minimum || n > SAMPLE_RATE_LIMITS_HZ.maximum) {
    throw new EngineError(
      'sample_rate_invalid',
      `${field} must be an integer from ${SAMPLE_RATE_LIMITS_HZ.minimum} to ${SAMPLE_RATE_LIMITS_HZ.maximum} Hz, got ${n}.`,
      { field },
    );
  }
  return n;
}

/** Stimulus level in dBFS (peak of the waveform re full scale; for a sine this equals its AES17 level). */
export function requireLevelDbfs(value: unknown, field: string): number {
  const n = requireFiniteNumber(value, field);
  if (n > 0) {
    throw new EngineError('level_above_full_scale', `${field} must be at most 0 dBFS (the peak cannot exceed full scale), got ${n}.`, {
      field,
    });
  }
  if (n < -120) {
    throw new EngineError('level_too_low', `${field} must be at least −120 dBFS, got ${n}.`, { field });
  }
  return n;
}
