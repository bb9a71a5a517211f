import { resolveSteppedResponseOptions, resolveSweepResponseOptions, type SpectrumInput } from '@shared/dsp';
import { spectrumInputToCurve } from '@shared/dsp/analyses/spectrum-input';
import { resolveSpectrumOptions } from '@shared/dsp/analyses/spectrum-options';
import { resolveSweepDistortionOptions } from '@shared/dsp/distortion/sweep-options';
import { resolveToneOptions } from '@shared/dsp/distortion/tone-options';
import type { CreateAnalysisRequest } from '@shared/schemas/analyses';
import type { StimulusType } from '@shared/schemas/stimuli';
import { invalidField } from '@server/http/api-problem';
import { ApiProblem } from '@server/http/api-problem';
import { jsonPointer } from '@server/http/validation';
import {
  responseAndDistortionOptions,
  spectrumOptions,
  steppedResponseOptions,
  sweepDistortionOptions,
  sweepResponseOptions,
  toneDistortionOptions,
} from '@server/jobs/engine/engine-options';
import type { AnalysisJobSpec } from '@server/jobs/engine/job-spec';
import { withEngineErrors } from './engine-problem';

const SWEEP_KINDS = new Set(['frequency_response', 'distortion', 'response_and_distortion']);

/** Engine option paths → the request members they came from, so pointers name what the client sent. */
function toRequestPath(segments: string[]): string[] {
  const [head, second, ...rest] = segments;
  if (head !== 'options') return segments;
  const tail = second === 'response' || second === 'distortion' ? rest : [second, ...rest];
  const scope = second === 'response' || second === 'distortion' ? ['options', second] : ['options'];
  const [name, ...deeper] = tail;
  if (name === 'measurementChannel' || name === 'channel') return ['channels', 'measurement'];
  if (name === 'referenceChannel' || name === 'loopbackChannel') return ['channels', 'reference'];
  if (name === 'gate') return ['conditions', 'gate', ...deeper];
  if (name === 'calibration') return ['calibration'];
  if (name === 'conditions') {
    const renamed: Record<string, string> = { distanceMetres: 'distanceM', driveVoltageRms: 'driveVoltageVrms', temperatureCelsius: 'temperatureC', nominalImpedanceOhms: 'nominalImpedanceOhm' };
    const [field, ...more] = deeper;
    return field && renamed[field] ? ['conditions', renamed[field], ...more] : ['options', ...scope.slice(1), 'conditions', ...deeper];
  }
  return [...scope, ...tail];
}

function mismatch(pointer: string[], detail: string): ApiProblem {
  return new ApiProblem('analysis_input_mismatch', detail, { errors: [{ in: 'body', pointer: jsonPointer(pointer), detail }] });
}

export interface CaptureFacts {
  sampleRateHz: number;
  channelCount: number;
  durationSeconds: number;
}

function requireStimulusType(spec: AnalysisJobSpec, allowed: StimulusType, what: string) {
  if (!spec.stimulus) throw invalidField('#/stimulusId', `${what} needs a ${allowed} stimulus: give stimulusId or stimulus.`);
  if (spec.stimulus.type !== allowed) throw mismatch(['stimulus', 'type'], `${what} needs a ${allowed} stimulus, not ${spec.stimulus.type}.`);
}

function checkChannels(spec: AnalysisJobSpec, capture: CaptureFacts) {
  const { measurement, reference } = spec.channels;
  if (measurement >= capture.channelCount) {
    throw mismatch(['channels', 'measurement'], `Channel ${measurement} does not exist: the capture has ${capture.channelCount} channel(s), numbered from 0.`);
  }
  if (reference !== null && reference >= capture.channelCount) {
    throw mismatch(['channels', 'reference'], `Channel ${reference} does not exist: the capture has ${capture.channelCount} channel(s), numbered from 0.`);
  }
  if (reference !== null && reference === measurement) throw mismatch(['channels', 'reference'], 'The reference channel must differ from the measurement channel.');
}

function checkSampleRate(spec: AnalysisJobSpec, capture: CaptureFacts, stimulusPointer: string[]) {
  const stimulusRate = spec.stimulus?.parameters.sampleRateHz;
  if (stimulusRate !== undefined && stimulusRate !== capture.sampleRateHz) {
    throw mismatch(stimulusPointer, `The stimulus runs at ${String(stimulusRate)} Hz but the capture at ${capture.sampleRateHz} Hz; record at the stimulus rate or define the stimulus at the capture's rate.`);
  }
}

/** The tone options as the engine will read them (segments are checked against the samples when the job runs). */
function checkToneOptions(spec: AnalysisJobSpec, capture: CaptureFacts, calibration: { id: string; dbfsAtOnePascal: number; expired: boolean } | null) {
  const options = toneDistortionOptions(spec, calibration);
  resolveToneOptions(options, 'options', ['toneFrequencyHz', 'analysisSegment', 'silentSegment']);
  const toneFrequencyHz = options.toneFrequencyHz;
  if (toneFrequencyHz !== undefined && !(typeof toneFrequencyHz === 'number' && toneFrequencyHz > 0 && toneFrequencyHz < capture.sampleRateHz / 2)) {
    throw invalidField('#/options/toneFrequencyHz', `options.toneFrequencyHz must lie between 0 and ${capture.sampleRateHz / 2} Hz (half the capture's sample rate).`);
  }
}

