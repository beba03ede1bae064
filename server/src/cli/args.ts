// A small, strict argument parser: unknown flags are usage errors, never silently ignored.
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

export function parseArgs(argv: string[], specs: Record<string, FlagSpec>): ParsedArgs {
  const flags = new Map<string, string | true>();
  const lists = new Map<string, string[]>();
  const positionals: string[] = [];
  const byAlias = new Map<string, string>();
  for (const [name, s] of Object.entries(specs)) if (s.alias) byAlias.set(s.alias, name);
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--') {
      positionals.push(...argv.slice(i + 1));
      break;
    }
    if (arg.startsWith('-') && arg !== '-') {
      const eq = arg.indexOf('=');
      const rawName = arg.replace(/^-+/, '').slice(0, eq < 0 ? undefined : eq - (arg.length - arg.replace(/^-+/, '').length));
      const name = byAlias.get(rawName) ?? rawName;
      const spec = specs[name];
      if (!spec) throw new UsageError(`unknown option "${arg}"`);
      if (spec.value) {
        const v = eq >= 0 ? arg.slice(eq + 1) : argv[++i];
        if (v === undefined) throw new UsageError(`option --${name} needs a value`);
        if (spec.choices && !spec.choices.includes(v)) {
          throw new UsageError(`--${name} must be one of ${spec.choices.join(', ')}, not "${v}"`);
        }
        flags.set(name, v);
        lists.set(name, [...(lists.get(name) ?? []), v]);
      } else {
        if (eq >= 0) throw new UsageError(`option --${name} takes no value`);
        flags.set(name, true);
      }
      continue;
    }
    positionals.push(arg);
  }
  return { flags, lists, positionals };
}
