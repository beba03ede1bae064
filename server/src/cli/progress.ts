// `rungs progress RECORDS... [--client CODE] [--format table|csv|json]`: rates, benefit ratios and
// trends from client rate records (*.rates.csv). Exit codes as for `rungs lint`: 0 clean, 1 a bad
// row (an error problem), 2 a usage error or an unreadable file.
import { parseArgs } from './args';
import { formatProgressCsv, formatProgressJson, formatProgressTable } from './formatProgress';
import { UsageError, type CliIO } from './io';
import type { Command } from './main';
import { loadRecords } from './records';

const USAGE = [
  'Usage: rungs progress RECORDS|FOLDER ... [--client CODE] [--format table|csv|json]',
  '',
  '  Records files are CSV files named *.rates.csv or *.rates.tsv (folders are searched for them).',
  '  --client  show only the rows and trends of one client code',
  '  --format  table (default, for people), csv (one row per record), json (tools; schema in README)',
  '  Exit codes: 0 clean, 1 a bad row, 2 usage error or unreadable file.',
].join('\n');

export const progressCommand: Command = {
  name: 'progress',
  summary: 'rates and paced/unassisted benefit ratios from client rate records (*.rates.csv)',
  usage: USAGE,
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { format: { value: true, choices: ['table', 'csv', 'json'], alias: 'f' }, client: { value: true } });
    if (!args.positionals.length) throw new UsageError('give at least one records file or folder');
    const format = (args.flags.get('format') as string | undefined) ?? 'table';
    const client = args.flags.get('client') as string | undefined;
    if (args.positionals.includes('-')) throw new UsageError('records are read from files (scripts are found relative to them), not standard input');
    const { results, mark, code } = loadRecords(io, args.positionals, 'progress', client);
    if (format === 'csv') {
      for (const f of results) for (const p of f.problems) io.stderr(`${f.file}:${p.line + 1}:${p.character + 1} ${p.severity} ${p.rule} ${p.message}\n`);
    }
    if (results.length) {
      io.stdout(format === 'json' ? formatProgressJson(results, mark) : format === 'csv' ? formatProgressCsv(results) : formatProgressTable(results, mark));
    }
    return code;
  },
};
