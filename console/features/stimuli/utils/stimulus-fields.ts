import type { StimulusType } from '@shared/schemas/stimuli';

/** One numeric parameter of a stimulus form; `defaultValue` pre-fills required fields only. */
export type ParameterField = {
  name: string;
  label: string;
  unit?: string;
  hint?: string;
  required: boolean;
  integer?: boolean;
  defaultValue?: string;
  /** Folded under "More settings": the engine's defaults suit most rigs. */
  advanced?: boolean;
  /** A fixed list of choices instead of free input. */
  options?: readonly string[];
};

const SAMPLE_RATES_HZ = ['44100', '48000', '88200', '96000', '192000'] as const;

const sampleRate: ParameterField = { name: 'sampleRateHz', label: 'Sample rate', unit: 'Hz', required: true, integer: true, defaultValue: '48000', options: SAMPLE_RATES_HZ, hint: 'The rate the rig plays and records at.' };
const level: ParameterField = { name: 'levelDbfs', label: 'Peak level', unit: 'dBFS', required: true, defaultValue: '-20', hint: 'At most 0 dBFS. Start low and raise it step by step.' };
const leadingSilence: ParameterField = { name: 'leadingSilenceSeconds', label: 'Silence before', unit: 's', required: false, advanced: true, hint: 'Default 0.1 s.' };

export const STIMULUS_TYPE_LABELS: Record<StimulusType, string> = {
  sweep: 'Exponential sweep',
  stepped_sine: 'Stepped-sine plan',
  calibrator_check: 'Calibrator check tone',
};

export const STIMULUS_TYPE_SUMMARIES: Record<StimulusType, string> = {
  sweep: 'Synchronized exponential sweep for frequency response and harmonic distortion in one pass.',
  stepped_sine: 'One steady sine per fractional-octave band, each settled before it is analysed.',
  calibrator_check: 'A steady tone for checking the chain or setting a drive level.',
};

export const STIMULUS_FIELDS: Record<StimulusType, ParameterField[]> = {
  sweep: [
    { name: 'startHz', label: 'Start frequency', unit: 'Hz', required: true, defaultValue: '20' },
    { name: 'stopHz', label: 'Stop frequency', unit: 'Hz', required: true, defaultValue: '20000', hint: 'At most half the sample rate.' },
    { name: 'approximateDurationSeconds', label: 'Duration', unit: 's', required: true, defaultValue: '2', hint: '0.1–600 s; the synchronized length differs slightly.' },
    sampleRate,
    level,
    { name: 'fadeInSeconds', label: 'Fade-in', unit: 's', required: false, advanced: true, hint: 'Default min(2/f1, T/10).' },
    { name: 'fadeOutSeconds', label: 'Fade-out', unit: 's', required: false, advanced: true, hint: 'Default min(5 ms, T/10).' },
    leadingSilence,
    { name: 'trailingSilenceSeconds', label: 'Silence after', unit: 's', required: false, advanced: true, hint: 'Default 1 s; leave room for the decay.' },
  ],
  stepped_sine: [
    { name: 'startHz', label: 'Lowest band', unit: 'Hz', required: true, defaultValue: '100' },
    { name: 'stopHz', label: 'Highest band', unit: 'Hz', required: true, defaultValue: '10000' },
    { name: 'bandsPerOctave', label: 'Bands per octave', required: true, integer: true, defaultValue: '3', options: ['1', '2', '3', '6', '12', '24'], hint: 'IEC 61260-1 base-10 mid-band frequencies.' },
    sampleRate,
    level,
    { name: 'settleSeconds', label: 'Settle time', unit: 's', required: false, advanced: true, hint: 'Minimum per step. Default 0.05 s.' },
    { name: 'settleCycles', label: 'Settle cycles', required: false, advanced: true, hint: 'Minimum periods per step. Default 10.' },
    { name: 'analysisSeconds', label: 'Analysis window', unit: 's', required: false, advanced: true, hint: 'Default 0.1 s.' },
    { name: 'analysisCycles', label: 'Analysis cycles', required: false, integer: true, advanced: true, hint: 'Whole cycles analysed. Default 20.' },
    { name: 'rampSeconds', label: 'Ramp', unit: 's', required: false, advanced: true, hint: 'At each step start and end. Default 5 ms.' },
    { name: 'gapSeconds', label: 'Gap between steps', unit: 's', required: false, advanced: true, hint: 'Default 0.' },
    leadingSilence,
    { name: 'trailingSilenceSeconds', label: 'Silence after', unit: 's', required: false, advanced: true, hint: 'Default 0.2 s.' },
  ],
  calibrator_check: [
    { name: 'frequencyHz', label: 'Frequency', unit: 'Hz', required: true, defaultValue: '1000' },
    { name: 'durationSeconds', label: 'Duration', unit: 's', required: true, defaultValue: '5', hint: '0.1–600 s.' },
    sampleRate,
    level,
    { name: 'fadeSeconds', label: 'Fades', unit: 's', required: false, advanced: true, hint: 'Default 10 ms.' },
    leadingSilence,
    { name: 'trailingSilenceSeconds', label: 'Silence after', unit: 's', required: false, advanced: true, hint: 'Default 0.1 s.' },
  ],
};
