/**
 * Offline analysis: `npm run analyze -- <capture.wav> --kind <kind> [options]` prints the result JSON (the same
 * shape the API returns) on stdout. `--help` lists the kinds and their options.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { readWav } from '@shared/dsp';
import { ANALYSIS_KINDS } from './analysis-kinds';
import { formatFlags, hasFlag, parseArgs, stringFlag, UsageError, type FlagSpec } from './cli-args';
import { runCli } from './cli-run';

const GENERAL_FLAGS: FlagSpec[] = [
  { name: 'kind', value: 'KIND', description: `analysis kind: ${ANALYSIS_KINDS.map((k) => k.name).join(' | ')} (default response)` },
  { name: 'out', value: 'FILE', description: 'write the JSON to FILE instead of stdout' },
  { name: 'pretty', description: 'indent the JSON' },
  { name: 'help', description: 'show this help' },
];

function usage(): string {
  const kinds = ANALYSIS_KINDS.map((kind) => `Kind "${kind.name}": ${kind.summary}\n${formatFlags(kind.flags)}`).join('\n\n');
  return `Usage: npm run analyze -- <capture.wav> [--kind KIND] [options]\n\n${formatFlags(GENERAL_FLAGS)}\n\n${kinds}\n`;
}

function kindName(argv: readonly string[]): string {
  const index = argv.findIndex((arg) => arg === '--kind' || arg.startsWith('--kind='));
  if (index < 0) return 'response';
  return argv[index].includes('=') ? argv[index].split('=')[1] : (argv[index + 1] ?? '');
}

void runCli(() => {
  const argv = process.argv.slice(2);
  if (argv.includes('--help') || argv.length === 0) {
    process.stdout.write(usage());
    return;
  }
  const name = kindName(argv);
  const kind = ANALYSIS_KINDS.find((k) => k.name === name);
  if (!kind) throw new UsageError(`Unknown --kind "${name}"; one of ${ANALYSIS_KINDS.map((k) => k.name).join(', ')}.`);
  const args = parseArgs(argv, [...GENERAL_FLAGS, ...kind.flags]);
  if (args.positionals.length !== 1) throw new UsageError('Give exactly one capture WAV file (see --help).');
  const capture = readWav(new Uint8Array(readFileSync(args.positionals[0])));
  const result = kind.run(capture, args);
  const json = `${JSON.stringify(result, null, hasFlag(args, 'pretty') ? 2 : undefined)}\n`;
  const out = stringFlag(args, 'out');
  if (out) writeFileSync(out, json);
  else process.stdout.write(json);
});
