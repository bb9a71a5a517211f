import { formatBytes, formatCount, formatMinutes } from '@console/utils/format-quantity';
import type { Usage } from '@shared/schemas/usage';

export { formatBytes, formatCount, formatMinutes };

export type MeterTone = 'ok' | 'warning' | 'danger';

export interface MeterRow {
  key: 'analyses' | 'audioMinutes' | 'storageBytes';
  label: string;
  used: string;
  limit: string;
  /** 0 to 100 for the bar (the figure shown may exceed 100 when a limit was lowered). */
  barPercent: number;
  percentUsed: number;
  tone: MeterTone;
  note: string;
}

/** The points at which owners and admins are e-mailed; the bars change colour at the same points. */
export const WARNING_PERCENT = 80;
export const FULL_PERCENT = 100;

export function toneOf(percentUsed: number): MeterTone {
  if (percentUsed >= FULL_PERCENT) return 'danger';
  if (percentUsed >= WARNING_PERCENT) return 'warning';
  return 'ok';
}

/** The three metered quantities of GET /v1/usage as rows for the screen. */
export function meterRows(usage: Usage): MeterRow[] {
  const row = (key: MeterRow['key'], label: string, format: (value: number) => string, note: string): MeterRow => {
    const meter = usage[key];
    return {
      key,
      label,
      used: format(meter.used),
      limit: format(meter.limit),
      barPercent: Math.min(100, Math.max(0, meter.percentUsed)),
      percentUsed: meter.percentUsed,
      tone: toneOf(meter.percentUsed),
      note,
    };
  };
  return [
    row('analyses', 'Analyses', formatCount, 'Charged when accepted; refunded if canceled before it starts.'),
    row('audioMinutes', 'Audio minutes', formatMinutes, 'Capture durations analysed this period.'),
    row('storageBytes', 'Storage', formatBytes, 'Kept now; frees up only by deleting captures.'),
  ];
}
