import { gridInsideCurve, logFrequencyGrid, normaliseCurve, resampleCurve, type MagnitudeCurve, type NormalisationSpec } from '@shared/dsp/curves';

/** The overlay stays readable up to about ten curves. */
export const MAX_OVERLAY_CURVES = 10;

export type NormalisationChoice = 'none' | 'at_1khz' | 'band_mean';

/** Band of the band-mean normalisation, Hz; the common sensitivity band (common practice, no source). */
export const BAND_MEAN_HZ: [number, number] = [300, 3000];

export interface OverlayCurve {
  id: string;
  label: string;
  frequencyHz: readonly number[];
  magnitudeDb: readonly (number | null)[];
}

export interface PreparedCurve {
  id: string;
  label: string;
  frequencyHz: number[];
  magnitudeDb: number[];
  /** The level taken as 0 dB, in the curve's own reference; null without normalisation. */
  referenceLevelDb: number | null;
}

export interface OverlayProblem {
  id: string;
  label: string;
  reason: string;
}

/** The finite points of a stored curve as the engine's curve type (frequencies strictly ascending). */
export function toMagnitudeCurve(curve: OverlayCurve): MagnitudeCurve | null {
  const frequencyHz: number[] = [];
  const magnitudeDb: number[] = [];
  curve.frequencyHz.forEach((f, i) => {
    const level = curve.magnitudeDb[i];
    if (level === null || !Number.isFinite(level) || !(f > 0) || (frequencyHz.length > 0 && f <= frequencyHz[frequencyHz.length - 1])) return;
    frequencyHz.push(f);
    magnitudeDb.push(level);
  });
  return frequencyHz.length >= 2 ? { frequencyHz: Float64Array.from(frequencyHz), magnitudeDb: Float64Array.from(magnitudeDb) } : null;
}

function spec(choice: NormalisationChoice): NormalisationSpec {
  if (choice === 'at_1khz') return { kind: 'at_frequency', frequencyHz: 1000 };
  if (choice === 'band_mean') return { kind: 'band_mean', fromHz: BAND_MEAN_HZ[0], toHz: BAND_MEAN_HZ[1], average: 'power' };
  return { kind: 'none' };
}

/**
 * Normalises each curve with the engine's own functions (the same ones the API uses), so the console's 0 dB
 * means what a stored normalised result means. A curve that cannot be normalised (1 kHz outside it) is listed
 * as a problem and left out.
 */
export function prepareOverlay(curves: readonly OverlayCurve[], choice: NormalisationChoice): { curves: PreparedCurve[]; problems: OverlayProblem[] } {
  const prepared: PreparedCurve[] = [];
  const problems: OverlayProblem[] = [];
  for (const curve of curves) {
    const magnitude = toMagnitudeCurve(curve);
    if (!magnitude) {
      problems.push({ id: curve.id, label: curve.label, reason: 'has fewer than two points' });
      continue;
    }
    try {
      const normalised = normaliseCurve(magnitude, spec(choice));
      prepared.push({
        id: curve.id,
        label: curve.label,
        frequencyHz: Array.from(normalised.curve.frequencyHz),
        magnitudeDb: Array.from(normalised.curve.magnitudeDb),
        referenceLevelDb: normalised.reference?.levelDb ?? null,
      });
    } catch (error) {
      problems.push({ id: curve.id, label: curve.label, reason: error instanceof Error ? error.message : 'cannot be normalised' });
    }
  }
  return { curves: prepared, problems };
}

/** Points per octave of the common grid of the difference view. */
export const DIFFERENCE_POINTS_PER_OCTAVE = 48;

/**
 * Each curve minus the reference, in dB, on one log grid (1/48 octave) covering the span all curves share;
 * curves are read on it with the engine's resampleCurve (straight lines in dB against log f).
 */
export function differenceToReference(curves: readonly PreparedCurve[], referenceId: string): { gridHz: number[]; differences: { id: string; label: string; differenceDb: number[] }[] } | null {
  const reference = curves.find((curve) => curve.id === referenceId);
  if (!reference || curves.length === 0) return null;
  const asCurve = (curve: PreparedCurve): MagnitudeCurve => ({ frequencyHz: Float64Array.from(curve.frequencyHz), magnitudeDb: Float64Array.from(curve.magnitudeDb) });
  const startHz = Math.max(20, ...curves.map((curve) => curve.frequencyHz[0]));
  const stopHz = Math.min(20_000, ...curves.map((curve) => curve.frequencyHz[curve.frequencyHz.length - 1]));
  if (!(stopHz > startHz)) return null;
  let grid = logFrequencyGrid({ pointsPerOctave: DIFFERENCE_POINTS_PER_OCTAVE, startHz, stopHz });
  for (const curve of curves) grid = gridInsideCurve(asCurve(curve), grid);
  if (grid.length < 2) return null;
  const referenceOnGrid = resampleCurve(asCurve(reference), grid).magnitudeDb;
  return {
    gridHz: Array.from(grid),
    differences: curves.map((curve) => {
      const onGrid = resampleCurve(asCurve(curve), grid).magnitudeDb;
      return { id: curve.id, label: curve.label, differenceDb: Array.from(onGrid, (level, i) => level - referenceOnGrid[i]) };
    }),
  };
}
