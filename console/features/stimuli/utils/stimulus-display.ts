import { formatDb, formatFrequency } from '@console/components/charts/format-units';
import type { Stimulus } from '@shared/schemas/stimuli';
import { STIMULUS_TYPE_LABELS } from './stimulus-fields';

const numberParameter = (stimulus: Pick<Stimulus, 'parameters'>, name: string): number | undefined => {
  const value = stimulus.parameters[name];
  return typeof value === 'number' ? value : undefined;
};

/** "20 Hz → 20 kHz", "100 Hz → 10 kHz, 1/3 octave", "1 kHz": what the signal covers, from its stored parameters. */
export function stimulusRange(stimulus: Pick<Stimulus, 'type' | 'parameters'>): string {
  if (stimulus.type === 'calibrator_check') {
    const frequencyHz = numberParameter(stimulus, 'frequencyHz');
    return frequencyHz === undefined ? '—' : formatFrequency(frequencyHz);
  }
  const startHz = numberParameter(stimulus, 'startHz');
  const stopHz = numberParameter(stimulus, 'stopHz');
  const range = startHz === undefined || stopHz === undefined ? '—' : `${formatFrequency(startHz)} → ${formatFrequency(stopHz)}`;
  const bands = numberParameter(stimulus, 'bandsPerOctave');
  return stimulus.type === 'stepped_sine' && bands !== undefined ? `${range}, 1/${bands} octave` : range;
}

/** Peak level re full scale, with the typographic minus ("−20.0 dBFS"). */
export function stimulusLevel(stimulus: Pick<Stimulus, 'parameters'>): string {
  const levelDbfs = numberParameter(stimulus, 'levelDbfs');
  return levelDbfs === undefined ? '—' : formatDb(levelDbfs, { unit: 'dBFS' });
}

/** "3.10 s at 48 kHz". */
export function stimulusLength(stimulus: Pick<Stimulus, 'totalDurationSeconds' | 'sampleRateHz'>): string {
  return `${stimulus.totalDurationSeconds.toFixed(2)} s at ${formatFrequency(stimulus.sampleRateHz, 4)}`;
}

export function stimulusTitle(stimulus: Pick<Stimulus, 'name' | 'type' | 'id'>): string {
  return stimulus.name ?? `${STIMULUS_TYPE_LABELS[stimulus.type]} ${stimulus.id}`;
}
