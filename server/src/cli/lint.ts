// `rungs lint PATH|GLOB|- ...`: checks scripts against every rule, for people and for CI.
// Exit codes: 0 clean, 1 an error-level problem or more warnings than --max-warnings, 2 a usage
// error or an unreadable file (every other file is still linted and reported).
import { relative, sep } from 'node:path';
import { checkAndFix, checkScript, mergeFileProblems, type CheckCache, type FileProblem } from '../check/checkScript';
import { memoFs } from '../config/memoFs';
import { loadWordTable } from '../data/wordTable';
import { RULES } from '../rules/index';
import { VERSION } from '../version';
import { parseArgs } from './args';
import { excerpt } from '../core/excerpt';
import { expandPaths } from './files';
import { readScript } from './readScript';
import { writeFixed } from './writeFixes';
import { unifiedDiff } from './formats/diff';
import { formatGithub } from './formats/github';
import { formatLintJson } from './formats/json';
import { formatSarif } from './formats/sarif';
import { formatLintText } from './formats/text';
import type { LintFileResult, LintRun } from './formats/types';
import type { Problem } from '../core/types';
import { EXIT_OK, EXIT_PROBLEMS, EXIT_USAGE, UsageError, type CliIO } from './io';
import type { Command } from './main';

export const FORMATS = ['text', 'json', 'sarif', 'github'] as const;
/** Runs of at least this many files show a progress counter (on a terminal, outside CI). */
export const PROGRESS_MIN_FILES = 10;

const USAGE = [
  'Usage: rungs lint PATH|GLOB|- ... [--format text|json|sarif|github] [--max-warnings N]',
  '                  [--fix | --fix-dry-run] [--quiet] [--color | --no-color] [--no-gitignore]',
  '',
  '  Folders are searched for *.rungs files (skipping .gitignore\'d, dot and node_modules paths);',
  '  globs such as "scripts/**/*.rungs" are matched below their folder; "-" reads standard input.',
  '  --format        text (default: file:line:col severity rule message), json, sarif (SARIF 2.1.0),',
  '                  github (GitHub Actions annotations)',
  '  --max-warnings  exit 1 when there are more warnings than N',
  '  --fix           apply mechanical fixes in place, then report what is left',
  '  --fix-dry-run   print the fixes as a unified diff; change nothing',
  '  --quiet         report errors only, and no progress counter',
  '  Exit codes: 0 clean, 1 errors (or too many warnings), 2 usage error, unreadable or unwritable file.',
].join('\n');

/**
 * Word scores of the last script checked: the next script reuses them when its pronunciation
 * settings and overrides are the same (the core checks), so a library of scripts scores each
 * spelling once instead of once per file. Only the word scores: items are never shared by files.
 */
let lastPronouncer: CheckCache['pronouncer'];

/**
 * A problem that no longer holds its script's analysis: a fix whose edits are worked out when
 * first read (sorting a rung) keeps that rung's analysis and lines alive until then, and a run
 * over a library would keep them for every script until the report is written.
 */
const detached = (p: Problem): Problem => (p.fix ? { ...p, fix: { ...p.fix } } : p);

const shown = (cwd: string, file: string) => (file === '-' ? '<stdin>' : relative(cwd, file).split(sep).join('/') || file);

