/**
 * Fractional-octave bands, base-10 system of IEC 61260-1:2014: octave ratio G = 10^(3/10), reference 1 kHz,
 * centres f_m = 1000·G^(x/b) for odd b and 1000·G^((2x+1)/(2b)) for even b (so for even b no band is centred on
 * 1 kHz; 1 kHz is a band edge), edges f_m·G^(±1/(2b)). Computation always uses these exact frequencies; the
 * nominal label is for display only.
 *
 * Nominal labels: ISO 266:1997 takes nominal mid-band frequencies from the ISO 3 preferred-number series. One
 * 1/24-octave step of the base-10 system is exactly one R80 step (1/80 decade), so every centre that falls on a
 * whole number of R80 steps is labelled with that R80 member (R80 contains R10, R20 and R40):
 *   1/1 and 1/3 octave → R10 members (the ISO 266 table), 1/2 and 1/6 octave → R40 members,
 *   1/12 octave → R80 members.
 * The even-b rule puts 1/6-octave centres halfway between R20 members and 1/24- and 1/48-octave centres between
 * R80 members, where no preferred number exists; those get 3-significant-figure labels (which need not be unique).
 */

/** Octave frequency ratio of the base-10 system, G = 10^(3/10) ≈ 1.995262 (IEC 61260-1:2014). */
export const OCTAVE_RATIO_BASE_10 = 10 ** 0.3;

/** Reference frequency of the band system, Hz (IEC 61260-1:2014). */
export const BAND_REFERENCE_FREQUENCY_HZ = 1000;

/**
 * ISO 3 R80 preferred numbers in [1, 10) (from memory); R10, R20 and R40 are every 8th, 4th and 2nd member.
 * ISO 266:1997 takes its nominal frequencies from these series.
 */
export const R80_PREFERRED_NUMBERS: readonly number[] = Object.freeze([
  1.0, 1.03, 1.06, 1.09, 1.12, 1.15, 1.18, 1.22, 1.25, 1.28, 1.32, 1.36, 1.4, 1.45, 1.5, 1.55, 1.6, 1.65, 1.7, 1.75,
  1.8, 1.85, 1.9, 1.95, 2.0, 2.06, 2.12, 2.18, 2.24, 2.3, 2.36, 2.43, 2.5, 2.58, 2.65, 2.72, 2.8, 2.9, 3.0, 3.07,
  3.15, 3.25, 3.35, 3.45, 3.55, 3.65, 3.75, 3.87, 4.0, 4.12, 4.25, 4.37, 4.5, 4.62, 4.75, 4.87, 5.0, 5.15, 5.3,
  5.45, 5.6, 5.8, 6.0, 6.15, 6.3, 6.5, 6.7, 6.9, 7.1, 7.3, 7.5, 7.75, 8.0, 8.25, 8.5, 8.75, 9.0, 9.25, 9.5, 9.75,
]);

/** One fractional-octave band: exact frequencies in Hz and its display label. */
export interface FractionalOctaveBand {
  /** Band number x of IEC 61260-1 (0 is the band centred on 1 kHz for odd b, the band just above 1 kHz for even b). */
  index: number;
  exactHz: number;
  /** Nominal frequency in Hz used for the label (ISO 266 / ISO 3 preferred number, or 3 significant figures). */
  nominalHz: number;
  /** Nominal frequency as text in Hz, e.g. "31.5", "1000", "12500". */
  nominalLabel: string;
  /** Where the label came from. */
  labelSource: 'iso_266_r80_series' | 'three_significant_figures';
  lowerEdgeHz: number;
  upperEdgeHz: number;
}

function requireBandsPerOctave(bandsPerOctave: number): void {
  if (!Number.isInteger(bandsPerOctave) || bandsPerOctave < 1 || bandsPerOctave > 48) {
    throw new RangeError(`Bands per octave must be an integer from 1 to 48, got ${bandsPerOctave}.`);
  }
}

/** Band position in R80 steps (1/80 decade) above 1 kHz: 24·x/b (odd b) or 12·(2x+1)/b (even b). */
function positionInR80Steps(index: number, bandsPerOctave: number): number {
  return bandsPerOctave % 2 === 1 ? (24 * index) / bandsPerOctave : (12 * (2 * index + 1)) / bandsPerOctave;
}

/** Exact mid-band frequency in Hz of band `index` for 1/b octave (IEC 61260-1:2014 eqs. 2 and 3, base 10). */
export function bandCentreFrequencyHz(index: number, bandsPerOctave: number): number {
  requireBandsPerOctave(bandsPerOctave);
  const octaves = bandsPerOctave % 2 === 1 ? index / bandsPerOctave : (2 * index + 1) / (2 * bandsPerOctave);
  return BAND_REFERENCE_FREQUENCY_HZ * OCTAVE_RATIO_BASE_10 ** octaves;
}