/**
 * Everything checkable before the job runs: kind requirements, channels, sample rates and every engine option
 * (through the engine's own option resolvers). Throws 400/422 problems with pointers into the request.
 */
export function validateAnalysisSpec(
  request: CreateAnalysisRequest,
  spec: AnalysisJobSpec,
  capture: CaptureFacts | null,
  stimulusPointer: string[],
): void {
  const kind = spec.kind;
  if (kind === 'spectrum') {
    if (!request.spectrum) throw invalidField('#/spectrum', 'Kind spectrum needs `spectrum` (frequenciesHz, magnitudeDb, magnitudeReference).');
    if (capture) throw invalidField('#/captureId', 'Kind spectrum takes a JSON spectrum, not a capture.');
    withEngineErrors(() => {
      spectrumInputToCurve(request.spectrum as SpectrumInput, 'spectrum');
      resolveSpectrumOptions(spectrumOptions(spec), 'options');
    }, { rewrite: toRequestPath });
    return;
  }
  if (!capture) throw invalidField('#/captureId', `Kind ${kind} needs a capture: give captureId or upload the file in the part "file".`);
  checkChannels(spec, capture);
  if (request.conditions?.environment === 'gated' && !request.conditions.gate) {
    throw invalidField('#/conditions/gate', 'environment "gated" needs conditions.gate.lengthSeconds.');
  }
  const fakeCalibration = request.calibration ? { id: 'pending', dbfsAtOnePascal: -30, expired: false } : null;
  if (SWEEP_KINDS.has(kind) || (kind === 'sensitivity' && request.sensitivity?.deviceType !== 'microphone')) {
    requireStimulusType(spec, 'sweep', `Kind ${kind}`);
    checkSampleRate(spec, capture, stimulusPointer);
  }
  withEngineErrors(
    () => {
      if (kind === 'frequency_response' || kind === 'sensitivity') {
        if (kind === 'frequency_response' || request.sensitivity?.deviceType !== 'microphone') {
          resolveSweepResponseOptions(sweepResponseOptions(spec, spec.options, fakeCalibration), capture.channelCount, 'options');
        }
      } else if (kind === 'distortion') {
        resolveSweepDistortionOptions(sweepDistortionOptions(spec, spec.options), capture.channelCount, 'options');
      } else if (kind === 'response_and_distortion') {
        const options = responseAndDistortionOptions(spec, fakeCalibration);
        const unknown = Object.keys(spec.options).filter((key) => key !== 'response' && key !== 'distortion');
        if (unknown.length) throw invalidField(`#/options/${unknown[0]}`, 'response_and_distortion takes options.response and options.distortion only.');
        resolveSweepResponseOptions(options.response, capture.channelCount, 'options.response');
        resolveSweepDistortionOptions(options.distortion, capture.channelCount, 'options.distortion');
      } else if (kind === 'stepped_sine') {
        resolveSteppedResponseOptions(steppedResponseOptions(spec, fakeCalibration), capture.channelCount, 'options');
      } else if (kind === 'tone_distortion') {
        checkToneOptions(spec, capture, fakeCalibration);
      }
    },
    { rewrite: toRequestPath },
  );
  if (kind === 'tone_distortion') {
    if (spec.stimulus) {
      requireStimulusType(spec, 'calibrator_check', 'Kind tone_distortion');
      checkSampleRate(spec, capture, stimulusPointer);
    }
    if (request.mask) throw invalidField('#/mask', 'Kind tone_distortion has no frequency-response curve to judge against a mask.');
  }
  if (kind === 'stepped_sine') {
    requireStimulusType(spec, 'stepped_sine', 'Kind stepped_sine');
    checkSampleRate(spec, capture, stimulusPointer);
  }
  if (kind === 'calibrator' && !request.calibrator) throw invalidField('#/calibrator', 'Kind calibrator needs calibrator.statedLevelDbSpl.');
  if (kind === 'sensitivity') {
    const sensitivity = request.sensitivity;
    if (!sensitivity) throw invalidField('#/sensitivity', 'Kind sensitivity needs sensitivity.deviceType.');
    if (sensitivity.deviceType === 'microphone') {
      if (sensitivity.statedLevelDbSpl === undefined) throw invalidField('#/sensitivity/statedLevelDbSpl', 'Microphone sensitivity needs the calibrator\'s stated level.');
      if (sensitivity.adcFullScaleVoltsRms === undefined) throw invalidField('#/sensitivity/adcFullScaleVoltsRms', 'Microphone sensitivity needs the ADC full-scale voltage (RMS of a full-scale sine).');
    } else {
      if (!request.calibration) throw invalidField('#/calibration', `${sensitivity.deviceType} sensitivity is in dB SPL: name a calibration or a rig input.`);
      if (request.conditions?.driveVoltageVrms === undefined) throw invalidField('#/conditions/driveVoltageVrms', 'Sensitivity needs the drive voltage at the terminals.');
      if (request.conditions?.nominalImpedanceOhm === undefined) throw invalidField('#/conditions/nominalImpedanceOhm', 'Sensitivity needs the nominal impedance.');
      const [low, high] = sensitivity.bandHz ?? [300, 3000];
      if (!(high > low)) throw invalidField('#/sensitivity/bandHz', 'bandHz must be [lowHz, highHz] with lowHz < highHz.');
    }
  }
}
