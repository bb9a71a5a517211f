import { formatDb, formatFrequency, formatMilliseconds, formatPercent } from '@console/components/charts/format-units';
import type { LimitPoint } from '@shared/dsp';
import { maskFigure, responseFigures, type ResultEnvelope } from './result-view';

export interface FigureRow {
  label: string;
  value: string;
  note?: string;
  tone?: 'danger' | 'warning';
}

export interface FigureGroup {
  title: string;
  rows: FigureRow[];
}

type Json = Record<string, unknown>;
const isObject = (value: unknown): value is Json => typeof value === 'object' && value !== null && !Array.isArray(value);
const num = (value: unknown): number | null => (typeof value === 'number' && Number.isFinite(value) ? value : null);

/** Where a band limit lies, in words; a limit the data does not reach is never shown as if it were one. */
export function limitPointText(point: LimitPoint): { value: string; tone?: 'warning' } {
  switch (point.status) {
    case 'found':
      return { value: formatFrequency(point.frequencyHz) };
    case 'beyond_measured_range':
      return { value: `beyond measured range (data ends at ${formatFrequency(point.measuredEdgeHz)})`, tone: 'warning' };
    case 'outside_at_reference_band':
      return { value: `already outside at ${formatFrequency(point.atHz)}`, tone: 'warning' };
  }
}

function sensitivityGroup(result: ResultEnvelope): FigureGroup | null {
  const f = result.figures;
  const rows: FigureRow[] = [];
  const add = (label: string, value: number | null, unit: string, decimals = 1) => value !== null && rows.push({ label, value: formatDb(value, { decimals, unit }) });
  if (f.deviceType === 'loudspeaker') {
    add('At 2.83 V, 1 m', num(f.dbSplAt2p83VoltsOneMetre), 'dB SPL');
    add('At 1 W, 1 m', num(f.dbSplAtOneWattOneMetre), 'dB SPL');
  } else if (f.deviceType === 'headphone') {
    add('Per volt', num(f.dbSplPerVolt), 'dB SPL/V');
    add('Per milliwatt', num(f.dbSplPerMilliwatt), 'dB SPL/mW');
  } else if (f.deviceType === 'microphone') {
    const mv = num(f.millivoltsPerPascal);
    if (mv !== null) rows.push({ label: 'Sensitivity', value: `${Number(mv.toPrecision(4))} mV/Pa` });
    add('Sensitivity', num(f.dbvPerPascal), 'dBV/Pa', 2);
  }
  if (Array.isArray(f.bandHz) && rows.length > 0) rows.push({ label: 'Band', value: `${formatFrequency(f.bandHz[0] as number)} – ${formatFrequency(f.bandHz[1] as number)}` });
  const spectrum = isObject(f.sensitivity) ? f.sensitivity : null;
  if (spectrum && isObject(spectrum.atOneKilohertz)) {
    for (const [key, value] of Object.entries(spectrum.atOneKilohertz)) if (num(value) !== null) rows.push({ label: `At 1 kHz: ${key}`, value: String(Number((value as number).toFixed(2))) });
  }
  return rows.length > 0 ? { title: 'Sensitivity', rows } : null;
}

function bandLimitsGroup(result: ResultEnvelope): FigureGroup | null {
  const band = responseFigures(result).bandLimits;
  if (!isObject(band) || !Array.isArray(band.limits)) return null;
  const reference = isObject(band.reference) ? num(band.reference.levelDb) : num(band.referenceLevelDb);
  const rows: FigureRow[] = reference !== null ? [{ label: 'Reference level', value: formatDb(reference, { decimals: 2 }), note: isObject(band.reference) ? String(band.reference.description ?? '') : undefined }] : [];
  for (const limit of band.limits as { dropDb: number; lower: LimitPoint; upper: LimitPoint }[]) {
    const lower = limitPointText(limit.lower);
    const upper = limitPointText(limit.upper);
    rows.push({ label: `−${limit.dropDb} dB points`, value: `${lower.value} – ${upper.value}`, tone: lower.tone ?? upper.tone });
  }
  return { title: 'Band limits', rows };
}

