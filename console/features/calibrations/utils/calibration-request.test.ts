import { describe, expect, it } from 'vitest';
import { calibrationRequestFromForm, type CalibrationFormValues } from './calibration-request';

const blank: CalibrationFormValues = {
  source: 'entered_dbfs',
  rigId: 'kb-line2-rig1',
  inputChannel: '0',
  validFrom: '',
  validUntil: '',
  notes: '',
  dbfsAtOnePascal: '',
  microphoneMillivoltsPerPascal: '',
  fullScaleVolts: '',
  fullScaleKind: 'rms',
  channel: '',
  statedLevelDbSpl: '94',
  statedFrequencyHz: '1000',
};

describe('calibration request from the form', () => {
  it('builds an entered dBFS request', () => {
    expect(calibrationRequestFromForm({ ...blank, dbfsAtOnePascal: '-38.25', notes: ' preamp 20 dB ' })).toEqual({
      ok: true,
      request: { source: 'entered_dbfs', rigId: 'kb-line2-rig1', inputChannel: 0, dbfsAtOnePascal: -38.25, notes: 'preamp 20 dB' },
    });
  });

  it('names the full scale by its kind for a microphone', () => {
    const result = calibrationRequestFromForm({ ...blank, source: 'entered_microphone', microphoneMillivoltsPerPascal: '12.5', fullScaleVolts: '2', fullScaleKind: 'peak' });
    expect(result).toEqual({
      ok: true,
      request: { source: 'entered_microphone', rigId: 'kb-line2-rig1', inputChannel: 0, microphoneMillivoltsPerPascal: 12.5, adcFullScaleVoltsPeak: 2 },
    });
  });

  it('gives a message per field: not a number, missing, out of the API range, bad rig id', () => {
    const result = calibrationRequestFromForm({ ...blank, rigId: 'rig one', inputChannel: '1.5x', dbfsAtOnePascal: '' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.inputChannel).toBe('Enter a number, such as -38.5.');
    expect(result.errors.dbfsAtOnePascal).toBe('This field is required.');
    expect(result.errors.rigId).toMatch(/letters, digits/);
    const loud = calibrationRequestFromForm({ ...blank, source: 'calibrator_capture', statedLevelDbSpl: '200' });
    expect(loud.ok || loud.errors.statedLevelDbSpl).toBe('Use a value of at most 174.');
    const micWithoutScale = calibrationRequestFromForm({ ...blank, source: 'entered_microphone', microphoneMillivoltsPerPascal: '12.5' });
    expect(micWithoutScale.ok || micWithoutScale.errors.fullScaleVolts).toBe('This field is required.');
  });

  it('refuses an end before the start', () => {
    const result = calibrationRequestFromForm({ ...blank, dbfsAtOnePascal: '-38', validFrom: '2026-06-01', validUntil: '2026-05-01' });
    expect(result.ok || result.errors.validUntil).toMatch(/on or after/);
  });
});
