// `rungs progress RECORDS... [--client CODE] [--format table|csv|json]`: rates, benefit ratios and
// trends from client rate records (*.rates.csv). Exit codes as for `rungs lint`: 0 clean, 1 a bad
// row (an error problem), 2 a usage error or an unreadable file.
import { dirname, relative, resolve, sep } from 'node:path';
import { resolveScriptContext } from '../config/resolve';
import { isRecordsFile, scriptFacts, type ScriptFacts, type ScriptLookup } from '../core/records';
import { readProgress } from '../rules/records';
import type { WordData } from '../core/types';
import { loadWordTable } from '../data/wordTable';
import { parseArgs } from './args';
import { expandPaths } from './files';
import { formatProgressCsv, formatProgressJson, formatProgressTable, type ProgressFileResult } from './formatProgress';
import { EXIT_OK, EXIT_PROBLEMS, EXIT_USAGE, UsageError, type CliFs, type CliIO } from './io';
import type { Command } from './main';

const USAGE = [
  'Usage: rungs progress RECORDS|FOLDER ... [--client CODE] [--format table|csv|json]',
  '',
  '  Records files are CSV files named *.rates.csv or *.rates.tsv (folders are searched for them).',
  '  --client  show only the rows and trends of one client code',
  '  --format  table (default, for people), csv (one row per record), json (tools; schema in README)',
  '  Exit codes: 0 clean, 1 a bad row, 2 usage error or unreadable file.',
].join('\n');

/** Today as YYYY-MM-DD in the local calendar (rows dated later are reported). */
export function localToday(now = new Date()): string {
  const z = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${z(now.getMonth() + 1)}-${z(now.getDate())}`;
}

/** Scripts named by a records file, read from disk relative to it (each read once). */
export function diskScripts(recordsFile: string, fs: CliFs): ScriptLookup {
  const cache = new Map<string, ScriptFacts | null>();
  return (path) => {
    const full = resolve(dirname(recordsFile), path);
    if (!cache.has(full)) {
      let facts: ScriptFacts | null = null;
      try {
        if (fs.exists(full) && !fs.isDirectory(full)) facts = scriptFacts(fs.readFile(full), resolveScriptContext(full, fs).options);
      } catch {
        facts = null;
      }
      cache.set(full, facts);
    }
    return cache.get(full)!;
  };
}

export const progressCommand: Command = {
  name: 'progress',
  summary: 'rates and paced/unassisted benefit ratios from client rate records (*.rates.csv)',
  usage: USAGE,
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { format: { value: true, choices: ['table', 'csv', 'json'], alias: 'f' }, client: { value: true } });
    if (!args.positionals.length) throw new UsageError('give at least one records file or folder');
    const format = (args.flags.get('format') as string | undefined) ?? 'table';
    const client = args.flags.get('client') as string | undefined;
    const { files, missing } = expandPaths(args.positionals.filter((p) => p !== '-'), io.cwd, io.fs, { match: isRecordsFile });
    if (args.positionals.includes('-')) throw new UsageError('records are read from files (scripts are found relative to them), not standard input');
    let code = EXIT_OK;
    for (const m of missing) {
      io.stderr(`rungs progress: ${m}: no such file or folder\n`);
      code = EXIT_USAGE;
    }
    if (!files.length && !missing.length) {
      io.stderr('rungs progress: no *.rates.csv or *.rates.tsv files found\n');
      return EXIT_USAGE;
    }
    let data: WordData | undefined;
    try {
      data = loadWordTable();
    } catch {
      data = undefined; // Without word tables, transcripts still give words per second.
    }
    const today = localToday();
    const results: ProgressFileResult[] = [];
    let mark = 1.2;
    for (const file of files) {
      const shown = relative(io.cwd, file).split(sep).join('/') || file;
      let text: string;
      try {
        text = io.fs.readFile(file);
      } catch (err) {
        io.stderr(`rungs progress: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
        code = EXIT_USAGE;
        continue;
      }
      const options = resolveScriptContext(file, io.fs).options.records;
      mark = options.benefitMark;
      const r = readProgress({ text, scripts: diskScripts(file, io.fs), options, today, data });
      if (client) {
        r.records = r.records.filter((x) => x.client === client);
        r.trends = r.trends.filter((t) => t.client === client);
      }
      results.push({ file: shown, ...r });
      if (r.problems.some((p) => p.severity === 'error') && code === EXIT_OK) code = EXIT_PROBLEMS;
    }
    if (format === 'csv') {
      for (const f of results) for (const p of f.problems) io.stderr(`${f.file}:${p.line + 1}:${p.character + 1} ${p.severity} ${p.rule} ${p.message}\n`);
    }
    if (results.length) {
      io.stdout(format === 'json' ? formatProgressJson(results, mark) : format === 'csv' ? formatProgressCsv(results) : formatProgressTable(results, mark));
    }
    return code;
  },
};
