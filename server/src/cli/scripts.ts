// Reads and analyses the scripts named on a command line (files, folders, "-"), reporting what
// cannot be read; shared by the commands that work on analysed scripts.
import { basename, join, relative } from 'node:path';
import { analyze } from '../core/analyze';
import type { Analysis, SetScope } from '../core/types';
import { resolveScriptContext } from '../config/resolve';
import { loadWordTable } from '../data/wordTable';
import { lint } from '../rules/index';
import { expandPaths } from './files';
import { EXIT_OK, EXIT_USAGE, type CliIO } from './io';
import { readScript } from './readScript';

export interface LoadedScript {
  file: string;
  shown: string;
  text: string;
  analysis: Analysis;
  problems: ReturnType<typeof lint>;
}

/** Every script named on the command line, analysed and linted; `scope` overrides @set-scope. */
export function loadScripts(
  io: CliIO,
  positionals: string[],
  command: string,
  scope?: SetScope,
): { scripts: LoadedScript[]; code: number } {
  const { files, missing } = expandPaths(positionals, io.cwd, io.fs);
  let code = EXIT_OK;
  for (const m of missing) {
    io.stderr(`rungs ${command}: ${m}: no such file or folder\n`);
    code = EXIT_USAGE;
  }
  if (!files.length && !missing.length) {
    io.stderr(`rungs ${command}: no *.rungs files found\n`);
    return { scripts: [], code: EXIT_USAGE };
  }
  const data = loadWordTable();
  const scripts: LoadedScript[] = [];
  for (const file of files) {
    const shown = file === '-' ? '<stdin>' : relative(io.cwd, file) || basename(file);
    let text: string;
    try {
      const read = readScript(io, file);
      text = read.text;
      if (read.cut) {
        io.stderr(`rungs ${command}: ${shown}:1:1: ${read.cut}\n`);
        code = EXIT_USAGE;
      }
    } catch (err) {
      io.stderr(`rungs ${command}: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
      code = EXIT_USAGE;
      continue;
    }
    const ctx = resolveScriptContext(file === '-' ? join(io.cwd, 'stdin.rungs') : file, io.fs);
    const options = scope ? { ...ctx.options, setScope: scope } : ctx.options;
    const analysis = analyze({ text, data, options, lexicon: ctx.lexicon });
    scripts.push({ file, shown, text, analysis, problems: lint(analysis, text, ctx.lint) });
  }
  return { scripts, code };
}