export const lintCommand: Command = {
  name: 'lint',
  summary: 'check scripts: ladder shape, items, paces, format (text, JSON, SARIF, GitHub)',
  usage: USAGE,
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, {
      format: { value: true, choices: [...FORMATS], alias: 'f' },
      'max-warnings': { value: true },
      fix: {},
      'fix-dry-run': {},
      quiet: { alias: 'q' },
      color: {},
      'no-color': {},
      'no-gitignore': {},
    });
    if (!args.positionals.length) throw new UsageError('give at least one script, folder or glob (or "-" for standard input)');
    const format = (args.flags.get('format') as (typeof FORMATS)[number] | undefined) ?? 'text';
    const maxRaw = args.flags.get('max-warnings');
    // Digits only: Number() reads "" as 0 and takes "1e3", "0x10" and "Infinity".
    if (maxRaw !== undefined && !/^\d{1,9}$/.test(String(maxRaw))) throw new UsageError(`--max-warnings takes a whole number from 0 to 999999999, not "${excerpt(String(maxRaw))}"`);
    const maxWarnings = maxRaw === undefined ? Infinity : Number(maxRaw);
    if (!Number.isInteger(maxWarnings) && maxWarnings !== Infinity) throw new UsageError(`--max-warnings takes a whole number, not "${String(maxRaw)}"`);
    if (maxWarnings < 0) throw new UsageError('--max-warnings takes a number, 0 or more');
    const fix = args.flags.has('fix');
    const dryRun = args.flags.has('fix-dry-run');
    if (fix && dryRun) throw new UsageError('use either --fix or --fix-dry-run');
    if (fix && args.positionals.includes('-')) throw new UsageError('--fix cannot write to standard input; use --fix-dry-run');
    const quiet = args.flags.has('quiet');
    const env = io.env ?? {};
    const colour = args.flags.has('color') || (!args.flags.has('no-color') && Boolean(io.isTTY) && !env.NO_COLOR && format === 'text');

    const { files, missing } = expandPaths(args.positionals, io.cwd, io.fs, { gitignore: !args.flags.has('no-gitignore') });
    let code = EXIT_OK;
    for (const m of missing) {
      io.stderr(`rungs lint: ${m}: no such file or folder, or no *.rungs file matches\n`);
      code = EXIT_USAGE;
    }
    if (!files.length) {
      if (!missing.length) io.stderr('rungs lint: no *.rungs files found\n');
      return EXIT_USAGE;
    }

    const progress = Boolean(io.isTTY) && !env.CI && !quiet && files.length >= PROGRESS_MIN_FILES;
    const data = loadWordTable();
    // Scripts of one folder share their config lookups: each file-system answer is fetched once.
    const configFs = memoFs(io.fs);
    const results: LintFileResult[] = [];
    const fileProblems: FileProblem[][] = [];
    const diffs: string[] = [];
    files.forEach((file, n) => {
      if (progress) io.stderr(`\rrungs lint: ${n + 1}/${files.length} files`);
      const name = shown(io.cwd, file);
      const clear = progress ? '\r\u001b[K' : '';
      const read = readScript(io, file, name, 'lint', fix || dryRun);
      if ('error' in read) {
        io.stderr(`${clear}${read.error}\n`);
        code = EXIT_USAGE;
        return;
      }
      if (read.cut) {
        io.stderr(`${clear}rungs lint: ${name}:1:1: ${read.cut}\n`);
        code = EXIT_USAGE;
      }
      if (read.notUtf8) io.stderr(`${clear}rungs lint: ${name}:${read.notUtf8.line}:${read.notUtf8.column}: ${read.notUtf8.message}\n`);
      const input = { text: read.text, path: read.path, fs: configFs, data, cache: { pronouncer: lastPronouncer } };
      let checked = fix || dryRun ? checkAndFix(input) : checkScript(input);
      lastPronouncer = checked.cache.pronouncer;
      fileProblems.push(checked.fileProblems);
      if (checked.text !== read.text) {
        if (fix && read.source) {
          const failed = writeFixed(io.fs, file, read.source, checked.text);
          if (failed) {
            io.stderr(`${clear}rungs lint: ${name}:1:1: ${failed}\n`);
            code = EXIT_USAGE;
            // A file left unwritten is reported as it is on disk.
            checked = checkScript({ ...input, cache: checked.cache });
          }
        } else diffs.push(unifiedDiff(name, read.text, checked.text));
      }
      results.push({ file: name, problems: checked.problems.map(detached) });
    });
    if (progress) io.stderr('\r\u001b[K');
    for (const [file, ps] of mergeFileProblems(fileProblems)) results.push({ file: shown(io.cwd, file), problems: ps });
    // Count before --quiet hides warnings, so --quiet changes the output, never the exit code.
    const all = results.flatMap((r) => r.problems);
    const errors = all.filter((p) => p.severity === 'error').length;
    const warnings = all.filter((p) => p.severity === 'warning').length;
    for (const r of results) if (quiet) r.problems = r.problems.filter((p) => p.severity === 'error');
    results.sort((a, b) => (a.file === '<stdin>' ? 1 : b.file === '<stdin>' ? -1 : a.file < b.file ? -1 : a.file > b.file ? 1 : 0));

    const run: LintRun = { version: VERSION, results };
    if (dryRun) io.stdout(diffs.join(''));
    else if (format === 'json') io.stdout(formatLintJson(run));
    else if (format === 'sarif') io.stdout(formatSarif(run, RULES));
    else if (format === 'github') io.stdout(formatGithub(run));
    else io.stdout(formatLintText(run, colour));

    if (warnings > maxWarnings) io.stderr(`rungs lint: ${warnings} warnings, more than --max-warnings ${maxWarnings}\n`);
    if (code === EXIT_OK && (errors > 0 || warnings > maxWarnings)) code = EXIT_PROBLEMS;
    return code;
  },
};
