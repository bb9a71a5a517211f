import type { LimitPoint, MaskVerdict } from '@shared/dsp';
import type { Analysis } from '@shared/schemas/analyses';

// Typed readers over a stored result. The API returns the engine's envelope as plain JSON (`result` is an open
// record), so each reader checks the shape it needs and answers null when the result has no such curve.
type Num = number | null;
type Json = Record<string, unknown>;

const isObject = (value: unknown): value is Json => typeof value === 'object' && value !== null && !Array.isArray(value);
const isNumberArray = (value: unknown): value is Num[] => Array.isArray(value) && value.every((v) => v === null || typeof v === 'number');
const isBooleanArray = (value: unknown): value is boolean[] => Array.isArray(value) && value.every((v) => typeof v === 'boolean');
const numberOr = (value: unknown, fallback: number | null = null) => (typeof value === 'number' && Number.isFinite(value) ? value : fallback);

export interface ResultEnvelope {
  kind: string;
  engineVersion: string;
  conventions: Record<string, string | number | undefined>;
  figures: Json;
  curves: Json;
  warnings: { code: string; message: string }[];
}

export function resultOf(analysis: Pick<Analysis, 'result'>): ResultEnvelope | null {
  const result = analysis.result;
  if (!isObject(result) || !isObject(result.figures) || !isObject(result.curves)) return null;
  return {
    kind: String(result.kind ?? ''),
    engineVersion: String(result.engineVersion ?? ''),
    conventions: isObject(result.conventions) ? (result.conventions as ResultEnvelope['conventions']) : {},
    figures: result.figures,
    curves: result.curves,
    warnings: Array.isArray(result.warnings) ? (result.warnings as ResultEnvelope['warnings']) : [],
  };
}

/** The figures of the response part: sensitivity results keep them under `figures.response`. */
export const responseFigures = (result: ResultEnvelope): Json => (isObject(result.figures.response) ? result.figures.response : result.figures);

export interface ResponseView {
  frequencyHz: number[];
  magnitudeDb: Num[];
  phaseDeg: Num[] | null;
  groupDelayMs: Num[] | null;
  /** Below the gate's lowest valid frequency (greyed on the plot). */
  belowLowestValidFrequency: boolean[] | null;
  /** Level used as 0 dB by the normalisation; null when not normalised. */
  normalisationReferenceLevelDb: number | null;
}

export function responseView(result: ResultEnvelope): ResponseView | null {
  const curves = isObject(result.curves.response) ? result.curves.response : result.curves;
  if (!isNumberArray(curves.frequencyHz) || !isNumberArray(curves.magnitudeDb) || curves.frequencyHz.length < 2) return null;
  const figures = responseFigures(result);
  return {
    frequencyHz: curves.frequencyHz as number[],
    magnitudeDb: curves.magnitudeDb,
    phaseDeg: isNumberArray(curves.phaseDeg) ? curves.phaseDeg : null,
    groupDelayMs: isNumberArray(curves.groupDelayMs) ? curves.groupDelayMs : null,
    belowLowestValidFrequency: isBooleanArray(curves.belowLowestValidFrequency) ? curves.belowLowestValidFrequency : null,
    normalisationReferenceLevelDb: numberOr(figures.normalisationReferenceLevelDb ?? figures.referenceLevelDb),
  };
}

export interface ImpulseView {
  timeMs: number[];
  amplitude: number[];
  /** The window the spectrum was taken through, ms on the same time axis; null when unknown. */
  gateMs: [number, number] | null;
  gated: boolean;
  peakMs: number | null;
}

export function impulseView(result: ResultEnvelope): ImpulseView | null {
  const ir = result.curves.impulseResponse;
  if (!isObject(ir) || !isNumberArray(ir.samples) || typeof ir.sampleRateHz !== 'number' || typeof ir.startSeconds !== 'number') return null;
  const { sampleRateHz, startSeconds } = ir;
  const samples = ir.samples.map((v) => v ?? 0);
  const figures = responseFigures(result);
  const peakMs = numberOr(figures.delayMs);
  const preRollMs = numberOr(figures.windowPreRollMs);
  const lengthMs = numberOr(figures.windowLengthMs);
  return {
    timeMs: samples.map((_, i) => 1000 * (startSeconds + i / sampleRateHz)),
    amplitude: samples,
    gateMs: peakMs !== null && preRollMs !== null && lengthMs !== null ? [peakMs - preRollMs, peakMs + lengthMs] : null,
    gated: figures.gated === true,
    peakMs,
  };
}

export interface OrderView {
  order: number;
  percent: Num[];
  isUpperBound: boolean[];
}

export interface DistortionView {
  frequencyHz: number[];
  thdFPercent: Num[];
  thdRPercent: Num[];
  thdIsUpperBound: boolean[];
  orders: OrderView[];
}

export function distortionView(result: ResultEnvelope): DistortionView | null {
  const hd = result.curves.harmonicDistortion;
  if (!isObject(hd) || !isNumberArray(hd.frequencyHz) || !isNumberArray(hd.thdFPercent) || !isNumberArray(hd.thdRPercent)) return null;
  const length = hd.frequencyHz.length;
  const flags = (value: unknown) => (isBooleanArray(value) ? value : new Array<boolean>(length).fill(false));
  return {
    frequencyHz: hd.frequencyHz as number[],
    thdFPercent: hd.thdFPercent,
    thdRPercent: hd.thdRPercent,
    thdIsUpperBound: flags(hd.thdIsUpperBound),
    orders: (Array.isArray(hd.orders) ? hd.orders : [])
      .filter((o): o is Json => isObject(o) && typeof o.order === 'number' && isNumberArray(o.percent))
      .map((o) => ({ order: o.order as number, percent: o.percent as Num[], isUpperBound: flags(o.isUpperBound) })),
  };
}

export interface ScreeningView {
  frequencyHz: number[];
  percent: Num[];
  isUpperBound: boolean[];
}

export function screeningView(result: ResultEnvelope): ScreeningView | null {
  const s = result.curves.screening;
  if (!isObject(s) || !isNumberArray(s.frequencyHz) || !isNumberArray(s.percent)) return null;
  return { frequencyHz: s.frequencyHz as number[], percent: s.percent, isUpperBound: isBooleanArray(s.isUpperBound) ? s.isUpperBound : s.percent.map(() => false) };
}

export interface ResidualView {
  frequencyHz: number[];
  levelDbRelFundamental: Num[];
  description: string;
}

export function residualView(result: ResultEnvelope): ResidualView | null {
  const r = result.curves.residualSpectrum;
  if (!isObject(r) || !isNumberArray(r.frequencyHz) || !isNumberArray(r.levelDbRelFundamental)) return null;
  return { frequencyHz: r.frequencyHz as number[], levelDbRelFundamental: r.levelDbRelFundamental, description: String(r.description ?? '') };
}

export type MaskFigure = MaskVerdict & { id?: string; version?: number };

export function maskFigure(result: ResultEnvelope): MaskFigure | null {
  const mask = result.figures.mask ?? responseFigures(result).mask;
  return isObject(mask) && typeof mask.verdict === 'string' ? (mask as unknown as MaskFigure) : null;
}

export type { LimitPoint };
