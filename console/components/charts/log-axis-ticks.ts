import { fractionalOctaveBands } from '@shared/units/bands';

/** One grid line of a log-frequency axis: where it sits, its nominal label, and how strongly to draw it. */
export interface FrequencyGridLine {
  /** Exact position (IEC 61260-1 base-10 mid-band frequency, or an exact power of ten). */
  frequencyHz: number;
  /** ISO 266 nominal frequency as text in Hz, e.g. "31.5", "1000". */
  nominalLabel: string;
  /** Powers of ten get the strong line. */
  isDecade: boolean;
  /** Whether the axis prints a value here: nominal 1, 2 and 5 × 10^k keep the axis readable at any width. */
  isLabelled: boolean;
}

const LABELLED_MANTISSAS = new Set([1, 2, 5]);

function mantissaOf(nominalHz: number): number {
  return Number((nominalHz / 10 ** Math.floor(Math.log10(nominalHz) + 1e-9)).toPrecision(3));
}

/** Powers of ten inside [minHz, maxHz]. */
export function decadeFrequenciesHz(minHz: number, maxHz: number): number[] {
  const decades: number[] = [];
  for (let exponent = Math.ceil(Math.log10(minHz) - 1e-9); 10 ** exponent <= maxHz * (1 + 1e-9); exponent++) {
    decades.push(10 ** exponent);
  }
  return decades;
}

/**
 * The 1/3-octave grid of a log-frequency axis: one line per band centre inside [minHz, maxHz], placed at the
 * exact base-10 centre and named by its ISO 266 nominal frequency (20, 25, 31.5 … 20 000 Hz on an audio axis).
 */
export function thirdOctaveGridLines(minHz: number, maxHz: number): FrequencyGridLine[] {
  // Every axis pass asks again for the same range; keep the last few answers.
  const key = `${minHz}|${maxHz}`;
  const cached = gridCache.get(key);
  if (cached) return cached;
  const lines = computeGridLines(minHz, maxHz);
  if (gridCache.size > 16) gridCache.clear();
  gridCache.set(key, lines);
  return lines;
}

const gridCache = new Map<string, FrequencyGridLine[]>();

function computeGridLines(minHz: number, maxHz: number): FrequencyGridLine[] {
  const lowestHz = minHz / 1.13;
  const highestHz = maxHz * 1.13;
  return fractionalOctaveBands(3, lowestHz, highestHz)
    .filter((band) => band.exactHz >= minHz * (1 - 0.012) && band.exactHz <= maxHz * (1 + 0.012))
    .map((band) => {
      const mantissa = mantissaOf(band.nominalHz);
      return {
        frequencyHz: band.exactHz,
        nominalLabel: band.nominalLabel,
        isDecade: mantissa === 1,
        isLabelled: LABELLED_MANTISSAS.has(mantissa),
      };
    });
}

/** Axis text of a nominal frequency in Hz: "31.5", "500", "1k", "12.5k". */
export function frequencyTickLabel(nominalHz: number): string {
  if (nominalHz >= 1000) return `${Number((nominalHz / 1000).toPrecision(3))}k`;
  return String(Number(nominalHz.toPrecision(3)));
}
