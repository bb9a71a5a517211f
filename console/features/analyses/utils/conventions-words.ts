// A result states every convention it used as a machine-readable string; these turn them into labelled
// sentences for the conventions block and into short axis labels.
type Conventions = Record<string, string | number | undefined>;

export interface ConventionLine {
  key: string;
  label: string;
  text: string;
}

const LABELS: Record<string, string> = {
  magnitudeReference: 'Level reference',
  dbfsConvention: 'Digital full scale',
  calibration: 'Calibration',
  smoothing: 'Smoothing',
  normalisation: 'Normalisation',
  gate: 'Time window',
  window: 'Spectrum window',
  grid: 'Frequency grid',
  phase: 'Phase',
  deconvolution: 'Deconvolution',
  thdDefinition: 'THD definitions',
  thdHeadline: 'Headline THD',
  harmonicOrders: 'Harmonic orders',
  thdPlusNoiseBandwidth: 'THD+N bandwidth',
  sensitivity: 'Sensitivity',
  speedOfSound: 'Speed of sound',
  mask: 'Tolerance mask',
  stimulus: 'Stimulus',
  timeZero: 'Time zero',
  noiseFloor: 'Noise floor',
  screening: 'High-order screening',
  numberPrecision: 'Number precision',
};

/** The order the block lists them in: what the numbers mean first, how they were computed after. */
const ORDER = Object.keys(LABELS);

const PLAIN_VALUES: Record<string, Record<string, string>> = {
  dbfsConvention: { aes17_sine: 'AES17: a full-scale sine reads 0 dBFS (so a full-scale square wave reads +3 dBFS)' },
  thdHeadline: {
    thd_f: 'THD_F — the harmonics relative to the fundamental',
    thd_r: 'THD_R — the harmonics relative to the whole signal (fundamental plus harmonics)',
  },
};

/** "harmonicSeparation" → "Harmonic separation": a readable label for keys the table does not know. */
export function labelForKey(key: string): string {
  const words = key.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

export function conventionLines(conventions: Conventions | null | undefined): ConventionLine[] {
  if (!conventions) return [];
  const rank = (key: string) => (ORDER.includes(key) ? ORDER.indexOf(key) : ORDER.length);
  return Object.entries(conventions)
    .filter((entry): entry is [string, string | number] => entry[1] !== undefined && entry[1] !== '')
    .sort(([a], [b]) => rank(a) - rank(b) || a.localeCompare(b))
    .map(([key, value]) => ({
      key,
      label: LABELS[key] ?? labelForKey(key),
      text: PLAIN_VALUES[key]?.[String(value)] ?? String(value),
    }));
}

/**
 * The dB reference for an axis label, from the stated magnitude reference: its leading clause only
 * ("dB SPL re 20 µPa at 1 m for 2.83 V RMS …" → "dB SPL re 20 µPa at 1 m").
 */
export function levelAxisLabel(magnitudeReference: string | number | undefined, fallback = 'dB'): string {
  if (typeof magnitudeReference !== 'string' || magnitudeReference.trim() === '') return `Level (${fallback})`;
  const lead = magnitudeReference.split(/ \(| for |;/)[0].trim();
  return `Level (${lead})`;
}