function thdGroup(result: ResultEnvelope): FigureGroup | null {
  const d = isObject(result.figures.distortion) ? result.figures.distortion : result.figures;
  const headline = d.thdHeadline === 'thd_r' || (isObject(d.thdHeadline) && d.thdHeadline.form === 'thd_r') ? 'thd_r' : 'thd_f';
  const rows: FigureRow[] = [];
  for (const form of ['thd_f', 'thd_r'] as const) {
    const figure = d[form === 'thd_f' ? 'thdF' : 'thdR'];
    if (!isObject(figure)) continue;
    const name = `${form === 'thd_f' ? 'THD_F' : 'THD_R'}${form === headline ? ' (headline)' : ''}`;
    if (num(figure.valuePercent) !== null) {
      rows.push({ label: name, value: formatPercent(figure.valuePercent as number, { isUpperBound: figure.isUpperBound === true }) });
      continue;
    }
    const maximum = isObject(figure.maximum) ? figure.maximum : null;
    const at = isObject(figure.atReference) ? figure.atReference : null;
    if (at && num(at.valuePercent) !== null) rows.push({ label: `${name} at ${formatFrequency(at.frequencyHz as number)}`, value: formatPercent(at.valuePercent as number, { isUpperBound: at.isUpperBound === true }) });
    if (maximum && num(maximum.valuePercent) !== null) {
      rows.push({
        label: `${name} maximum`,
        value: `${formatPercent(maximum.valuePercent as number, { isUpperBound: maximum.isUpperBound === true })} at ${formatFrequency(maximum.frequencyHz as number)}`,
      });
    }
  }
  if (num(d.sinadDb) !== null) rows.push({ label: 'SINAD', value: formatDb(d.sinadDb as number) });
  return rows.length > 0 ? { title: 'Harmonic distortion', rows } : null;
}

function verdictGroup(result: ResultEnvelope): FigureGroup | null {
  const mask = maskFigure(result);
  if (!mask) return null;
  const limits = [mask.upper && { side: 'upper', ...mask.upper }, mask.lower && { side: 'lower', ...mask.lower }].filter(Boolean) as ({ side: string } & NonNullable<typeof mask.upper>)[];
  const worst = limits.reduce<(typeof limits)[number] | null>((w, l) => (w === null || l.worstMarginDb < w.worstMarginDb ? l : w), null);
  const rows: FigureRow[] = [{ label: 'Verdict', value: mask.verdict === 'pass' ? 'Pass' : mask.verdict === 'fail' ? 'Fail' : 'Incomplete', tone: mask.verdict === 'fail' ? 'danger' : mask.verdict === 'incomplete' ? 'warning' : undefined }];
  if (worst) {
    rows.push({ label: 'Worst margin', value: `${formatDb(worst.worstMarginDb, { decimals: 2, signed: true })} at ${formatFrequency(worst.worstMarginFrequencyHz)}`, note: `${worst.side} limit; negative = outside` });
  }
  for (const limit of limits) {
    if (!limit.coversLimitSpan) rows.push({ label: `${limit.side} limit span`, value: `checked only ${formatFrequency(limit.evaluatedFromHz)} – ${formatFrequency(limit.evaluatedToHz)}`, tone: 'warning' });
  }
  if (mask.id) rows.push({ label: 'Mask', value: `${mask.id}${mask.version ? ` v${mask.version}` : ''}`, note: mask.guardBandDb ? `guard band ${formatDb(mask.guardBandDb)}` : undefined });
  return { title: 'Mask verdict', rows };
}

function timingGroup(result: ResultEnvelope): FigureGroup | null {
  const f = responseFigures(result);
  const rows: FigureRow[] = [];
  if (num(f.delayMs) !== null) rows.push({ label: 'Delay', value: formatMilliseconds(f.delayMs as number), note: num(f.delayDistanceMetres) !== null ? `${(f.delayDistanceMetres as number).toFixed(3)} m at ${f.temperatureCelsius} °C` : undefined });
  if (typeof f.polarity === 'string') rows.push({ label: 'Polarity', value: f.polarity === 'positive' ? 'Positive' : 'Inverted', tone: f.polarity === 'negative' ? 'warning' : undefined });
  if (num(f.lowestValidFrequencyHz) !== null) rows.push({ label: 'Lowest valid frequency', value: formatFrequency(f.lowestValidFrequencyHz as number), note: f.gated ? 'from the gate length' : 'from the analysis window' });
  if (num(f.peakToNoiseDb) !== null) rows.push({ label: 'IR peak to noise', value: formatDb(f.peakToNoiseDb as number) });
  return rows.length > 0 ? { title: 'Impulse response', rows } : null;
}

/** The figures a result states, grouped for the panel beside the plots; groups without data are left out. */
export function figureGroups(result: ResultEnvelope): FigureGroup[] {
  return [verdictGroup(result), sensitivityGroup(result), bandLimitsGroup(result), thdGroup(result), timingGroup(result)].filter((group): group is FigureGroup => group !== null);
}
