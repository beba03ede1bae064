// What `rungs cues`, `rungs audio` and `rungs practice` share: read one script, analyse it with its
// config, pick the rung and pace asked for, and make the session plan.
import { parsePaces } from '../core/pace';
import { planSession, type DeliveryMode, type SessionPlan } from '../core/timing';
import type { Analysis, Pace } from '../core/types';
import type { FlagSpec, ParsedArgs } from './args';
import { UsageError, type CliIO } from './io';
import { loadScripts } from './scripts';

export const PLAN_FLAGS: Record<string, FlagSpec> = {
  rung: { value: true, alias: 'r' },
  pace: { value: true, alias: 'p' },
  mode: { value: true, choices: ['unison', 'echo'], alias: 'm' },
  output: { value: true, alias: 'o' },
};

export const PLAN_USAGE = [
  '  --rung NAME|N  one rung, by its name or 1-based number (default: every rung)',
  '  --pace P       one pace for every item, e.g. "1.2" or "3 sps" (default: each rung\'s first pace)',
  '  --mode M       unison (default) or echo (a response window after each model)',
];

export interface PlanInput {
  file: string;
  /** The file as shown in messages (relative to the working folder). */
  shown: string;
  text: string;
  analysis: Analysis;
  plan: SessionPlan;
  /** The rung asked for, or null for the whole script. */
  rung: number | null;
  pace: Pace | null;
  mode: DeliveryMode;
}

/** Reads "2" (1-based number) or a rung name (case and surrounding spaces ignored). */
function findRung(a: Analysis, wanted: string): number {
  const names = a.rungs.map((r) => r.node.name);
  if (/^\d+$/.test(wanted)) {
    const n = Number(wanted);
    if (n >= 1 && n <= a.rungs.length) return n - 1;
    throw new UsageError(`--rung ${wanted}: the script has ${a.rungs.length} rung${a.rungs.length === 1 ? '' : 's'}`);
  }
  const k = names.findIndex((n) => n.trim().toLowerCase() === wanted.trim().toLowerCase());
  if (k < 0) throw new UsageError(`--rung "${wanted}": no rung of that name (rungs: ${names.map((n) => `"${n}"`).join(', ')})`);
  return k;
}

/**
 * Returns the plan input, or an exit code after printing why (unreadable file: 2). Usage errors
 * are thrown as UsageError for main() to print with the command's usage.
 */
export function readPlanInput(io: CliIO, args: ParsedArgs, command: string): PlanInput | number {
  if (args.positionals.length !== 1) throw new UsageError('give exactly one script file');
  const { scripts, code } = loadScripts(io, args.positionals, command);
  if (!scripts.length) return code;
  if (scripts.length > 1) throw new UsageError(`"${args.positionals[0]}" holds ${scripts.length} scripts: give one script file`);
  const { file, shown, text, analysis } = scripts[0];
  const rungFlag = args.flags.get('rung');
  const rung = typeof rungFlag === 'string' ? findRung(analysis, rungFlag) : null;
  let pace: Pace | null = null;
  const paceFlag = args.flags.get('pace');
  if (typeof paceFlag === 'string') {
    const { paces, error } = parsePaces(paceFlag);
    if (error) throw new UsageError(`--pace: ${error}`);
    if (paces.length !== 1) throw new UsageError('--pace takes one pace, e.g. "1.2" or "3 sps"');
    pace = paces[0];
  }
  const mode = ((args.flags.get('mode') as string | undefined) ?? 'unison') as DeliveryMode;
  const plan = planSession(analysis, { rung: rung ?? undefined, pace: pace ?? undefined, mode });
  if (!plan.items.length) {
    io.stderr(`rungs ${command}: ${shown}: ${rung === null ? 'the script has no items' : `rung "${analysis.rungs[rung].node.name}" has no items`}\n`);
    return 1;
  }
  return { file, shown, text, analysis, plan, rung, pace, mode };
}

/** A short description of the plan for notes and titles: "rung 2 "Requests" at 1.2 wps, unison". */
export function describePlan(input: PlanInput): string {
  const paces = [...new Set(input.plan.rungs.map((r) => r.pace.label))].join(', ');
  const what = input.rung === null ? 'every rung' : `rung ${input.rung + 1} "${input.analysis.rungs[input.rung].node.name}"`;
  return `${input.shown}, ${what} at ${paces}, ${input.mode}`;
}
