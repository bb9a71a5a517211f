/**
 * Demo capture: `npx tsx server/cli/simulate-capture.ts <stimulus.wav> <capture.wav> [options]` passes channel 0 of
 * a stimulus WAV through the invented loudspeaker model (simulated-loudspeaker.ts) and writes a float32 capture
 * with the measurement on channel 0 and the loopback of the drive signal on channel 1, both behind the same
 * interface latency. Deterministic for a given seed.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { readWav, speedOfSoundMetresPerSecond, writeWav } from '@shared/dsp';
import { defined, formatFlags, numberFlag, parseArgs, UsageError, type FlagSpec } from './cli-args';
import { runCli } from './cli-run';
import { DEFAULT_MODEL, delayed, noise, simulateLoudspeaker } from './simulated-loudspeaker';

const FLAGS: FlagSpec[] = [
  { name: 'distance-m', value: 'M', description: 'microphone distance, sets the acoustic delay at 20 °C (default 1)' },
  { name: 'latency-ms', value: 'MS', description: 'interface latency on both channels (default 5)' },
  { name: 'noise-dbfs', value: 'DB', description: 'noise on the measurement channel, dBFS RMS (AES17) (default −85)' },
  { name: 'gain-db', value: 'DB', description: 'overall gain of the model (default −10)' },
  { name: 'second-harmonic', value: 'A2', description: 'a2 in x + a2·x² + a3·x³ before the filters (default 0)' },
  { name: 'third-harmonic', value: 'A3', description: 'a3 (default 0)' },
  { name: 'seed', value: 'N', description: 'noise seed (default 1)' },
  { name: 'help', description: 'show this help' },
];

void runCli(() => {
  const argv = process.argv.slice(2);
  if (argv.includes('--help') || argv.length === 0) {
    process.stdout.write(`Usage: npx tsx server/cli/simulate-capture.ts <stimulus.wav> <capture.wav> [options]\n\n${formatFlags(FLAGS)}\n`);
    return;
  }
  const args = parseArgs(argv, FLAGS);
  if (args.positionals.length !== 2) throw new UsageError('Give the stimulus WAV and the capture WAV to write.');
  const stimulus = readWav(new Uint8Array(readFileSync(args.positionals[0])));
  const fs = stimulus.sampleRateHz;
  const distance = numberFlag(args, 'distance-m') ?? 1;
  const model = {
    ...DEFAULT_MODEL,
    ...defined({
      gainDb: numberFlag(args, 'gain-db'),
      secondHarmonic: numberFlag(args, 'second-harmonic'),
      thirdHarmonic: numberFlag(args, 'third-harmonic'),
    }),
    acousticDelaySeconds: distance / speedOfSoundMetresPerSecond(20),
  };
  const latency = Math.round(((numberFlag(args, 'latency-ms') ?? 5) / 1000) * fs);
  const drive = stimulus.channels[0];
  const acoustic = simulateLoudspeaker(drive, fs, model);
  const hiss = noise(drive.length, numberFlag(args, 'noise-dbfs') ?? -85, numberFlag(args, 'seed') ?? 1);
  const measurement = delayed(acoustic, latency).map((v, n) => v + hiss[n]);
  const loopback = delayed(drive, latency);
  writeFileSync(args.positionals[1], writeWav({ sampleRateHz: fs, channels: [measurement, loopback], encoding: 'float32' }));
  process.stdout.write(
    `${JSON.stringify({ file: args.positionals[1], channels: { measurement: 0, loopback: 1 }, model, interfaceLatencySamples: latency }, null, 2)}\n`,
  );
});
