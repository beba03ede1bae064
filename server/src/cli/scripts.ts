// Reads and analyses the scripts named on a command line (files, folders, "-"), reporting what
// cannot be read; shared by the commands that work on analysed scripts.
import { basename, relative } from 'node:path';
import { checkScript } from '../check/checkScript';
import type { Analysis, Problem, SetScope } from '../core/types';
import { loadWordTable } from '../data/wordTable';
import { expandPaths } from './files';
import { EXIT_OK, EXIT_USAGE, type CliIO } from './io';
import { readScript } from './readScript';
import type { FixSource } from './writeFixes';

export interface LoadedScript {
  file: string;
  shown: string;
  text: string;
  analysis: Analysis;
  problems: Problem[];
  /** The bytes as read, kept when the command may write the file back (writeFixed). */
  source?: FixSource;
}

/**
 * Every script named on the command line, analysed and linted; `scope` overrides @set-scope;
 * `forWriting` keeps each file's bytes for writing it back.
 */
export function loadScripts(
  io: CliIO,
  positionals: string[],
  command: string,
  scope?: SetScope,
  forWriting = false,
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
    const read = readScript(io, file, shown, command, forWriting);
    if ('error' in read) {
      io.stderr(`${read.error}\n`);
      code = EXIT_USAGE;
      continue;
    }
    if (read.cut) {
      io.stderr(`rungs ${command}: ${shown}:1:1: ${read.cut}\n`);
      code = EXIT_USAGE;
    }
    if (read.notUtf8) io.stderr(`rungs ${command}: ${shown}:${read.notUtf8.line}:${read.notUtf8.column}: ${read.notUtf8.message}\n`);
    const checked = checkScript({
      text: read.text,
      path: read.path,
      fs: io.fs,
      data,
      ...(scope ? { adjust: (o) => ({ ...o, setScope: scope }) } : {}),
    });
    scripts.push({ file, shown, text: read.text, analysis: checked.analysis, problems: checked.problems, source: read.source });
  }
  return { scripts, code };
}

