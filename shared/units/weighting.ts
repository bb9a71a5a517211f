/**
 * A and C frequency weightings, analytic magnitude of IEC 61672-1:2013 (Annex E, eqs. E.1–E.6): the pole
 * frequencies are derived from f_r = 1 kHz, f_L = 10^1.5 Hz, f_H = 10^3.9 Hz and f_A = 10^2.45 Hz with D = √(1/2),
 * not taken as the rounded 20.6 / 107.7 / 737.9 / 12 194 Hz. Normalisation: the response is divided by its own
 * value at 1 kHz so A(1 kHz) = C(1 kHz) = 0 dB exactly; the standard's rounded constants A1000 = −2.000 dB and
 * C1000 = −0.062 dB differ from that by < 0.001 dB and are exported for reference.
 * Evaluate at the exact base-10 frequency (1000·10^(k/10)), not at the nominal label, when comparing with the
 * standard's table.
 */

const REFERENCE_FREQUENCY_HZ = 1000;
const LOW_FREQUENCY_HZ = 10 ** 1.5;
const HIGH_FREQUENCY_HZ = 10 ** 3.9;
const A_WEIGHTING_FREQUENCY_HZ = 10 ** 2.45;
const D = Math.SQRT1_2;

function derivePoles(): { f1: number; f2: number; f3: number; f4: number } {
  const fr2 = REFERENCE_FREQUENCY_HZ ** 2;
  const fl2 = LOW_FREQUENCY_HZ ** 2;
  const fh2 = HIGH_FREQUENCY_HZ ** 2;
  const b = (1 / (1 - D)) * (fr2 + (fl2 * fh2) / fr2 - D * (fl2 + fh2));
  const c = fl2 * fh2;
  const root = Math.sqrt(b * b - 4 * c);
  return {
    f1: Math.sqrt((-b - root) / 2),
    f2: ((3 - Math.sqrt(5)) / 2) * A_WEIGHTING_FREQUENCY_HZ,
    f3: ((3 + Math.sqrt(5)) / 2) * A_WEIGHTING_FREQUENCY_HZ,
    f4: Math.sqrt((-b + root) / 2),
  };
}

/** Pole frequencies f1..f4 in Hz, derived as in IEC 61672-1:2013 Annex E (f1 ≈ 20.599, f2 ≈ 107.65, f3 ≈ 737.86, f4 ≈ 12 194.2). */
export const WEIGHTING_POLES_HZ: Readonly<{ f1: number; f2: number; f3: number; f4: number }> = Object.freeze(derivePoles());

/** The standard's rounded normalisation constants in dB (IEC 61672-1:2013 eq. E.6); for reference only. */
export const A1000_DB = -2.0;
export const C1000_DB = -0.062;

function unnormalisedA(frequencyHz: number): number {
  const { f1, f2, f3, f4 } = WEIGHTING_POLES_HZ;
  const f2sq = frequencyHz * frequencyHz;
  return (
    (f4 * f4 * f2sq * f2sq) /
    ((f2sq + f1 * f1) * Math.sqrt((f2sq + f2 * f2) * (f2sq + f3 * f3)) * (f2sq + f4 * f4))
  );
}

function unnormalisedC(frequencyHz: number): number {
  const { f1, f4 } = WEIGHTING_POLES_HZ;
  const f2sq = frequencyHz * frequencyHz;
  return (f4 * f4 * f2sq) / ((f2sq + f1 * f1) * (f2sq + f4 * f4));
}

const A_AT_REFERENCE = unnormalisedA(REFERENCE_FREQUENCY_HZ);
const C_AT_REFERENCE = unnormalisedC(REFERENCE_FREQUENCY_HZ);

/** A-weighting in dB at `frequencyHz` (IEC 61672-1:2013 eq. E.6, analytic magnitude, 0 dB at 1 kHz); −Infinity at 0 Hz. */
export function aWeightingDb(frequencyHz: number): number {
  return 20 * Math.log10(unnormalisedA(frequencyHz) / A_AT_REFERENCE);
}

/** C-weighting in dB at `frequencyHz` (IEC 61672-1:2013 eq. E.1, analytic magnitude, 0 dB at 1 kHz); −Infinity at 0 Hz. */
export function cWeightingDb(frequencyHz: number): number {
  return 20 * Math.log10(unnormalisedC(frequencyHz) / C_AT_REFERENCE);
}

/** Unnormalised A response at 1 kHz in dB (20·log10 R_A(1 kHz) ≈ −1.9997 dB); the standard rounds it to A1000. */
export function aWeightingUnnormalisedAtReferenceDb(): number {
  return 20 * Math.log10(A_AT_REFERENCE);
}

/** Unnormalised C response at 1 kHz in dB (≈ −0.0619 dB); the standard rounds it to C1000. */
export function cWeightingUnnormalisedAtReferenceDb(): number {
  return 20 * Math.log10(C_AT_REFERENCE);
}
