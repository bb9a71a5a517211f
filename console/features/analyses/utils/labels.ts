import type { AnalysisKind, AnalysisStatus } from '@shared/schemas/analyses';
import type { Verdict } from './filters';

export const kindLabel: Record<AnalysisKind, string> = {
  frequency_response: 'Frequency response',
  distortion: 'Distortion',
  response_and_distortion: 'Response + distortion',
  stepped_sine: 'Stepped sine',
  calibrator: 'Calibrator',
  sensitivity: 'Sensitivity',
  spectrum: 'Spectrum',
  tone_distortion: 'Tone distortion',
};

export const statusLabel: Record<AnalysisStatus, string> = {
  queued: 'Queued',
  running: 'Running',
  succeeded: 'Done',
  failed: 'Failed',
  canceled: 'Canceled',
};

export const verdictLabel: Record<Verdict, string> = { pass: 'Pass', fail: 'Fail', incomplete: 'Incomplete' };

/** "KB-65 woofer · KB65-24-000123" — the device as people name it; the id when nothing was stated. */
export function deviceName(dut: { model: string | null; serial: string | null }, fallback: string): string {
  const parts = [dut.model, dut.serial].filter(Boolean);
  return parts.length > 0 ? parts.join(' · ') : fallback;
}
