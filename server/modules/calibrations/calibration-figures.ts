import { analyzeCalibratorCapture, dbFromAmplitudeRatio, isEngineError, microphoneSensitivity, type EngineWarning } from '@shared/dsp';
import type { CreateCalibrationRequest } from '@shared/schemas/calibrations';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';
import { problemFromEngineError } from '@server/modules/analyses/engine-problem';
import { loadCaptureChannels } from '@server/modules/captures/captures.service';

export interface CalibrationFigures {
  dbfsAtOnePascal: number;
  details: Record<string, unknown>;
  warnings: EngineWarning[];
}

/** Engine field names → request members, so a refusal points at what the caller sent. */
function rewriteCalibratorField(segments: string[]): string[] {
  const name = segments.at(-1) ?? '';
  if (['statedLevelDbSpl', 'statedFrequencyHz', 'channel'].includes(name)) return [name];
  return ['captureId'];
}

async function fromCalibratorCapture(
  deps: AppDeps,
  orgId: string,
  input: Extract<CreateCalibrationRequest, { source: 'calibrator_capture' }>,
): Promise<CalibrationFigures> {
  const { capture, wav } = await loadCaptureChannels(deps, orgId, input.captureId).catch((error: unknown) => {
    if (error instanceof ApiProblem && error.code === 'not_found') {
      throw new ApiProblem('not_found', 'No capture with this id exists in the active organisation.', {
        errors: [{ in: 'body', pointer: '#/captureId', detail: 'Upload the calibrator capture first (POST /v1/captures).' }],
      });
    }
    throw error;
  });
  try {
    const result = analyzeCalibratorCapture(
      { channels: wav.channels, sampleRateHz: wav.sampleRateHz },
      { channel: input.channel, statedLevelDbSpl: input.statedLevelDbSpl, statedFrequencyHz: input.statedFrequencyHz },
    );
    const f = result.figures;
    return {
      dbfsAtOnePascal: f.chainSensitivityDbfsAtOnePascal,
      details: {
        captureId: capture.id,
        channel: f.channel,
        statedLevelDbSpl: f.statedLevelDbSpl,
        statedFrequencyHz: f.statedFrequencyHz,
        measuredFrequencyHz: f.measuredFrequencyHz,
        toneLevelDbfs: f.toneLevelDbfs,
        levelStabilityDb: f.levelStabilityDb,
        signalToNoiseDb: f.signalToNoiseDb,
        method: f.method,
        engineVersion: result.engineVersion,
      },
      warnings: result.warnings,
    };
  } catch (error) {
    if (isEngineError(error)) throw problemFromEngineError(error, { code: 'calibration_invalid', rewrite: rewriteCalibratorField });
    throw error;
  }
}

/**
 * dBFS at 1 Pa from a microphone sensitivity M (V/Pa) and the converter's full scale: a 1 Pa tone gives M volts
 * RMS, which reads 20·log10(M / V_FS,rms) dBFS (AES17: full-scale sine = 0 dBFS, so V_FS,rms = V_FS,peak/√2).
 */
function fromMicrophone(input: Extract<CreateCalibrationRequest, { source: 'entered_microphone' }>): CalibrationFigures {
  const hasRms = input.adcFullScaleVoltsRms !== undefined;
  if (hasRms === (input.adcFullScaleVoltsPeak !== undefined)) {
    throw new ApiProblem('validation_failed', 'Give exactly one of adcFullScaleVoltsRms or adcFullScaleVoltsPeak.', {
      errors: [{ in: 'body', pointer: '#/adcFullScaleVoltsRms', detail: 'Give exactly one of adcFullScaleVoltsRms or adcFullScaleVoltsPeak.' }],
    });
  }
  const fullScaleVoltsRms = hasRms ? input.adcFullScaleVoltsRms! : input.adcFullScaleVoltsPeak! / Math.SQRT2;
  const dbfsAtOnePascal = dbFromAmplitudeRatio(input.microphoneMillivoltsPerPascal / 1000 / fullScaleVoltsRms);
  // The engine's own direction (dBFS reading → mV/Pa) as a cross-check of the conversion above.
  const check = microphoneSensitivity({
    toneLevelDbfs: dbfsAtOnePascal,
    statedLevelDbSpl: 20 * Math.log10(1 / 20e-6),
    ...(hasRms ? { adcFullScaleVoltsRms: input.adcFullScaleVoltsRms! } : { adcFullScaleVoltsPeak: input.adcFullScaleVoltsPeak! }),
  });
  if (Math.abs(check.millivoltsPerPascal - input.microphoneMillivoltsPerPascal) > 1e-9 * input.microphoneMillivoltsPerPascal) {
    throw new Error('microphone sensitivity conversion disagrees with the engine');
  }
  return {
    dbfsAtOnePascal,
    details: {
      microphoneMillivoltsPerPascal: input.microphoneMillivoltsPerPascal,
      dbvPerPascal: check.dbvPerPascal,
      ...(hasRms ? { adcFullScaleVoltsRms: input.adcFullScaleVoltsRms } : { adcFullScaleVoltsPeak: input.adcFullScaleVoltsPeak }),
      fullScaleConvention: check.fullScaleConvention,
    },
    warnings: [],
  };
}

/** The chain sensitivity a calibration request gives, and how it was obtained. */
export async function calibrationFigures(deps: AppDeps, orgId: string, input: CreateCalibrationRequest): Promise<CalibrationFigures> {
  switch (input.source) {
    case 'calibrator_capture':
      return fromCalibratorCapture(deps, orgId, input);
    case 'entered_microphone':
      return fromMicrophone(input);
    case 'entered_dbfs':
      return { dbfsAtOnePascal: input.dbfsAtOnePascal, details: { dbfsAtOnePascal: input.dbfsAtOnePascal }, warnings: [] };
  }
}
