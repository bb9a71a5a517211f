import { EngineError } from '../errors';
import { requireFiniteNumber } from '../stimuli/parameter-checks';

/** Validate an optional channel index against the capture's channel count. */
export function resolveChannelIndex(value: unknown, field: string, channelCount: number, fallback: number | null): number | null {
  if (value === undefined) return fallback;
  if (value === null) return null;
  const n = requireFiniteNumber(value, field);
  if (!Number.isInteger(n) || n < 0 || n >= channelCount) {
    throw new EngineError('channel_out_of_range', `${field} must be a channel index from 0 to ${channelCount - 1}, got ${n}.`, { field });
  }
  return n;
}
