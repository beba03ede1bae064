// Command-line options, read by node:util parseArgs in strict mode (unknown options and missing
// values are errors, never silently ignored). This wrapper keeps the project's messages and turns
// every such error into a UsageError (exit 2), and checks values limited to a list of choices.
import { parseArgs as nodeParseArgs, type ParseArgsConfig } from 'node:util';
import { UsageError } from './io';

export interface FlagSpec {
  /** Takes a value (`--format json` or `--format=json`). */
  value?: boolean;
  /** Allowed values, when limited. */
  choices?: string[];
  alias?: string;
}

export interface ParsedArgs {
  flags: Map<string, string | true>;
  positionals: string[];
}

/** The option as written in node's message ("Option '-f, --format <value>' ..." -> "--format"). */
function optionIn(message: string): string {
  const m = /'(?:-\w, )?(-{1,2}[^' <]+)/.exec(message);
  return m ? m[1] : message;
}

export function parseArgs(argv: string[], specs: Record<string, FlagSpec>): ParsedArgs {
  const options: NonNullable<ParseArgsConfig['options']> = {};
  for (const [name, s] of Object.entries(specs)) options[name] = { type: s.value ? 'string' : 'boolean', ...(s.alias ? { short: s.alias } : {}) };
  let parsed: { values: Record<string, string | boolean | undefined>; positionals: string[] };
  try {
    parsed = nodeParseArgs({ args: argv, options, strict: true, allowPositionals: true }) as typeof parsed;
  } catch (err) {
    const e = err as Error & { code?: string };
    const option = optionIn(e.message);
    const name = option.replace(/^-+/, '');
    const entry = Object.entries(specs).find(([n, s]) => n === name || s.alias === name);
    if (entry && e.code === 'ERR_PARSE_ARGS_INVALID_OPTION_VALUE') {
      throw new UsageError(entry[1].value ? `option --${entry[0]} needs a value` : `option --${entry[0]} takes no value`);
    }
    throw new UsageError(`unknown option "${option}"`);
  }
  const flags = new Map<string, string | true>();
  for (const [name, v] of Object.entries(parsed.values)) {
    if (v === undefined || v === false) continue;
    const choices = specs[name]?.choices;
    if (typeof v === 'string' && choices && !choices.includes(v)) throw new UsageError(`--${name} must be one of ${choices.join(', ')}, not "${v}"`);
    flags.set(name, v);
  }
  return { flags, positionals: parsed.positionals };
}
