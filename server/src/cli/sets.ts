// `rungs sets FILE... [--by script|rung] [--format table|csv|json] [--balance [--seed N] [--fix]]`:
// balance statistics of the matched item sets of each script, and the balancer's proposal.
import { balanceSets } from '../core/balance';
import { applyFixes } from '../rules/fixes';
import { compareSets } from '../core/sets';
import type { SetScope } from '../core/types';
import { SET_RULE_IDS } from '../rules/setRules';
import { parseArgs } from './args';
import { formatBalance, formatSetsCsv, formatSetsJson, formatSetsTable, type BalancedFile, type SetsFile } from './formatSets';
import { EXIT_USAGE, UsageError, type CliIO } from './io';
import { loadScripts, type LoadedScript } from './scripts';
import type { Command } from './main';
import { writeFixed } from './writeFixes';

const USAGE = [
  'Usage: rungs sets FILE|FOLDER|- ... [--by script|rung] [--format table|csv|json]',
  '                  [--balance [--seed N] [--fix]]',
  '',
  '  Compares the items of each pair of @set labels on words, syllables, phonemes, WCM, Zipf and',
  '  difficulty: means and SDs, Hedges\' g, Welch t, Mann-Whitney U and an equivalence test (TOST).',
  '  --by      script (whole script; default unless @set-scope says rung) or rung (rung by rung)',
  '  --format  table (default, for people), csv (spreadsheets), json (tools; schema in README)',
  '  --balance propose which items carry which label (within each rung, set sizes kept) so the sets',
  '            match on every metric at once; prints the tables before and after',
  '  --seed    seed of the search (default 1): the same seed gives the same proposal',
  '  --fix     with --balance: write the proposal into the file (only @set labels change)',
].join('\n');

export const setsCommand: Command = {
  name: 'sets',
  summary: 'compare matched item sets: balance statistics and equivalence tests',
  usage: USAGE,
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, {
      format: { value: true, choices: ['table', 'csv', 'json'], alias: 'f' },
      by: { value: true, choices: ['script', 'rung'] },
      balance: {},
      seed: { value: true },
      fix: {},
    });
    const balance = args.flags.has('balance');
    const seedText = args.flags.get('seed') as string | undefined;
    if (!balance && (seedText !== undefined || args.flags.has('fix'))) throw new UsageError('--seed and --fix go with --balance');
    if (seedText !== undefined && !/^\d+$/.test(seedText)) throw new UsageError(`--seed takes a whole number, not "${seedText}"`);
    if (args.flags.has('fix') && args.positionals.includes('-')) throw new UsageError('--fix cannot write to standard input');
    if (!args.positionals.length) throw new UsageError('give at least one script file or folder');
    const format = (args.flags.get('format') as string | undefined) ?? 'table';
    const by = args.flags.get('by') as SetScope | undefined;
    const { scripts, code } = loadScripts(io, args.positionals, 'sets', by, balance && args.flags.has('fix'));
    if (balance) return balanceScripts(io, scripts, { seed: seedText === undefined ? 1 : Number(seedText), fix: args.flags.has('fix'), format }, code);
    const out: SetsFile[] = scripts.map((s) => ({
      file: s.shown,
      comparison: compareSets(s.analysis),
      problems: s.problems.filter((p) => SET_RULE_IDS.includes(p.rule)),
    }));
    if (out.length) io.stdout(format === 'json' ? formatSetsJson(out) : format === 'csv' ? formatSetsCsv(out) : formatSetsTable(out));
    return code;
  },
};

function balanceScripts(io: CliIO, scripts: LoadedScript[], o: { seed: number; fix: boolean; format: string }, code: number): number {
  const out: BalancedFile[] = [];
  for (const s of scripts) {
    const t0 = performance.now();
    const result = balanceSets(s.analysis, s.text, { seed: o.seed });
    const ms = performance.now() - t0;
    let written = false;
    if (o.fix && result.edits.length) {
      const fixed = applyFixes(s.text, [{ title: 'Balance sets', edits: result.edits }]);
      // As `rungs lint --fix` writes: in the file's own encoding, every other byte kept, and not
      // over a file that changed since it was read.
      const failed = s.source ? writeFixed(io.fs, s.file, s.source, fixed.text) : 'the file was not read for writing';
      if (failed) {
        io.stderr(`rungs sets: ${s.shown}:1:1: ${failed}\n`);
        code = EXIT_USAGE;
      } else written = true;
    }
    out.push({ file: s.shown, result, written, ms });
  }
  if (out.length) io.stdout(formatBalance(out, o.format));
  return code;
}
