import { describe, expect, it } from 'vitest';
import {
  OCTAVE_RATIO_BASE_10,
  bandCentreFrequencyHz,
  bandEdgesHz,
  bandIndexForFrequency,
  fractionalOctaveBand,
  fractionalOctaveBands,
  thirdOctaveBandTable,
} from './bands';

// IEC 61260-1:2014 base-10 band system: G = 10^(3/10), f_r = 1 kHz, odd b: f_m = f_r·G^(x/b),
// even b: f_m = f_r·G^((2x+1)/(2b)), edges f_m·G^(±1/(2b)) (from memory). Values computed from those equations.

describe('IEC 61260-1:2014 band centres and edges', () => {
  it('uses the base-10 octave ratio G = 10^0.3 = 1.995262', () => {
    expect(OCTAVE_RATIO_BASE_10).toBeCloseTo(1.995262, 6);
  });

  it('1/3 octave: x = 0 is 1000 Hz with edges 891.251 and 1122.018 Hz; x = 1 is 1258.925 Hz', () => {
    expect(bandCentreFrequencyHz(0, 3)).toBe(1000);
    const edges = bandEdgesHz(1000, 3);
    expect(edges.lowerEdgeHz).toBeCloseTo(891.251, 3);
    expect(edges.upperEdgeHz).toBeCloseTo(1122.018, 3);
    expect(bandCentreFrequencyHz(1, 3)).toBeCloseTo(1258.925, 3);
    // For b = 3 the centres are 1000·10^(x/10).
    for (let x = -17; x <= 13; x++) expect(bandCentreFrequencyHz(x, 3) / (1000 * 10 ** (x / 10))).toBeCloseTo(1, 13);
  });

  it('octave: 31.62, 63.10, 125.89, 251.19, 501.19, 1000, 1995.26, 3981.07, 7943.28, 15848.93 Hz', () => {
    const expected = [31.62, 63.1, 125.89, 251.19, 501.19, 1000, 1995.26, 3981.07, 7943.28, 15848.93];
    expected.forEach((hz, i) => expect(bandCentreFrequencyHz(i - 5, 1)).toBeCloseTo(hz, 2));
  });

  it('even b has no band centred on 1 kHz: 1 kHz is a band edge (1/6: 944.061 | 1059.254; 1/12: 971.628 | 1029.201; 1/24: 985.712 | 1014.495)', () => {
    const pairs: [number, number, number][] = [
      [6, 944.061, 1059.254],
      [12, 971.628, 1029.201],
      [24, 985.712, 1014.495],
    ];
    for (const [b, below, above] of pairs) {
      expect(bandCentreFrequencyHz(-1, b)).toBeCloseTo(below, 3);
      expect(bandCentreFrequencyHz(0, b)).toBeCloseTo(above, 3);
      expect(bandEdgesHz(bandCentreFrequencyHz(0, b), b).lowerEdgeHz).toBeCloseTo(1000, 9);
      expect(bandEdgesHz(bandCentreFrequencyHz(-1, b), b).upperEdgeHz).toBeCloseTo(1000, 9);
    }
  });

  it('1/48 octave uses the even rule too, and adjacent bands share edges for every b from 1 to 48', () => {
    expect(bandCentreFrequencyHz(0, 48)).toBeCloseTo(1000 * 10 ** (0.3 / 96), 9);
    for (const b of [1, 2, 3, 6, 12, 24, 48]) {
      const upper = bandEdgesHz(bandCentreFrequencyHz(4, b), b).upperEdgeHz;
      const nextLower = bandEdgesHz(bandCentreFrequencyHz(5, b), b).lowerEdgeHz;
      expect(upper / nextLower).toBeCloseTo(1, 12);
      // Band index is the inverse of the centre formula.
      expect(bandIndexForFrequency(bandCentreFrequencyHz(-7, b), b)).toBeCloseTo(-7, 9);
    }
  });

  it('refuses band fractions outside 1..48 or not an integer', () => {
    expect(() => bandCentreFrequencyHz(0, 0)).toThrow(RangeError);
    expect(() => bandCentreFrequencyHz(0, 2.5)).toThrow(RangeError);
    expect(() => fractionalOctaveBands(96, 20, 20_000)).toThrow(RangeError);
    expect(() => fractionalOctaveBands(3, 0, 20_000)).toThrow(RangeError);
  });
});

describe('ISO 266:1997 nominal labels', () => {
  it('labels the 31 one-third-octave bands 20 Hz – 20 kHz with the ISO 266 preferred frequencies', () => {
    const table = thirdOctaveBandTable();
    // ISO 266:1997 Table 1 (R10 series), 20 Hz to 20 kHz.
    expect(table.map((band) => band.nominalLabel)).toEqual([
      '20', '25', '31.5', '40', '50', '63', '80', '100', '125', '160', '200', '250', '315', '400', '500', '630', '800',
      '1000', '1250', '1600', '2000', '2500', '3150', '4000', '5000', '6300', '8000', '10000', '12500', '16000', '20000',
    ]);
    expect(table[0]).toMatchObject({ index: -17, nominalHz: 20, labelSource: 'iso_266_r80_series' });
    expect(table[0].exactHz).toBeCloseTo(19.953, 3);
    expect(table[30].index).toBe(13);
    for (const band of table) {
      expect(band.exactHz).toBeCloseTo(1000 * 10 ** (band.index / 10), 9);
      expect(band.lowerEdgeHz).toBeCloseTo(band.exactHz / 10 ** (1 / 20), 9);
      expect(band.upperEdgeHz).toBeCloseTo(band.exactHz * 10 ** (1 / 20), 9);
    }
  });

  it('labels octave bands 31.5 … 16000 Hz (ISO 266:1997, every third R10 member)', () => {
    expect(fractionalOctaveBands(1, 31.5, 16_000).map((band) => band.nominalLabel)).toEqual([
      '31.5', '63', '125', '250', '500', '1000', '2000', '4000', '8000', '16000',
    ]);
  });

  it('labels 1/6- and 1/12-octave centres with R40 and R80 members (ISO 3, from memory) and finer grids with 3 significant figures', () => {
    expect(fractionalOctaveBands(6, 900, 1200).map((band) => band.nominalLabel)).toEqual(['950', '1060', '1180']);
    expect(fractionalOctaveBands(12, 950, 1100).map((band) => band.nominalLabel)).toEqual(['975', '1030', '1090']);
    const fine = fractionalOctaveBand(0, 24);
    expect(fine).toMatchObject({ nominalLabel: '1010', labelSource: 'three_significant_figures' });
    expect(fractionalOctaveBand(3, 48).nominalLabel).toBe(Number(bandCentreFrequencyHz(3, 48).toPrecision(3)).toString());
  });

  it('selects bands from the one containing lowHz to the one containing highHz', () => {
    const bands = fractionalOctaveBands(3, 95, 1000);
    expect(bands[0].nominalLabel).toBe('100');
    expect(bands[bands.length - 1].nominalLabel).toBe('1000');
    expect(bands.length).toBe(11);
  });
});
