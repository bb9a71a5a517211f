import { describe, expect, it } from 'vitest';
import { conventionLines, labelForKey, levelAxisLabel } from './conventions-words';

describe('conventions in plain words', () => {
  it('states the AES17 full-scale convention in words', () => {
    // AES17-2020 §3.12.1: full-scale amplitude is that of a sine whose peak just reaches full scale (0 dBFS).
    const [line] = conventionLines({ dbfsConvention: 'aes17_sine' });
    expect(line).toEqual({ key: 'dbfsConvention', label: 'Digital full scale', text: expect.stringContaining('full-scale sine reads 0 dBFS') });
  });

  it('names the headline THD form with what it is relative to', () => {
    // The two THD forms, re the fundamental and re the total signal: common practice, no source.
    expect(conventionLines({ thdHeadline: 'thd_f' })[0].text).toMatch(/relative to the fundamental/);
    expect(conventionLines({ thdHeadline: 'thd_r' })[0].text).toMatch(/whole signal/);
  });

  it('lists what the numbers mean before how they were computed, and labels unknown keys readably', () => {
    const lines = conventionLines({ grid: '24 points per octave', harmonicSeparation: 'synchronized sweep', magnitudeReference: 'dB re the stimulus', extra: undefined });
    expect(lines.map((line) => line.label)).toEqual(['Level reference', 'Frequency grid', 'Harmonic separation']);
    expect(labelForKey('thdPlusNoiseBandwidth')).toBe('Thd plus noise bandwidth');
  });

  it('takes the leading clause of the stated reference for the dB axis label', () => {
    // Common practice, no source: an axis names its dB reference.
    expect(levelAxisLabel('dB SPL re 20 µPa at 1 m for 2.83 V RMS at the terminals (drive level = the stimulus level, AES17 dBFS)')).toBe('Level (dB SPL re 20 µPa at 1 m)');
    expect(levelAxisLabel('dB re the stimulus (capture amplitude over stimulus amplitude, both re full scale)')).toBe('Level (dB re the stimulus)');
    expect(levelAxisLabel(undefined)).toBe('Level (dB)');
  });
});
