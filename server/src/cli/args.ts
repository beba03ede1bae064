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
  /** The last value of each flag (or true for a flag without a value). */
  flags: Map<string, string | true>;
  /** Every value of each flag that takes one, in order, for options that may be repeated. */
  lists: Map<string, string[]>;
  positionals: string[];
}

/** The option as written in node's message ("Option '-f, --format <value>' ..." -> "--format"). */
function optionIn(message: string): string {
  const m = /'(?:-\w, )?(-{1,2}[^' <]+)/.exec(message);
  return m ? m[1] : message;
}

/**
 * node's reader takes no value that starts with "-" after a separate option (`--max-warnings -1`
 * is "ambiguous"); such a value that names no option is joined to its option (`--max-warnings=-1`),
 * so the command's own check words the problem.
 */
function joinDashValues(argv: string[], specs: Record<string, FlagSpec>): string[] {
  const named = (t: string) => Object.entries(specs).find(([n, s]) => t === `--${n}` || (s.alias !== undefined && t === `-${s.alias}`));
  const isOption = (t: string) => Object.entries(specs).some(([n, s]) => t === `--${n}` || t.startsWith(`--${n}=`) || (s.alias !== undefined && t === `-${s.alias}`));
  const out: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const spec = named(argv[i]);
    const next = argv[i + 1];
    if (spec?.[1].value && next !== undefined && next.startsWith('-') && next !== '-' && next !== '--' && !isOption(next)) {
      out.push(`--${spec[0]}=${next}`);
      i++;
    } else out.push(argv[i]);
  }
  return out;
}

export function parseArgs(argv: string[], specs: Record<string, FlagSpec>): ParsedArgs {
  const options: NonNullable<ParseArgsConfig['options']> = {};
  // String options are read as lists so an option given twice keeps every value (`--records a --records b`).
  for (const [name, s] of Object.entries(specs)) options[name] = { type: s.value ? 'string' : 'boolean', ...(s.value ? { multiple: true } : {}), ...(s.alias ? { short: s.alias } : {}) };
  let parsed: { values: Record<string, string[] | boolean | undefined>; positionals: string[] };
  try {
    parsed = nodeParseArgs({ args: joinDashValues(argv, specs), options, strict: true, allowPositionals: true }) as typeof parsed;
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
  const lists = new Map<string, string[]>();
  for (const [name, v] of Object.entries(parsed.values)) {
    if (v === undefined || v === false) continue;
    if (v === true) {
      flags.set(name, true);
      continue;
    }
    const choices = specs[name]?.choices;
    for (const one of v) if (choices && !choices.includes(one)) throw new UsageError(`--${name} must be one of ${choices.join(', ')}, not "${one}"`);
    flags.set(name, v[v.length - 1]);
    lists.set(name, v);
  }
  return { flags, lists, positionals: parsed.positionals };
}
