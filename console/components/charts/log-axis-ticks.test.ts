import { describe, expect, it } from 'vitest';
import { decadeFrequenciesHz, frequencyTickLabel, thirdOctaveGridLines } from './log-axis-ticks';

// ISO 266:1997 nominal 1/3-octave mid-band frequencies, 20 Hz – 20 kHz (the R10 series), from memory.
const ISO_266_THIRD_OCTAVE = [
  '20', '25', '31.5', '40', '50', '63', '80', '100', '125', '160', '200', '250', '315', '400', '500', '630', '800',
  '1000', '1250', '1600', '2000', '2500', '3150', '4000', '5000', '6300', '8000', '10000', '12500', '16000', '20000',
];

describe('log-frequency axis ticks', () => {
  it('puts one grid line on each of the 31 ISO 266 third-octave centres of the audio band', () => {
    const lines = thirdOctaveGridLines(20, 20_000);
    expect(lines.map((line) => line.nominalLabel)).toEqual(ISO_266_THIRD_OCTAVE);
  });

  it('places each line at the exact base-10 centre, 1000·10^(x/10) Hz, not at the rounded label', () => {
    // IEC 61260-1:2014 eq. 2 (b = 3, base 10): band x = −17 is 1000·10^(−1.7) = 19.953 Hz; x = 5 is 3162.3 Hz.
    const lines = thirdOctaveGridLines(20, 20_000);
    expect(lines[0].frequencyHz).toBeCloseTo(19.9526, 3);
    expect(lines.find((line) => line.nominalLabel === '3150')!.frequencyHz).toBeCloseTo(3162.28, 1);
    expect(lines.find((line) => line.nominalLabel === '1000')!.frequencyHz).toBe(1000);
  });

  it('marks decades strong and labels only the 1-2-5 members, so the axis text never crowds', () => {
    // Common practice, no source: 1-2-5 labelling on log axes.
    const lines = thirdOctaveGridLines(20, 20_000);
    expect(lines.filter((line) => line.isDecade).map((line) => line.nominalLabel)).toEqual(['100', '1000', '10000']);
    expect(lines.filter((line) => line.isLabelled).map((line) => line.nominalLabel)).toEqual([
      '20', '50', '100', '200', '500', '1000', '2000', '5000', '10000', '20000',
    ]);
  });

  it('keeps only the centres inside a narrower range', () => {
    expect(thirdOctaveGridLines(100, 1000).map((line) => line.nominalLabel)).toEqual([
      '100', '125', '160', '200', '250', '315', '400', '500', '630', '800', '1000',
    ]);
  });

  it('lists the powers of ten inside a range', () => {
    expect(decadeFrequenciesHz(20, 20_000)).toEqual([100, 1000, 10_000]);
    expect(decadeFrequenciesHz(10, 100)).toEqual([10, 100]);
  });

  it('writes kilohertz with a k and keeps 31.5 as it is named', () => {
    // ISO 266 nominal names; the "k" suffix is common practice, no source.
    expect(frequencyTickLabel(31.5)).toBe('31.5');
    expect(frequencyTickLabel(500)).toBe('500');
    expect(frequencyTickLabel(1000)).toBe('1k');
    expect(frequencyTickLabel(12_500)).toBe('12.5k');
    expect(frequencyTickLabel(20_000)).toBe('20k');
  });
});
