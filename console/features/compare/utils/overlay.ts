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
  /** Typed arrays straight from the engine's curve type: the chart takes them without a copy. */
  frequencyHz: Float64Array;
  magnitudeDb: Float64Array;
  /** The level taken as 0 dB, in the curve's own reference; null without normalisation. */
  referenceLevelDb: number | null;
}

export interface OverlayProblem {
  id: string;
  label: string;
  reason: string;
}

function sameValues(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** The finite points of a stored curve as the engine's curve type (frequencies strictly ascending). */
export function toMagnitudeCurve(curve: OverlayCurve): MagnitudeCurve | null {
  const source = curve.frequencyHz;
  const levels = curve.magnitudeDb;
  const frequencyHz = new Float64Array(source.length);
  const magnitudeDb = new Float64Array(source.length);
  let count = 0;
  for (let i = 0; i < source.length; i++) {
    const f = source[i];
    const level = levels[i];
    if (level === null || level === undefined || !Number.isFinite(level) || !(f > 0) || (count > 0 && f <= frequencyHz[count - 1])) continue;
    frequencyHz[count] = f;
    magnitudeDb[count] = level;
    count++;
  }
  if (count < 2) return null;
  return count === source.length ? { frequencyHz, magnitudeDb } : { frequencyHz: frequencyHz.slice(0, count), magnitudeDb: magnitudeDb.slice(0, count) };
}

// A stored curve is read once, however often the normalisation changes; curves on the same grid share one
// frequency array, so the chart sees one x axis and needs no alignment.
const readCurves = new WeakMap<OverlayCurve, MagnitudeCurve | null>();

function readCurvesOnce(curves: readonly OverlayCurve[]): (MagnitudeCurve | null)[] {
  let sharedFrequencyHz: Float64Array | null = null;
  return curves.map((curve) => {
    let magnitude = readCurves.get(curve);
    if (magnitude === undefined) {
      magnitude = toMagnitudeCurve(curve);
      if (magnitude && sharedFrequencyHz && sameValues(magnitude.frequencyHz, sharedFrequencyHz)) magnitude = { ...magnitude, frequencyHz: sharedFrequencyHz };
      readCurves.set(curve, magnitude);
    }
    if (magnitude && !sharedFrequencyHz) sharedFrequencyHz = magnitude.frequencyHz;
    return magnitude;
  });
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
  const magnitudes = readCurvesOnce(curves);
  curves.forEach((curve, index) => {
    const magnitude = magnitudes[index];
    if (!magnitude) {
      problems.push({ id: curve.id, label: curve.label, reason: 'has fewer than two points' });
      return;
    }
    try {
      const normalised = normaliseCurve(magnitude, spec(choice));
      prepared.push({
        id: curve.id,
        label: curve.label,
        frequencyHz: normalised.curve.frequencyHz,
        magnitudeDb: normalised.curve.magnitudeDb,
        referenceLevelDb: normalised.reference?.levelDb ?? null,
      });
    } catch (error) {
      problems.push({ id: curve.id, label: curve.label, reason: error instanceof Error ? error.message : 'cannot be normalised' });
    }
  });
  return { curves: prepared, problems };
}

/** Points per octave of the common grid of the difference view. */
export const DIFFERENCE_POINTS_PER_OCTAVE = 48;

/**
 * Each curve minus the reference, in dB, on one log grid (1/48 octave) covering the span all curves share;
 * curves are read on it with the engine's resampleCurve (straight lines in dB against log f).
 */
export function differenceToReference(curves: readonly PreparedCurve[], referenceId: string): { gridHz: Float64Array; differences: { id: string; label: string; differenceDb: Float64Array }[] } | null {
  const reference = curves.find((curve) => curve.id === referenceId);
  if (!reference || curves.length === 0) return null;
  const asCurve = (curve: PreparedCurve): MagnitudeCurve => ({ frequencyHz: curve.frequencyHz, magnitudeDb: curve.magnitudeDb });
  const startHz = Math.max(20, ...curves.map((curve) => curve.frequencyHz[0]));
  const stopHz = Math.min(20_000, ...curves.map((curve) => curve.frequencyHz[curve.frequencyHz.length - 1]));
  if (!(stopHz > startHz)) return null;
  let grid = logFrequencyGrid({ pointsPerOctave: DIFFERENCE_POINTS_PER_OCTAVE, startHz, stopHz });
  for (const curve of curves) grid = gridInsideCurve(asCurve(curve), grid);
  if (grid.length < 2) return null;
  const referenceOnGrid = resampleCurve(asCurve(reference), grid).magnitudeDb;
  return {
    gridHz: grid,
    differences: curves.map((curve) => {
      const onGrid = resampleCurve(asCurve(curve), grid).magnitudeDb;
      return { id: curve.id, label: curve.label, differenceDb: onGrid.map((level, i) => level - referenceOnGrid[i]) };
    }),
  };
}
