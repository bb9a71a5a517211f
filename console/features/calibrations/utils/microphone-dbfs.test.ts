import { describe, expect, it } from 'vitest';
import { dbfsAtOnePascalFromMicrophone, fullScaleRmsFromPeak } from './microphone-dbfs';

describe('dBFS at 1 Pa from a microphone sensitivity', () => {
  it('hand-computed: 12.5 mV/Pa into a 1 V RMS full scale', () => {
    // 20·log10(0.0125 / 1) = 20 · (−1.90309) = −38.0618 dB (AES17 full-scale sine = 0 dBFS).
    expect(dbfsAtOnePascalFromMicrophone(12.5, 1)).toBeCloseTo(-38.0618, 4);
  });

  it('hand-computed: 50 mV/Pa into a converter rated 2 V peak', () => {
    // V_FS,rms = 2 / √2 = 1.41421 V; 20·log10(0.05 / 1.41421) = 20 · (−1.45154) = −29.0309 dB.
    expect(fullScaleRmsFromPeak(2)).toBeCloseTo(1.414214, 6);
    expect(dbfsAtOnePascalFromMicrophone(50, fullScaleRmsFromPeak(2))).toBeCloseTo(-29.0309, 4);
  });

  it('a microphone giving exactly full scale at 1 Pa reads 0 dBFS', () => {
    expect(dbfsAtOnePascalFromMicrophone(1000, 1)).toBe(0);
  });
});
