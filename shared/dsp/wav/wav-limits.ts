/**
 * Limits a WAV upload must respect before it is decoded. Every limit refused names itself in the error details
 * (`details.limit`), so the API can say which one was hit.
 */
export interface WavLimits {
  /** Most channels accepted. */
  maxChannels: number;
  /** Longest capture accepted, seconds. */
  maxDurationSeconds: number;
  /** Highest sample rate accepted, Hz. */
  maxSampleRateHz: number;
  /** Lowest sample rate accepted, Hz. */
  minSampleRateHz: number;
  /** Largest file accepted, bytes (no limit when absent). */
  maxBytes?: number;
}

/** Defaults: 32 channels, 600 s, 8 kHz – 384 kHz, no byte limit (the API sets its own upload limit). */
export const DEFAULT_WAV_LIMITS: Readonly<WavLimits> = Object.freeze({
  maxChannels: 32,
  maxDurationSeconds: 600,
  maxSampleRateHz: 384_000,
  minSampleRateHz: 8_000,
});

/** Merge caller limits over the defaults (absent keys keep the default). */
export function resolveWavLimits(limits: Partial<WavLimits> = {}): WavLimits {
  const merged: WavLimits = { ...DEFAULT_WAV_LIMITS };
  for (const key of Object.keys(limits) as (keyof WavLimits)[]) {
    const value = limits[key];
    if (value !== undefined) merged[key] = value;
  }
  return merged;
}
