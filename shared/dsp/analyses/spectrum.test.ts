import { describe, expect, it } from 'vitest';
import { EngineError } from '../errors';
import { analyzeSpectrum, type SpectrumInput } from './spectrum';

function codeAndField(run: () => unknown): [string, string | undefined] {
  try {
    run();
    return ['no error', undefined];
  } catch (error) {
    expect(error).toBeInstanceOf(EngineError);
    return [(error as EngineError).code, (error as EngineError).field];
  }
}

/** A KB-65 woofer-like response: 2nd-order Butterworth high-pass at 60 Hz on a 90 dB SPL plateau, 24 points/octave. */
function woofer(levelDbSpl = 90): SpectrumInput {
  const frequenciesHz: number[] = [];
  const magnitudeDb: number[] = [];
  for (let i = 0; i <= 240; i++) {
    const f = 20 * 2 ** (i / 24);
    frequenciesHz.push(f);
    magnitudeDb.push(levelDbSpl + 10 * Math.log10((f / 60) ** 4 / (1 + (f / 60) ** 4)));
  }
  return { frequenciesHz, magnitudeDb, magnitudeReference: 'db_spl' };
}

describe('spectrum input validation', () => {
  const good = (): SpectrumInput => ({ frequenciesHz: [100, 200, 400], magnitudeDb: [0, 1, 2], magnitudeReference: 'dbv' });
  const cases: [string, (input: SpectrumInput) => void, string, string][] = [
    ['too few points', (s) => ((s.frequenciesHz = [100, 200]), (s.magnitudeDb = [0, 0])), 'spectrum_too_short', 'spectrum.frequenciesHz'],
    ['unequal lengths', (s) => (s.magnitudeDb = [0, 1]), 'spectrum_length_mismatch', 'spectrum.magnitudeDb'],
    ['phase length', (s) => (s.phaseDeg = [0]), 'spectrum_length_mismatch', 'spectrum.phaseDeg'],
    ['descending', (s) => (s.frequenciesHz = [100, 400, 200]), 'spectrum_frequency_not_ascending', 'spectrum.frequenciesHz[2]'],
    ['repeated', (s) => (s.frequenciesHz = [100, 100, 200]), 'spectrum_frequency_not_ascending', 'spectrum.frequenciesHz[1]'],
    ['zero frequency', (s) => (s.frequenciesHz = [0, 100, 200]), 'spectrum_frequency_out_of_range', 'spectrum.frequenciesHz[0]'],
    ['above 1 MHz', (s) => (s.frequenciesHz = [100, 200, 2e6]), 'spectrum_frequency_out_of_range', 'spectrum.frequenciesHz[2]'],
    ['NaN frequency', (s) => (s.frequenciesHz = [100, Number.NaN, 200]), 'spectrum_frequency_not_finite', 'spectrum.frequenciesHz[1]'],
    ['infinite level', (s) => (s.magnitudeDb = [0, Infinity, 0]), 'spectrum_magnitude_not_finite', 'spectrum.magnitudeDb[1]'],
    ['absurd level', (s) => (s.magnitudeDb = [0, 0, 500]), 'spectrum_magnitude_out_of_range', 'spectrum.magnitudeDb[2]'],
    ['NaN phase', (s) => (s.phaseDeg = [0, Number.NaN, 0]), 'spectrum_phase_not_finite', 'spectrum.phaseDeg[1]'],
    ['unknown reference', (s) => (s.magnitudeReference = 'dbz' as never), 'spectrum_reference_invalid', 'spectrum.magnitudeReference'],
    ['not an array', (s) => (s.frequenciesHz = 'many' as never), 'spectrum_array_missing', 'spectrum.frequenciesHz'],
  ];
  for (const [name, spoil, code, field] of cases) {
    it(`rejects ${name} with ${code} at ${field}`, () => {
      const input = good();
      spoil(input);
      expect(codeAndField(() => analyzeSpectrum(input))).toEqual([code, field]);
    });
  }

  it('rejects bad options with their field paths', () => {
    expect(codeAndField(() => analyzeSpectrum(good(), { smoothing: { octaveFraction: 64 } }))).toEqual([
      'parameter_out_of_range',
      'options.smoothing.octaveFraction',
    ]);
    expect(codeAndField(() => analyzeSpectrum(good(), { smoothing: { octaveFraction: 3, averaging: 'complex' } }))).toEqual([
      'phase_required',
      'spectrum.phaseDeg',
    ]);
    expect(codeAndField(() => analyzeSpectrum(good(), { normalisation: { kind: 'at_1khz' } }))[0]).toBe('frequency_outside_curve');
    expect(codeAndField(() => analyzeSpectrum(good(), { extra: 1 } as never))).toEqual(['parameter_unknown', 'options.extra']);
    const relativeMask = { levelReference: 'relative' as const, upper: [{ frequencyHz: 100, levelDb: 3 }, { frequencyHz: 400, levelDb: 3 }] };
    expect(codeAndField(() => analyzeSpectrum(good(), { mask: relativeMask }))).toEqual(['mask_needs_normalisation', 'options.mask.levelReference']);
  });
});