/** Lower and upper band-edge frequencies in Hz of a band centred at `centreHz`: f_m·G^(∓1/(2b)) (IEC 61260-1:2014 eqs. 4, 5). */
export function bandEdgesHz(centreHz: number, bandsPerOctave: number): { lowerEdgeHz: number; upperEdgeHz: number } {
  requireBandsPerOctave(bandsPerOctave);
  const halfBand = OCTAVE_RATIO_BASE_10 ** (1 / (2 * bandsPerOctave));
  return { lowerEdgeHz: centreHz / halfBand, upperEdgeHz: centreHz * halfBand };
}

/** Band number x (possibly fractional) whose exact centre is `frequencyHz`, inverse of bandCentreFrequencyHz. */
export function bandIndexForFrequency(frequencyHz: number, bandsPerOctave: number): number {
  requireBandsPerOctave(bandsPerOctave);
  const octaves = Math.log10(frequencyHz / BAND_REFERENCE_FREQUENCY_HZ) / 0.3;
  return bandsPerOctave % 2 === 1 ? octaves * bandsPerOctave : (octaves * 2 * bandsPerOctave - 1) / 2;
}

/** Format a frequency in Hz with `significantFigures`, as plain decimal text without trailing zeros. */
export function formatFrequencyLabel(frequencyHz: number, significantFigures = 3): string {
  const rounded = Number(frequencyHz.toPrecision(significantFigures));
  return String(rounded);
}

/** Nominal frequency and label of band `index`: ISO 266 / ISO 3 R80 member where one exists, else 3 significant figures. */
export function bandNominalFrequency(
  index: number,
  bandsPerOctave: number,
): { nominalHz: number; nominalLabel: string; labelSource: FractionalOctaveBand['labelSource'] } {
  const position = positionInR80Steps(index, bandsPerOctave);
  const whole = Math.round(position);
  if (Math.abs(position - whole) < 1e-9) {
    const decade = Math.floor(whole / 80);
    const member = R80_PREFERRED_NUMBERS[whole - 80 * decade];
    // Round away the binary noise of member·10^k (e.g. 3.15·10 = 31.499999...).
    const nominalHz = Number((member * 10 ** (decade + 3)).toPrecision(3));
    return { nominalHz, nominalLabel: String(nominalHz), labelSource: 'iso_266_r80_series' };
  }
  const exactHz = bandCentreFrequencyHz(index, bandsPerOctave);
  const nominalHz = Number(exactHz.toPrecision(3));
  return { nominalHz, nominalLabel: formatFrequencyLabel(exactHz), labelSource: 'three_significant_figures' };
}

/** Full description of band `index` for 1/b octave: exact centre, edges and nominal label (IEC 61260-1:2014, ISO 266:1997). */
export function fractionalOctaveBand(index: number, bandsPerOctave: number): FractionalOctaveBand {
  const exactHz = bandCentreFrequencyHz(index, bandsPerOctave);
  return {
    index,
    exactHz,
    ...bandNominalFrequency(index, bandsPerOctave),
    ...bandEdgesHz(exactHz, bandsPerOctave),
  };
}

/**
 * Bands of 1/b octave from the one containing `lowHz` to the one containing `highHz` (a frequency on an edge
 * belongs to the band above it), IEC 61260-1:2014 base-10 system.
 */
export function fractionalOctaveBands(bandsPerOctave: number, lowHz: number, highHz: number): FractionalOctaveBand[] {
  requireBandsPerOctave(bandsPerOctave);
  if (!(lowHz > 0) || !(highHz >= lowHz) || !Number.isFinite(highHz)) {
    throw new RangeError(`Band range must satisfy 0 < lowHz ≤ highHz < ∞, got ${lowHz}..${highHz} Hz.`);
  }
  // A frequency lies in the band whose (fractional) index is within ±1/2 of it.
  const first = Math.floor(bandIndexForFrequency(lowHz, bandsPerOctave) + 0.5 + 1e-9);
  const last = Math.floor(bandIndexForFrequency(highHz, bandsPerOctave) + 0.5 + 1e-9);
  const bands: FractionalOctaveBand[] = [];
  for (let index = first; index <= last; index++) bands.push(fractionalOctaveBand(index, bandsPerOctave));
  return bands;
}

/** The 31 one-third-octave bands 20 Hz – 20 kHz (x = −17..13), exact centres, edges and ISO 266 labels. */
export function thirdOctaveBandTable(): FractionalOctaveBand[] {
  return fractionalOctaveBands(3, 20, 20_000);
}
