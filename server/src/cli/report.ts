// `rungs report PATH... [-o report.html] [--pdf report.pdf]`: one self-contained HTML report of
// scripts (and a PDF of it through a local Chromium). Reading, writing and printing happen here;
// the report itself is drawn by the pure renderers of server/src/report.
import { basename, join, relative, resolve } from 'node:path';
import { analyze } from '../core/analyze';
import { CAUTION } from '../core/caution';
import { resolveScriptContext } from '../config/resolve';
import { loadWordTable } from '../data/wordTable';
import { buildScriptReport, type ScriptReport } from '../report/model';
import { renderReport } from '../report/page';
import { lint } from '../rules/index';
import { parseArgs } from './args';
import { expandPaths } from './files';
import { EXIT_OK, EXIT_USAGE, UsageError, type CliIO } from './io';
import { VERSION, type Command } from './main';
import { CHROMIUM_HINT, findChromium, printPdf, type Paper } from './pdf';

export const reportCommand: Command = {
  name: 'report',
  summary: 'write a printable HTML (or PDF) report of scripts',
  usage: [
    'Usage: rungs report PATH... [-o report.html] [--pdf report.pdf] [--paper a4|letter]',
    '',
    '  Folders are searched for *.rungs files; "-" reads standard input.',
    '  -o, --output  the HTML file to write (default report.html)',
    '  --pdf         also print the report to this PDF file (needs a local Chromium)',
    '  --paper       PDF paper size: a4 (default) or letter',
  ].join('\n'),
  async run(io: CliIO, argv: string[]): Promise<number> {
    const args = parseArgs(argv, {
      output: { value: true, alias: 'o' },
      pdf: { value: true },
      paper: { value: true, choices: ['a4', 'letter'] },
    });
    if (!args.positionals.length) throw new UsageError('give at least one script file or folder');
    const output = resolve(io.cwd, (args.flags.get('output') as string | undefined) ?? 'report.html');
    const pdf = args.flags.get('pdf') as string | undefined;
    const paper: Paper = args.flags.get('paper') === 'letter' ? 'Letter' : 'A4';
    // Find the browser before any work, so a missing one costs nothing.
    const chromium = pdf ? findChromium(io.env ?? {}, io.fs) : null;
    if (pdf && !chromium) {
      io.stderr(`rungs report: --pdf needs Chromium, and none was found on PATH; ${CHROMIUM_HINT}.\n`);
      return EXIT_USAGE;
    }
    const { files, missing } = expandPaths(args.positionals, io.cwd, io.fs);
    let code = EXIT_OK;
    for (const m of missing) {
      io.stderr(`rungs report: ${m}: no such file or folder\n`);
      code = EXIT_USAGE;
    }
    const data = loadWordTable();
    const scripts: ScriptReport[] = [];
    for (const file of files) {
      const shown = file === '-' ? '<stdin>' : relative(io.cwd, file) || basename(file);
      let text: string;
      try {
        text = file === '-' ? (io.readStdin ? io.readStdin() : '') : io.fs.readFile(file);
      } catch (err) {
        io.stderr(`rungs report: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
        code = EXIT_USAGE;
        continue;
      }
      const ctx = resolveScriptContext(file === '-' ? join(io.cwd, 'stdin.rungs') : file, io.fs);
      const analysis = analyze({ text, data, options: ctx.options, lexicon: ctx.lexicon });
      scripts.push(buildScriptReport(shown, analysis, lint(analysis, text, ctx.lint)));
    }
    if (!scripts.length) {
      if (!files.length && !missing.length) io.stderr('rungs report: no *.rungs files found\n');
      return EXIT_USAGE;
    }
    const html = renderReport({ scripts, version: VERSION, caution: CAUTION });
    try {
      io.fs.writeFile(output, html);
    } catch (err) {
      io.stderr(`rungs report: cannot write ${relative(io.cwd, output)} (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
      return EXIT_USAGE;
    }
    io.stdout(`${output}\n`);
    if (pdf && chromium) {
      const pdfPath = resolve(io.cwd, pdf);
      try {
        await printPdf(html, pdfPath, paper, chromium);
      } catch (err) {
        io.stderr(`rungs report: printing ${relative(io.cwd, pdfPath)} with ${chromium} failed: ${err instanceof Error ? err.message.split('\n')[0] : String(err)}\n`);
        return EXIT_USAGE;
      }
      io.stdout(`${pdfPath}\n`);
    }
    return code;
  },
};
