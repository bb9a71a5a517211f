/**
 * Machine-readable warnings carried by every result. `code` is stable (part of the API contract);
 * `message` is for people. Extra numbers (e.g. the clipped sample count) go in `details`.
 */
export type WarningCode =
  | 'clipping'
  | 'dc_offset'
  | 'low_snr'
  | 'capture_shorter_than_stimulus'
  | 'sample_rate_mismatch'
  | 'gate_limits_low_frequency'
  | 'response_outside_sweep_band'
  | 'reference_channel_weak'
  | 'too_few_cycles'
  | 'harmonics_beyond_band_dropped'
  | 'harmonic_orders_overlap'
  | 'harmonic_below_noise_floor'
  | 'near_chain_residual'
  | 'tone_not_steady'
  | 'calibration_expired'
  | 'uncalibrated'
  | 'band_limit_beyond_range'
  | 'far_field_assumption'
  | 'few_golden_curves'
  | 'mask_partial_coverage';

export interface EngineWarning {
  code: WarningCode;
  message: string;
  details?: Record<string, number | string | boolean | null>;
}

export function warning(code: WarningCode, message: string, details?: EngineWarning['details']): EngineWarning {
  return details ? { code, message, details } : { code, message };
}
