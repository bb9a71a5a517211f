import { EngineError } from '../errors';
import { warning, type EngineWarning } from '../result/warnings';
import { designSynchronizedSweep, redesignSweepAtSampleRate, type SweepDesign, type SweepParameters } from '../stimuli/sweep';

/**
 * The sweep an analysis deconvolves by. A design (or its parameters) made for another sample rate is redesigned
 * at the capture's rate: the synchronized sweep is defined in continuous time (f1, f2, L do not depend on fs), so
 * the same sweep played at one rate and captured at another is still the same signal, as long as the stop
 * frequency lies below the capture's Nyquist frequency.
 */
export function resolveSweepDesignForCapture(
  stimulus: SweepParameters | SweepDesign,
  captureSampleRateHz: number,
): { design: SweepDesign; warnings: EngineWarning[] } {
  if (typeof stimulus !== 'object' || stimulus === null) {
    throw new EngineError('stimulus_invalid', 'The stimulus must be given by its sweep parameters.', { field: 'stimulus' });
  }
  const asDesign = stimulus as Partial<SweepDesign>;
  const design =
    asDesign.kind === 'synchronized_exponential_sweep' && asDesign.parameters
      ? designSynchronizedSweep(asDesign.parameters, 'stimulus')
      : designSynchronizedSweep(stimulus as SweepParameters, 'stimulus');
  if (design.sampleRateHz === captureSampleRateHz) return { design, warnings: [] };
  const redesigned = redesignSweepAtSampleRate(design, captureSampleRateHz, 'stimulus');
  return {
    design: redesigned,
    warnings: [
      warning(
        'sample_rate_mismatch',
        `The stimulus was designed at ${design.sampleRateHz} Hz but the capture runs at ${captureSampleRateHz} Hz; the same continuous sweep was analysed at the capture's rate (the two clocks are assumed locked).`,
        { stimulusSampleRateHz: design.sampleRateHz, captureSampleRateHz },
      ),
    ],
  };
}

/** Warn when the capture ends before the stimulus (sweep plus trailing silence) does. */
export function sweepCaptureWarnings(captureLength: number, design: SweepDesign, captureOffsetSeconds: number): EngineWarning[] {
  const start = Math.round(captureOffsetSeconds * design.sampleRateHz);
  const needed = start + design.totalSampleCount;
  if (captureLength >= needed) return [];
  const sweepEnd = start + design.leadingSilenceSampleCount + design.sweepSampleCount;
  const message =
    captureLength < sweepEnd
      ? 'The capture ends before the sweep does: the top of the band is missing and the response there is invalid.'
      : "The capture ends before the stimulus's trailing silence does: the decay is cut and the analysis window shortened.";
  return [
    warning('capture_shorter_than_stimulus', message, {
      captureSeconds: captureLength / design.sampleRateHz,
      stimulusEndSeconds: needed / design.sampleRateHz,
    }),
  ];
}
