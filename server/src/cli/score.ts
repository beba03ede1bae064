// `rungs score FILE... [--format table|csv|json]`: per-item scores of each script.
import { basename, join, relative } from 'node:path';
import { analyze } from '../core/analyze';
import { CAUTION } from '../core/caution';
import { resolveScriptContext } from '../config/resolve';
import { loadWordTable } from '../data/wordTable';
import { lint } from '../rules/index';
import { parseArgs } from './args';
import { expandPaths } from './files';
import { formatCsv, formatJson, formatTable, type ScoredFile } from './formatScore';
import { EXIT_OK, EXIT_USAGE, UsageError, type CliIO } from './io';
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
    const { files, missing } = expandPaths(args.positionals, io.cwd, io.fs);
    let code = EXIT_OK;
    for (const m of missing) {
      io.stderr(`rungs score: ${m}: no such file or folder\n`);
      code = EXIT_USAGE;
    }
    const data = loadWordTable();
    const scored: ScoredFile[] = [];
    for (const file of files) {
      const shown = file === '-' ? '<stdin>' : relative(io.cwd, file) || basename(file);
      let text: string;
      try {
        text = file === '-' ? (io.readStdin ? io.readStdin() : '') : io.fs.readFile(file);
      } catch (err) {
        io.stderr(`rungs score: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
        code = EXIT_USAGE;
        continue;
      }
      const ctx = resolveScriptContext(file === '-' ? join(io.cwd, 'stdin.rungs') : file, io.fs);
      const analysis = analyze({ text, data, options: ctx.options, lexicon: ctx.lexicon });
      scored.push({ file: shown, analysis, problems: lint(analysis, text, ctx.lint) });
    }
    if (!files.length && !missing.length) {
      io.stderr('rungs score: no *.rungs files found\n');
      return EXIT_USAGE;
    }
    if (scored.length) {
      io.stdout(format === 'json' ? formatJson(scored) : format === 'csv' ? formatCsv(scored) : formatTable(scored, CAUTION));
    }
    return code;
  },
};
