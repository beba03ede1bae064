// Reads the rate records files named on a command line (files or folders of *.rates.csv), each
// with its scripts found relative to it; shared by `rungs progress` and `rungs report --records`.
import { dirname, relative, resolve, sep } from 'node:path';
import { resolveScriptContext } from '../config/resolve';
import { isRecordsFile, scriptFacts, type ScriptFacts, type ScriptLookup } from '../core/records';
import { readProgress } from '../rules/records';
import type { WordData } from '../core/types';
import { loadWordTable } from '../data/wordTable';
import { expandPaths } from './files';
import type { ProgressFileResult } from './formatProgress';
import { EXIT_OK, EXIT_PROBLEMS, EXIT_USAGE, type CliFs, type CliIO } from './io';

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

export interface LoadedRecords {
  results: ProgressFileResult[];
  /** The benefit mark in force (the last file's, from its config; 1.2 by default). */
  mark: number;
  /** 0 clean, 1 a bad row (an error problem), 2 a missing or unreadable file. */
  code: number;
}

export function loadRecords(io: CliIO, paths: string[], command: string, client?: string): LoadedRecords {
  const { files, missing } = expandPaths(paths, io.cwd, io.fs, { match: isRecordsFile });
  let code = EXIT_OK;
  for (const m of missing) {
    io.stderr(`rungs ${command}: ${m}: no such file or folder\n`);
    code = EXIT_USAGE;
  }
  if (!files.length && !missing.length) {
    io.stderr(`rungs ${command}: no *.rates.csv or *.rates.tsv files found\n`);
    return { results: [], mark: 1.2, code: EXIT_USAGE };
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
      io.stderr(`rungs ${command}: ${shown}:1:1: cannot read the file (${(err as NodeJS.ErrnoException).code ?? String(err)})\n`);
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
  return { results, mark, code };
}
