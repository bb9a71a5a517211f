import { describe, expect, it } from 'vitest';
import { isEngineError } from './errors';
import { thrownBy } from './test-support/thrown-by';
import { measureWindowSidelobes, WINDOW_DEFINITIONS, windowFigures, windowSamples, type WindowName } from './windows';

// Harris, "On the use of windows for harmonic analysis with the DFT", Proc. IEEE 66(1):51–83, 1978, Table 1:
// coherent gain, ENBW (bins), highest sidelobe (dB) and scallop loss (dB), as printed (rounded) in the table.
const HARRIS_TABLE_1: Partial<Record<WindowName, { cg: number; enbw: number; sidelobeDb: number; scallopDb: number }>> = {
  rectangular: { cg: 1.0, enbw: 1.0, sidelobeDb: -13, scallopDb: 3.92 },
  hann: { cg: 0.5, enbw: 1.5, sidelobeDb: -32, scallopDb: 1.42 },
  hamming: { cg: 0.54, enbw: 1.36, sidelobeDb: -43, scallopDb: 1.78 },
  blackman: { cg: 0.42, enbw: 1.73, sidelobeDb: -58, scallopDb: 1.1 },
  blackman_harris_4: { cg: 0.36, enbw: 2.0, sidelobeDb: -92, scallopDb: 0.83 },
};

const LENGTH = 4096;

describe('window figures of merit', () => {
  for (const [name, expected] of Object.entries(HARRIS_TABLE_1) as [WindowName, NonNullable<(typeof HARRIS_TABLE_1)[WindowName]>][]) {
    it(`${name} matches Harris 1978 Table 1`, () => {
      const figures = windowFigures(windowSamples(name, LENGTH));
      const sidelobes = measureWindowSidelobes(name, { length: LENGTH });
      // Table values are rounded to 2 decimals (CG, ENBW) and to whole dB (sidelobe).
      expect(figures.coherentGain).toBeCloseTo(expected.cg, 2);
      expect(Math.abs(figures.equivalentNoiseBandwidthBins - expected.enbw)).toBeLessThan(0.006);
      expect(Math.abs(sidelobes.highestSidelobeDb - expected.sidelobeDb)).toBeLessThan(0.6);
      // Harris' Hamming scallop figure (1.78 dB) belongs to a slightly different Hamming variant; 0.05 dB covers it.
      expect(Math.abs(sidelobes.scallopLossDb - expected.scallopDb)).toBeLessThan(0.05);
      expect(sidelobes.firstNullBins).toBe(WINDOW_DEFINITIONS[name].mainLobeHalfWidthBins);
    });
  }

  it('windows beyond Harris 1978 have the figures their definitions imply', () => {
    // 7-term Blackman-Harris (Albrecht, ICASSP 2001, from memory): sidelobes below −170 dB, first null at 7 bins.
    const bh7 = measureWindowSidelobes('blackman_harris_7', { length: LENGTH });
    expect(bh7.highestSidelobeDb).toBeLessThan(-170);
    expect(bh7.firstNullBins).toBe(7);
    // Flat-top (D'Antona & Ferrero 2006, p. 70): the point of the design is a scallop loss under 0.02 dB.
    const flatTop = measureWindowSidelobes('flat_top', { length: LENGTH });
    expect(flatTop.scallopLossDb).toBeLessThan(0.02);
    expect(flatTop.highestSidelobeDb).toBeLessThan(-90);
    // A cosine-sum window's coherent gain is its a0 coefficient (Harris 1978, eq. for CG of the periodic form).
    for (const name of Object.keys(WINDOW_DEFINITIONS) as WindowName[]) {
      const a0 = WINDOW_DEFINITIONS[name].coefficients[0];
      expect(windowFigures(windowSamples(name, LENGTH)).coherentGain).toBeCloseTo(a0, 12);
    }
  });

  it('rejects bad inputs with EngineError only', () => {
    const attempts = [
      () => windowSamples('nope' as WindowName, 16),
      () => windowSamples('hann', 0),
      () => windowSamples('hann', 2.5),
      () => measureWindowSidelobes('hann', { padFactor: 3 }),
    ];
    for (const attempt of attempts) expect(isEngineError(thrownBy(attempt))).toBe(true);
  });
});
