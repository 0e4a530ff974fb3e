/**
 * Argument parsing: `<command> <file> [--flag value | --flag=value | --switch]`, in any order.
 * A switch (SWITCHES) never takes the word after it, so `check --sweep plan.json` reads the file.
 */
import { CliError } from './errors.js';

export interface ParsedArgs {
  command: string | null;
  positionals: string[];
  flags: Map<string, string | true>;
}

/** Options that are on or off and take no value. Every other option takes one. */
export const SWITCHES: ReadonlySet<string> = new Set(['sweep', 'preview', 'yes', 'list']);

export function parseArgs(argv: readonly string[]): ParsedArgs {
  const positionals: string[] = [];
  const flags = new Map<string, string | true>();
  let command: string | null = null;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i]!;
    if (a === '-h' || a === '--help') {
      flags.set('help', true);
    } else if (a.startsWith('--')) {
      const eq = a.indexOf('=');
      if (eq > 2) flags.set(a.slice(2, eq), a.slice(eq + 1));
      else {
        const next = argv[i + 1];
        if (!SWITCHES.has(a.slice(2)) && next !== undefined && !next.startsWith('--')) {
          flags.set(a.slice(2), next);
          i++;
        } else flags.set(a.slice(2), true);
      }
    } else if (command === null) command = a;
    else positionals.push(a);
  }
  return { command, positionals, flags };
}

/** Refuse flags the command does not know, so a typo is not silently ignored. */
export function onlyFlags(args: ParsedArgs, allowed: readonly string[]): void {
  for (const name of args.flags.keys()) {
    if (name !== 'help' && !allowed.includes(name)) {
      throw new CliError(`--${name}: not an option of "${args.command}". Run with --help to see the options.`);
    }
  }
}

/** A switch: false when absent, true when given; `--sweep=yes` is refused (a switch takes no value). */
export function switchFlag(args: ParsedArgs, name: string): boolean {
  const v = args.flags.get(name);
  if (v === undefined) return false;
  if (v !== true) throw new CliError(`--${name}: a switch, it takes no value; write --${name} alone, not --${name}=${v}.`);
  return true;
}

/** A whole-number flag within [min, max], or the default when absent. */
export function intFlag(args: ParsedArgs, name: string, min: number, max: number, fallback: number | null): number | null {
  const v = args.flags.get(name);
  if (v === undefined) return fallback;
  if (v === true) throw new CliError(`--${name}: give a number after it.`);
  const n = Number(v);
  if (!Number.isInteger(n) || n < min || n > max) throw new CliError(`--${name}: must be a whole number from ${min} to ${max}, not "${v}".`);
  return n;
}

/** A positive number flag, required. */
export function numberFlag(args: ParsedArgs, name: string): number {
  const v = args.flags.get(name);
  if (v === undefined || v === true) throw new CliError(`--${name}: this option is required and needs a number.`);
  const n = Number(v);
  if (!Number.isFinite(n) || !(n > 0)) throw new CliError(`--${name}: must be a number above zero, not "${v}".`);
  return n;
}

export function choiceFlag<T extends string>(args: ParsedArgs, name: string, choices: readonly T[], fallback: T | null): T {
  const v = args.flags.get(name);
  if (v === undefined) {
    if (fallback !== null) return fallback;
    throw new CliError(`--${name}: this option is required; use one of ${choices.join(', ')}.`);
  }
  if (v === true || !choices.includes(v as T)) throw new CliError(`--${name}: use one of ${choices.join(', ')}${v === true ? '' : `, not "${v}"`}.`);
  return v as T;
}

export function onePositional(args: ParsedArgs, what: string): string {
  if (args.positionals.length === 0) throw new CliError(`${args.command}: give the ${what} to read, for example: npm run cli -- ${args.command} my-file.json`);
  if (args.positionals.length > 1) throw new CliError(`${args.command}: expected one file, got ${args.positionals.length} (${args.positionals.join(', ')}).`);
  return args.positionals[0]!;
}
