import { EngineError } from '../errors';
import type { SmoothingOptions, SmoothingWindow } from './curve';
import { HANN_SUB_BANDS } from './smoothing-window';

export interface ResolvedSmoothing {
  octaveFraction: 'none' | number;
  averaging: 'power' | 'complex';
  window: SmoothingWindow;
}

export function resolveSmoothingOptions(options: SmoothingOptions): ResolvedSmoothing {
  const { octaveFraction } = options;
  if (octaveFraction !== 'none' && !(Number.isInteger(octaveFraction) && octaveFraction >= 1 && octaveFraction <= 48)) {
    throw new EngineError(
      'smoothing_fraction_invalid',
      `Smoothing must be 'none' or 1/N octave with N an integer from 1 to 48, got ${String(octaveFraction)}.`,
      { field: 'smoothing.octaveFraction' },
    );
  }
  const averaging = options.averaging ?? 'power';
  if (averaging !== 'power' && averaging !== 'complex') {
    throw new EngineError('smoothing_averaging_invalid', `Averaging must be 'power' or 'complex'.`, {
      field: 'smoothing.averaging',
    });
  }
  const window = options.window ?? 'hann';
  if (window !== 'hann' && window !== 'rectangular') {
    throw new EngineError('smoothing_window_invalid', `Window must be 'hann' or 'rectangular'.`, {
      field: 'smoothing.window',
    });
  }
  return { octaveFraction, averaging, window };
}

/** Plain-words statement of the smoothing for a result's conventions. */
export function describeSmoothing(options: SmoothingOptions): string {
  const { octaveFraction, averaging, window } = resolveSmoothingOptions(options);
  if (octaveFraction === 'none') return 'none (values interpolated onto the output grid)';
  const what = averaging === 'power' ? 'power (|H|² averaged, magnitude only)' : 'complex (re and im averaged; bulk delay removed before smoothing)';
  const shape =
    window === 'hann'
      ? `Hann window over log frequency spanning f·2^(±1/${2 * octaveFraction}) (${HANN_SUB_BANDS} constant-weight sub-bands, variance-matched)`
      : `rectangular window over log frequency spanning f·2^(±1/${2 * octaveFraction})`;
  return `1/${octaveFraction} octave, ${what}, ${shape}; truncated and renormalised at the data edges`;
}
