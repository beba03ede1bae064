// `rungs score FILE... [--format table|csv|json]`: per-item scores of each script.
import { CAUTION } from '../core/caution';
import { parseArgs } from './args';
import { formatCsv, formatJsonPieces, formatTable, type ScoredFile } from './formatScore';
import { UsageError, type CliIO } from './io';
import { batched } from './jsonStream';
import { loadScripts } from './scripts';
import type { Command } from './main';

export const scoreCommand: Command = {
  name: 'score',
  summary: 'score every item of stimulus scripts (table, CSV or JSON)',
  usage: [
    'Usage: rungs score FILE|FOLDER|- ... [--format table|csv|json]',
    '',
    '  Folders are searched for *.rungs files; "-" reads standard input.',
    '  --format  table (default, for people), csv (spreadsheets), json (tools; schema in README)',
  ].join('\n'),
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { format: { value: true, choices: ['table', 'csv', 'json'], alias: 'f' } });
    if (!args.positionals.length) throw new UsageError('give at least one script file or folder');
    const format = (args.flags.get('format') as string | undefined) ?? 'table';
    const { scripts, code } = loadScripts(io, args.positionals, 'score');
    const scored: ScoredFile[] = scripts.map((s) => ({ file: s.shown, analysis: s.analysis, problems: s.problems }));
    if (scored.length) {
      if (format === 'json') for (const chunk of batched(formatJsonPieces(scored))) io.stdout(chunk);
      else io.stdout(format === 'csv' ? formatCsv(scored) : formatTable(scored, CAUTION));
    }
    return code;
  },
};