describe('spectrum analysis', () => {
  it('refers dB SPL at 0.5 m and 2.83 V into 4 Ω to 1 m (−6.02 dB) and to 1 W (−3.01 dB more) (closed form)', () => {
    // Inverse-square law: L(1 m) = L(r) + 20·log10(r/1 m); 1 W into 4 Ω is 2 V, so 2.83 V delivers 2.83²/4 W.
    const input: SpectrumInput = { frequenciesHz: [100, 1000, 10000], magnitudeDb: [90, 90, 90], magnitudeReference: 'db_spl' };
    const result = analyzeSpectrum(input, {
      conditions: { distanceMetres: 0.5, driveVoltageRms: 2.83, nominalImpedanceOhms: 4 },
      sensitivityBand: { lowHz: 300, highHz: 3000, average: 'db' },
    });
    const sensitivity = result.figures.sensitivity!;
    const distanceDb = 20 * Math.log10(0.5);
    const powerDb = 10 * Math.log10(2.83 ** 2 / 4);
    expect(distanceDb).toBeCloseTo(-6.0206, 4);
    expect(powerDb).toBeCloseTo(3.0151, 4);
    for (const figure of [sensitivity.atOneKilohertz!, sensitivity.bandMean!]) {
      expect(figure.dbSplAt2p83VoltsOneMetre).toBeCloseTo(90 + distanceDb, 10);
      expect(figure.dbSplAtOneWattOneMetre!).toBeCloseTo(90 + distanceDb - powerDb, 10);
    }
    expect(sensitivity.driveWattsIntoNominal).toBeCloseTo(2.002225, 6);
    expect(result.warnings.map((w) => w.code)).toContain('far_field_assumption');
    expect(result.conventions.sensitivity).toContain('far field');
  });

  it('gives no sensitivity without stated drive conditions, and says why', () => {
    const result = analyzeSpectrum(woofer());
    expect(result.figures.sensitivity).toBeNull();
    expect(result.conventions.sensitivity).toContain('not computed');
  });

  it('derives smoothing, grid, normalisation, band limits, table and a mask verdict, stating every convention', () => {
    const result = analyzeSpectrum(woofer(), {
      smoothing: { octaveFraction: 6 },
      grid: { pointsPerOctave: 12, startHz: 20, stopHz: 20000 },
      normalisation: { kind: 'at_1khz' },
      bandLimits: { dropsDb: [3, 10], toleranceDb: 3 },
      mask: {
        levelReference: 'relative',
        upper: [{ frequencyHz: 50, levelDb: 2 }, { frequencyHz: 10000, levelDb: 2 }],
        lower: [{ frequencyHz: 50, levelDb: -3 }, { frequencyHz: 10000, levelDb: -3 }],
      },
    });
    expect(result.kind).toBe('spectrum');
    for (const key of ['magnitudeReference', 'smoothing', 'grid', 'normalisation', 'bandLimits', 'thirdOctave', 'mask']) {
      expect(typeof result.conventions[key]).toBe('string');
    }
    const { response } = result.curves;
    expect(response.frequencyHz[0]).toBeGreaterThanOrEqual(20);
    expect(response.frequencyHz).toContain(1000);
    expect(response.nominalLabel[response.frequencyHz.indexOf(1000)]).toBe('1000');
    expect(result.figures.referenceLevelDb).toBeCloseTo(90, 2);
    expect(response.relativeMagnitudeDb![response.frequencyHz.indexOf(1000)]).toBe(0);
    const [three] = result.figures.bandLimits!.limits;
    // −3 dB of the 60 Hz Butterworth, slightly moved by 1/6-octave smoothing.
    expect(three.lower.status).toBe('found');
    if (three.lower.status === 'found') expect(three.lower.frequencyHz).toBeCloseTo(60, -1);
    expect(three.upper.status).toBe('beyond_measured_range');
    expect(result.warnings.map((w) => w.code)).toContain('band_limit_beyond_range');
    // The high-pass is −4.9 dB re the plateau at 50 Hz: the lower limit fails from 50 Hz to near its −3 dB point.
    const mask = result.figures.mask!;
    expect(mask.verdict).toBe('fail');
    expect(mask.upper!.pass).toBe(true);
    expect(mask.lower!.failingRegionsHz.length).toBe(1);
    expect(mask.lower!.failingRegionsHz[0][0]).toBe(50);
    expect(mask.lower!.failingRegionsHz[0][1]).toBeCloseTo(three.lower.status === 'found' ? three.lower.frequencyHz : 0, 6);
    expect(result.curves.thirdOctave!.length).toBe(31);
  });

  it('passes phase through without smoothing, smooths it with complex averaging, drops it with power averaging', () => {
    const input: SpectrumInput = {
      frequenciesHz: [100, 200, 400, 800, 1600],
      magnitudeDb: [0, 0, 0, 0, 0],
      phaseDeg: [-30, -30, -30, -30, -30],
      magnitudeReference: 'db_relative',
    };
    const plain = analyzeSpectrum(input);
    expect(plain.curves.response.phaseDeg).toEqual([-30, -30, -30, -30, -30]);
    expect(plain.conventions.phase).toContain('supplied phase');
    const complex = analyzeSpectrum(input, { smoothing: { octaveFraction: 3, averaging: 'complex' } });
    complex.curves.response.phaseDeg!.forEach((phase) => expect(phase).toBeCloseTo(-30, 10));
    expect(analyzeSpectrum(input, { smoothing: { octaveFraction: 3 } }).curves.response.phaseDeg).toBeNull();
  });

  it('is JSON-clean and repeatable bit for bit', () => {
    const options = { smoothing: { octaveFraction: 3 }, normalisation: { kind: 'band_mean' as const, lowHz: 300, highHz: 3000 } };
    const first = JSON.stringify(analyzeSpectrum(woofer(), options));
    const second = JSON.stringify(analyzeSpectrum(woofer(), options));
    expect(first).toBe(second);
    const parsed = JSON.parse(first);
    expect(parsed.curves.response.magnitudeDb.length).toBe(241);
    expect(parsed.curves.response.magnitudeDb.every((level: unknown) => typeof level === 'number')).toBe(true);
  });
});
