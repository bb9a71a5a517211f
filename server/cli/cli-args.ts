/**
 * A small, strict command-line parser for the offline tools: `--name value`, `--name=value` and boolean
 * `--flag`s, declared up front so a typo is an error instead of a silently ignored option.
 */
export interface FlagSpec {
  name: string;
  /** Placeholder of the value (e.g. "HZ"); absent for a boolean flag. */
  value?: string;
  description: string;
}

export class UsageError extends Error {}

export interface ParsedArgs {
  flags: Map<string, string | true>;
  positionals: string[];
}

export function parseArgs(argv: readonly string[], specs: readonly FlagSpec[]): ParsedArgs {
  const byName = new Map(specs.map((spec) => [spec.name, spec]));
  const flags = new Map<string, string | true>();
  const positionals: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (!arg.startsWith('--')) {
      positionals.push(arg);
      continue;
    }
    const [rawName, inlineValue] = arg.slice(2).split(/=(.*)/s, 2);
    const spec = byName.get(rawName);
    if (!spec) throw new UsageError(`Unknown option --${rawName} (see --help).`);
    if (flags.has(rawName)) throw new UsageError(`Option --${rawName} is given twice.`);
    if (!spec.value) {
      if (inlineValue !== undefined) throw new UsageError(`Option --${rawName} takes no value.`);
      flags.set(rawName, true);
      continue;
    }
    const value = inlineValue ?? argv[++i];
    if (value === undefined) throw new UsageError(`Option --${rawName} needs a value (${spec.value}).`);
    flags.set(rawName, value);
  }
  return { flags, positionals };
}

/** Value of `--name` as a number, or undefined when absent. */
export function numberFlag(args: ParsedArgs, name: string): number | undefined {
  const value = args.flags.get(name);
  if (value === undefined) return undefined;
  const n = typeof value === 'string' && value.trim() !== '' ? Number(value) : Number.NaN;
  if (!Number.isFinite(n)) throw new UsageError(`Option --${name} needs a number, got "${String(value)}".`);
  return n;
}

export function requiredNumberFlag(args: ParsedArgs, name: string): number {
  const n = numberFlag(args, name);
  if (n === undefined) throw new UsageError(`Option --${name} is required.`);
  return n;
}

export function stringFlag(args: ParsedArgs, name: string): string | undefined {
  const value = args.flags.get(name);
  return typeof value === 'string' ? value : undefined;
}

export function hasFlag(args: ParsedArgs, name: string): boolean {
  return args.flags.get(name) === true;
}

/** Drop undefined values so engine defaults apply (and unknown-key checks see only what was given). */
export function defined<T extends Record<string, unknown>>(object: T): Partial<T> {
  return Object.fromEntries(Object.entries(object).filter(([, value]) => value !== undefined)) as Partial<T>;
}

export function formatFlags(specs: readonly FlagSpec[]): string {
  const rows = specs.map((spec) => [`--${spec.name}${spec.value ? ` ${spec.value}` : ''}`, spec.description]);
  const width = Math.max(...rows.map(([left]) => left.length)) + 2;
  return rows.map(([left, right]) => `  ${left.padEnd(width)}${right}`).join('\n');
}
