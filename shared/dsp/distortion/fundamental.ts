import { EngineError } from '../errors';
import { windowSamples } from '../windows';
import { windowedDtft } from './dft';
import type { ToneSpectrum } from './tone-spectrum';

export interface FundamentalEstimate {
  frequencyHz: number;
  /** Peak amplitude, full-scale units. */
  amplitudePeak: number;
  /** How the amplitude was read, for the conventions. */
  levelMethod: string;
}

const GOLDEN = (Math.sqrt(5) - 1) / 2;

/** Frequency (cycles/sample) that maximises |DTFT| of the windowed record within ±1 bin of `bin` (golden-section search). */
function refinePeak(record: ArrayLike<number>, window: Float64Array, bin: number, length: number): number {
  const magnitude = (nu: number) => {
    const value = windowedDtft(record, window, nu);
    return value.re * value.re + value.im * value.im;
  };
  let low = (bin - 1) / length;
  let high = (bin + 1) / length;
  let x1 = high - GOLDEN * (high - low);
  let x2 = low + GOLDEN * (high - low);
  let f1 = magnitude(x1);
  let f2 = magnitude(x2);
  // 40 steps shrink the bracket by 0.618^40 ≈ 4e-9 of two bins: far below any frequency error that matters.
  for (let step = 0; step < 40; step++) {
    if (f1 < f2) {
      low = x1;
      x1 = x2;
      f1 = f2;
      x2 = low + GOLDEN * (high - low);
      f2 = magnitude(x2);
    } else {
      high = x2;
      x2 = x1;
      f2 = f1;
      x1 = high - GOLDEN * (high - low);
      f1 = magnitude(x1);
    }
  }
  return (low + high) / 2;
}

function largestBin(spectrum: ToneSpectrum, from: number, to: number): number {
  let best = -1;
  for (let k = Math.max(1, from); k <= Math.min(spectrum.power.length - 2, to); k++) {
    if (best < 0 || spectrum.power[k] > spectrum.power[best]) best = k;
  }
  return best;
}

/**
 * The fundamental of a tone record.
 * Coherent: the stimulus frequency must put an integer number of cycles in the record; the level is that bin.
 * Windowed: the largest bin (near the stated frequency when given), refined to the maximum of the windowed DTFT;
 * the level is read with a flat-top window at that frequency (scallop loss < 0.02 dB, and none at the exact peak).
 */
export function estimateFundamental(
  record: ArrayLike<number>,
  spectrum: ToneSpectrum,
  toneFrequencyHz: number | undefined,
): FundamentalEstimate {
  const { length, binHz } = spectrum;
  if (spectrum.method === 'coherent') {
    if (toneFrequencyHz === undefined) {
      throw new EngineError('tone_frequency_required', 'Coherent analysis needs the stimulus frequency.', {
        field: 'options.toneFrequencyHz',
      });
    }
    const cycles = toneFrequencyHz / binHz;
    const bin = Math.round(cycles);
    if (Math.abs(cycles - bin) > 1e-6 * Math.max(1, cycles) || bin < 1 || bin >= length / 2) {
      throw new EngineError(
        'tone_not_coherent',
        `Coherent analysis needs an integer number of cycles in the record: ${toneFrequencyHz} Hz over ${length} samples is ${cycles.toFixed(4)} cycles. Use method "windowed".`,
        { field: 'options.method', details: { cycles } },
      );
    }
    return {
      frequencyHz: bin * binHz,
      amplitudePeak: (2 * Math.sqrt(spectrum.power[bin])) / length,
      levelMethod: 'rectangular window on the tone bin (integer cycles)',
    };
  }
  const window = spectrum.window as Float64Array;
  const h = spectrum.lobeHalfWidthBins;
  const searchFrom = toneFrequencyHz === undefined ? h + 1 : Math.round(toneFrequencyHz / binHz) - h;
  const searchTo = toneFrequencyHz === undefined ? spectrum.power.length - 2 : Math.round(toneFrequencyHz / binHz) + h;
  const bin = largestBin(spectrum, Math.max(searchFrom, h + 1), searchTo);
  if (bin < 0 || spectrum.power[bin] === 0) {
    throw new EngineError('tone_not_found', 'No tone found in the record (silent, or the stated frequency is outside it).', {
      field: toneFrequencyHz === undefined ? 'capture' : 'options.toneFrequencyHz',
    });
  }
  const cyclesPerSample = refinePeak(record, window, bin, length);
  const flatTop = windowSamples('flat_top', length);
  let flatTopSum = 0;
  for (let n = 0; n < length; n++) flatTopSum += flatTop[n];
  const reading = windowedDtft(record, flatTop, cyclesPerSample);
  return {
    frequencyHz: cyclesPerSample * spectrum.sampleRateHz,
    amplitudePeak: (2 * Math.hypot(reading.re, reading.im)) / flatTopSum,
    levelMethod: 'flat-top window (D’Antona & Ferrero 2006) read at the interpolated frequency',
  };
}
