/**
 * Reads the headline figures a production summary aggregates from a stored result's `figures`, whatever kind
 * produced them. Each reader names the paths it tries, in order; a figure that is absent or not a finite number
 * is skipped (the unit simply does not count in that distribution).
 */
type Figures = Record<string, unknown>;

function at(figures: Figures, path: string): unknown {
  let value: unknown = figures;
  for (const part of path.split('.')) {
    if (value === null || typeof value !== 'object') return undefined;
    value = (value as Record<string, unknown>)[part];
  }
  return value;
}

function firstNumber(figures: Figures, paths: readonly string[]): number | null {
  for (const path of paths) {
    const value = at(figures, path);
    if (typeof value === 'number' && Number.isFinite(value)) return value;
  }
  return null;
}

export const SENSITIVITY_PATHS = {
  // Loudspeaker: the band-mean ("characteristic") figure first, then the 1 kHz one, then a flat sensitivity result.
  dbSplAt2p83VoltsOneMetre: [
    'sensitivity.bandMean.dbSplAt2p83VoltsOneMetre',
    'sensitivity.atOneKilohertz.dbSplAt2p83VoltsOneMetre',
    'sensitivity.dbSplAt2p83VoltsOneMetre',
    'dbSplAt2p83VoltsOneMetre',
  ],
  dbSplPerVolt: ['sensitivity.dbSplPerVolt', 'dbSplPerVolt'],
  millivoltsPerPascal: ['sensitivity.millivoltsPerPascal', 'millivoltsPerPascal'],
} as const;

export function sensitivityOf(figures: Figures, unit: keyof typeof SENSITIVITY_PATHS): number | null {
  return firstNumber(figures, SENSITIVITY_PATHS[unit]);
}

/** THD_F at exactly 1 kHz from the distortion summary's reference value (its referenceHz must be 1000). */
export function thdFAtOneKilohertzOf(figures: Figures): number | null {
  for (const base of ['distortion.thdF.atReference', 'thdF.atReference']) {
    const reference = at(figures, base) as { frequencyHz?: unknown; valuePercent?: unknown } | undefined;
    if (reference && reference.frequencyHz === 1000 && typeof reference.valuePercent === 'number' && Number.isFinite(reference.valuePercent)) {
      return reference.valuePercent;
    }
  }
  return firstNumber(figures, ['thdFAtOneKilohertzPercent', 'distortion.thdFAtOneKilohertzPercent']);
}

export interface BandLimitReading {
  dropDb: number;
  lowerHz: number | null;
  upperHz: number | null;
}

/** The −X dB points found (status 'found') in figures.bandLimits.limits, as the sweep and spectrum kinds write them. */
export function bandLimitsOf(figures: Figures): BandLimitReading[] {
  const limits = at(figures, 'bandLimits.limits');
  if (!Array.isArray(limits)) return [];
  const found = (point: unknown) => {
    const p = point as { status?: unknown; frequencyHz?: unknown } | null;
    return p && p.status === 'found' && typeof p.frequencyHz === 'number' && Number.isFinite(p.frequencyHz) ? p.frequencyHz : null;
  };
  return limits
    .filter((limit): limit is { dropDb: number; lower: unknown; upper: unknown } => typeof (limit as { dropDb?: unknown })?.dropDb === 'number')
    .map((limit) => ({ dropDb: limit.dropDb, lowerHz: found(limit.lower), upperHz: found(limit.upper) }));
}
