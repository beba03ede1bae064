// `rungs report PATH... [--records FILE]... [-o report.html] [--pdf report.pdf]`: one
// self-contained HTML report of scripts and of client progress from rate records (and a PDF of it
// through a local Chromium). Reading, writing and printing happen here; the report itself is drawn
// by the pure renderers of server/src/report.
import { relative, resolve } from 'node:path';
import { CAUTION } from '../core/caution';
import { buildScriptReport } from '../report/model';
import { renderReport } from '../report/page';
import { parseArgs } from './args';
import { EXIT_OK, EXIT_USAGE, UsageError, type CliIO } from './io';
import { VERSION, type Command } from './main';
import { CHROMIUM_HINT, findChromium, printPdf, type Paper } from './pdf';
import { loadRecords } from './records';
import { loadScripts } from './scripts';

export const reportCommand: Command = {
  name: 'report',
  summary: 'write a printable HTML (or PDF) report of scripts and client progress',
  usage: [
    'Usage: rungs report PATH... [--records FILE]... [-o report.html] [--pdf report.pdf] [--paper a4|letter]',
    '',
    '  Folders are searched for *.rungs files; "-" reads standard input.',
    '  --records     rate records (*.rates.csv, or a folder of them) to show client progress; repeat for more',
    '  -o, --output  the HTML file to write (default report.html)',
    '  --pdf         also print the report to this PDF file (needs a local Chromium)',
    '  --paper       PDF paper size: a4 (default) or letter',
  ].join('\n'),
  async run(io: CliIO, argv: string[]): Promise<number> {
    const args = parseArgs(argv, {
      records: { value: true },
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
    const loaded = loadScripts(io, args.positionals, 'report');
    const scripts = loaded.scripts.map((s) => buildScriptReport(s.shown, s.analysis, s.problems));
    if (!scripts.length) return EXIT_USAGE;
    let code = loaded.code;
    const recordPaths = args.lists.get('records') ?? [];
    let progress = null;
    if (recordPaths.length) {
      const r = loadRecords(io, recordPaths, 'report');
      // Bad rows are listed by `rungs progress`; here they only count, and the report is written.
      if (r.code === EXIT_USAGE) code = EXIT_USAGE;
      progress = { mark: r.mark, files: r.results };
    }
    const html = renderReport({ scripts, version: VERSION, caution: CAUTION, progress });
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
    return code === EXIT_USAGE ? EXIT_USAGE : EXIT_OK;
  },
};
