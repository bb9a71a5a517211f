/**
 * Half-Hann fades: the gain rises as 0.5·(1 − cos(π·n/M)) over the first M samples (0 at n = 0) and falls as the
 * mirror image over the last M samples (0 at the last sample). Shared by every stimulus so they all fade alike.
 */
export function halfHannRiseGain(index: number, fadeSampleCount: number): number {
  if (index >= fadeSampleCount) return 1;
  return 0.5 * (1 - Math.cos((Math.PI * index) / fadeSampleCount));
}

/** Apply a half-Hann fade-in and fade-out in place to `samples[start, start + length)`. */
export function applyHalfHannFades(
  samples: Float64Array,
  start: number,
  length: number,
  fadeInSampleCount: number,
  fadeOutSampleCount: number,
): void {
  const rise = Math.min(fadeInSampleCount, length);
  for (let n = 0; n < rise; n++) samples[start + n] *= halfHannRiseGain(n, fadeInSampleCount);
  const fall = Math.min(fadeOutSampleCount, length);
  for (let j = 0; j < fall; j++) samples[start + length - 1 - j] *= halfHannRiseGain(j, fadeOutSampleCount);
}
