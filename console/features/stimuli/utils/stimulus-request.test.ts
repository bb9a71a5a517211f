import { describe, expect, it } from 'vitest';
import { ApiProblem } from '@console/lib/api-problem';
import { buildStimulusRequest, defaultStimulusValues, stimulusErrorsFromProblem } from './stimulus-request';
import { stimulusLength, stimulusLevel, stimulusRange } from './stimulus-display';

describe('buildStimulusRequest', () => {
  it('sends the pre-filled sweep as the API schema wants it', () => {
    const built = buildStimulusRequest('sweep', ' KB-65 woofer sweep ', defaultStimulusValues('sweep'));
    expect(built).toEqual({
      ok: true,
      request: {
        type: 'sweep',
        name: 'KB-65 woofer sweep',
        parameters: { startHz: 20, stopHz: 20000, approximateDurationSeconds: 2, sampleRateHz: 48000, levelDbfs: -20 },
      },
    });
  });

  it('leaves empty optional fields out so the engine defaults apply, and reads decimal commas', () => {
    const values = { ...defaultStimulusValues('calibrator_check'), fadeSeconds: '0,02', leadingSilenceSeconds: '' };
    const built = buildStimulusRequest('calibrator_check', '', values);
    expect(built.ok && built.request).toEqual({
      type: 'calibrator_check',
      parameters: { frequencyHz: 1000, durationSeconds: 5, sampleRateHz: 48000, levelDbfs: -20, fadeSeconds: 0.02 },
    });
  });

  it('names each field that is missing or not a number', () => {
    const values = { ...defaultStimulusValues('stepped_sine'), startHz: '', stopHz: 'ten k', bandsPerOctave: '2.5' };
    const built = buildStimulusRequest('stepped_sine', '', values);
    expect(built.ok).toBe(false);
    expect(!built.ok && built.errors).toEqual({
      startHz: 'This field is required.',
      stopHz: 'Enter a number, such as 20 or 0.5.',
      bandsPerOctave: 'Enter a whole number.',
    });
  });
});

describe('stimulusErrorsFromProblem', () => {
  // RFC 6901 JSON Pointer: the engine's pointer "#/parameters/stopHz" names the parameter, not the wrapper.
  it('puts the engine’s message on the parameter it points at', () => {
    const problem = new ApiProblem({
      title: 'Invalid parameters',
      status: 422,
      code: 'invalid_parameters',
      errors: [
        { pointer: '#/parameters/stopHz', detail: 'stopHz must not exceed half the sample rate (24000 Hz).' },
        { pointer: '#/name', detail: 'Too long.' },
      ],
    });
    expect(stimulusErrorsFromProblem(problem)).toEqual({ stopHz: 'stopHz must not exceed half the sample rate (24000 Hz).', name: 'Too long.' });
    expect(stimulusErrorsFromProblem(new Error('offline'))).toEqual({});
  });
});

describe('stimulus display', () => {
  it('describes range, level and length from the stored parameters', () => {
    const sweep = { type: 'sweep' as const, parameters: { startHz: 20, stopHz: 20000, levelDbfs: -20 }, totalDurationSeconds: 3.1234, sampleRateHz: 48000 };
    expect(stimulusRange(sweep)).toBe('20 Hz → 20 kHz');
    expect(stimulusLevel(sweep)).toBe('\u221220.0 dBFS');
    expect(stimulusLength(sweep)).toBe('3.12 s at 48 kHz');
    expect(stimulusRange({ type: 'stepped_sine', parameters: { startHz: 100, stopHz: 10000, bandsPerOctave: 3 } })).toBe('100 Hz → 10 kHz, 1/3 octave');
    expect(stimulusRange({ type: 'calibrator_check', parameters: { frequencyHz: 1000 } })).toBe('1 kHz');
  });
});
