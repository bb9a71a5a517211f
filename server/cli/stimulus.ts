/**
 * Stimulus writer: `npm run stimulus -- --kind sweep|stepped|tone [options] out.wav` writes the stimulus WAV
 * regenerated from its parameters (bit-identical every time) and prints its description (design, cautions) as
 * JSON on stdout. The safety notes are also printed on stderr: read them before playing anything.
 */
import { writeFileSync } from 'node:fs';
import {
  designSteadyTone,
  designSteppedSine,
  designSynchronizedSweep,
  renderSteadyTone,
  renderSteppedSine,
  renderSweep,
  writeWav,
} from '@shared/dsp';
import { formatFlags, numberFlag, parseArgs, stringFlag, UsageError, type FlagSpec, type ParsedArgs } from './cli-args';
import { runCli } from './cli-run';
import {
  COMMON_STIMULUS_FLAGS,
  STEPPED_FLAGS,
  SWEEP_FLAGS,
  TONE_FLAGS,
  steppedParametersFromFlags,
  sweepParametersFromFlags,
  toneParametersFromFlags,
} from './stimulus-flags';

interface StimulusKind {
  name: string;
  summary: string;
  flags: FlagSpec[];
  build(args: ParsedArgs): { design: unknown; samples: Float64Array; cautions: string[] };
}

const KINDS: StimulusKind[] = [
  {
    name: 'sweep',
    summary: 'synchronized exponential sine sweep',
    flags: SWEEP_FLAGS,
    build: (args) => {
      const design = designSynchronizedSweep(sweepParametersFromFlags(args));
      return { design, samples: renderSweep(design), cautions: design.cautions };
    },
  },
  {
    name: 'stepped',
    summary: 'stepped-sine plan on a fractional-octave grid',
    flags: STEPPED_FLAGS,
    build: (args) => {
      const design = designSteppedSine(steppedParametersFromFlags(args));
      return { design, samples: renderSteppedSine(design), cautions: design.cautions };
    },
  },
  {
    name: 'tone',
    summary: 'steady calibrator-check tone',
    flags: TONE_FLAGS,
    build: (args) => {
      const design = designSteadyTone(toneParametersFromFlags(args));
      return { design, samples: renderSteadyTone(design), cautions: design.cautions };
    },
  },
];

const GENERAL_FLAGS: FlagSpec[] = [
  { name: 'kind', value: 'KIND', description: 'sweep | stepped | tone (default sweep)' },
  { name: 'encoding', value: 'ENC', description: 'float32 (default) | pcm24' },
  { name: 'channels', value: 'N', description: 'write the stimulus on N identical channels, e.g. 2 for drive + loopback (default 1)' },
  { name: 'help', description: 'show this help' },
];

function usage(): string {
  const kinds = KINDS.map((kind) => `Kind "${kind.name}": ${kind.summary}\n${formatFlags(kind.flags)}`).join('\n\n');
  return `Usage: npm run stimulus -- [--kind KIND] [options] out.wav\n\n${formatFlags(GENERAL_FLAGS)}\n\nStimulus options (all kinds):\n${formatFlags(COMMON_STIMULUS_FLAGS)}\n\n${kinds}\n`;
}

void runCli(() => {
  const argv = process.argv.slice(2);
  if (argv.includes('--help') || argv.length === 0) {
    process.stdout.write(usage());
    return;
  }
  const index = argv.findIndex((arg) => arg === '--kind' || arg.startsWith('--kind='));
  const name = index < 0 ? 'sweep' : argv[index].includes('=') ? argv[index].split('=')[1] : (argv[index + 1] ?? '');
  const kind = KINDS.find((k) => k.name === name);
  if (!kind) throw new UsageError(`Unknown --kind "${name}"; one of ${KINDS.map((k) => k.name).join(', ')}.`);
  const args = parseArgs(argv, [...GENERAL_FLAGS, ...COMMON_STIMULUS_FLAGS, ...kind.flags]);
  if (args.positionals.length !== 1) throw new UsageError('Give exactly one output WAV file (see --help).');
  const encoding = stringFlag(args, 'encoding') ?? 'float32';
  if (encoding !== 'float32' && encoding !== 'pcm24') throw new UsageError('--encoding must be float32 or pcm24.');
  const channelCount = numberFlag(args, 'channels') ?? 1;
  if (!Number.isInteger(channelCount) || channelCount < 1 || channelCount > 8) throw new UsageError('--channels must be an integer from 1 to 8.');
  const { design, samples, cautions } = kind.build(args);
  const sampleRateHz = (design as { sampleRateHz: number }).sampleRateHz;
  const channels = Array.from({ length: channelCount }, () => samples);
  writeFileSync(args.positionals[0], writeWav({ sampleRateHz, channels, encoding }));
  process.stderr.write(`Safety notes:\n${cautions.map((c) => `  - ${c}`).join('\n')}\n`);
  process.stdout.write(`${JSON.stringify({ file: args.positionals[0], encoding, channelCount, design }, null, 2)}\n`);
});
