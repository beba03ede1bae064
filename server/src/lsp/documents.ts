// Open scripts and their analyses. Each document keeps its last analysis, its Pronouncer and its
// item cache, so a request always gets the analysis of the text it was sent against (analysed
// synchronously when the text or the settings moved on) and an edit re-scores only what changed.
import { statSync } from 'node:fs';
import { dirname, isAbsolute, join, normalize, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { TextDocument } from 'vscode-languageserver-textdocument';
import type { AnalyzeOutput } from '../core/analyze';
import { splitLines } from '../core/parse';
import type { ItemAnalysis, Problem, RungAnalysis, WordData } from '../core/types';
import { clearConfigCache, resolveScriptContext, type ConfigFs } from '../config/resolve';
import { lint } from '../rules/index';
import { isRegularFile, readTextBounded, realPath } from '../node/boundedRead';
import type { LintSettings } from '../rules/types';
import { analyzeIncremental, type IncrementalState } from './incremental';
import { DEFAULT_SETTINGS, toConfigObject, type RungsSettings } from './settings';

export interface Snapshot {
  uri: string;
  version: number;
  text: string;
  lines: string[];
  analysis: AnalyzeOutput;
  /** Every problem: the core's and every rule's, severities applied. */
  problems: Problem[];
  settings: RungsSettings;
  /** Milliseconds the analysis took (for the log and the report); the rules run when problems are first read. */
  ms: number;
  itemAt(line: number): ItemAnalysis | undefined;
  /** The rung whose header (or, for the implicit rung, first item) is on this line. */
  rungAtHeader(line: number): RungAnalysis | undefined;
  /** The rung a line belongs to (header through its last line). */
  rungContaining(line: number): RungAnalysis | undefined;
}

interface DocState {
  snapshot?: Snapshot;
  settingsGeneration: number;
  cache?: IncrementalState;
  reuse?: AnalyzeOutput['pronouncer'];
  /** Every file the resolver read or looked for (config files and lexicons, found or missing), by pathKey. */
  dependencies: Map<string, string>;
  /** Problems in config and lexicon files (absolute paths) from the last analysis. */
  fileProblems: { file: string; problem: Problem }[];
}

/** A path as a comparison key: normalised, and case-folded where the file system ignores case. */
export function pathKey(path: string): string {
  const n = normalize(path);
  return process.platform === 'win32' || process.platform === 'darwin' ? n.toLowerCase() : n;
}

/** A ConfigFs that remembers every path it was asked about, so the server knows what to watch. */
function recordingFs(fs: ConfigFs, seen: Map<string, string>): ConfigFs {
  return {
    readFile: (p) => (seen.set(pathKey(p), p), fs.readFile(p)),
    exists: (p) => (seen.set(pathKey(p), p), fs.exists(p)),
    isFile: fs.isFile,
    realpath: fs.realpath,
  };
}

export const nodeConfigFs: ConfigFs = {
  readFile: (p) => readTextBounded(p),
  isFile: isRegularFile,
  realpath: realPath,
  exists: (p) => {
    try {
      statSync(p);
      return true;
    } catch {
      return false;
    }
  },
};

export function uriToPath(uri: string): string | null {
  if (!uri.startsWith('file:')) return null;
  try {
    return fileURLToPath(uri);
  } catch {
    return null;
  }
}

function makeSnapshot(
  uri: string,
  version: number,
  text: string,
  analysis: AnalyzeOutput,
  problems: (lines: string[]) => Problem[],
  settings: RungsSettings,
  ms: number,
): Snapshot {
  // The lines and the problems (every rule) are worked out when first asked for: a read request
  // (hover, inlay hints, code lens, completion) answers from the analysis and never waits for
  // the rules, and a burst of edits lints only the version that gets published.
  let lines: string[] | undefined;
  let linted: Problem[] | undefined;
  let headers: Map<number, RungAnalysis> | undefined;
  return {
    uri,
    version,
    text,
    get lines() {
      return (lines ??= splitLines(text));
    },
    analysis,
    get problems() {
      return (linted ??= problems((lines ??= splitLines(text))));
    },
    settings,
    ms,
    itemAt(line) {
      // Items are in line order: a binary search, not a table of 10,000 items per version.
      const items = analysis.items;
      let lo = 0;
      let hi = items.length - 1;
      while (lo <= hi) {
        const mid = (lo + hi) >> 1;
        const l = items[mid].node.line;
        if (l === line) return items[mid];
        if (l < line) lo = mid + 1;
        else hi = mid - 1;
      }
      return undefined;
    },
    rungAtHeader(line) {
      headers ??= new Map(analysis.rungs.map((r) => [r.node.line, r]));
      return headers.get(line);
    },
    rungContaining(line) {
      // A rung runs from its header to the line before the next header.
      let found: RungAnalysis | undefined;
      for (const r of analysis.rungs) if (r.node.line <= line) found = r;
      return found;
    },
  };
}

/** The resolver's name for the editor-settings layer (it has no file). */
const EDITOR_LAYER = 'editor settings (rungs.*)';

export interface StoreHooks {
  log(message: string): void;
  error(message: string): void;
  /** Called after every fresh analysis (not when a cached one is returned). */
  analyzed(s: Snapshot): void;
}

export class AnalysisStore {
  private readonly states = new Map<string, DocState>();
  private readonly settings = new Map<string, RungsSettings>();
  private readonly logged = new Set<string>();
  private generation = 0;
  workspaceFolders: string[] = [];

  constructor(
    private readonly data: WordData,
    private readonly hooks: StoreHooks,
  ) {}

  /** Settings used for a document (defaults until the client's answer arrives). */
  settingsFor(uri: string): RungsSettings {
    return this.settings.get(uri) ?? DEFAULT_SETTINGS;
  }

  /** Records settings for a document; returns true when they differ from those in use. */
  setSettings(uri: string, s: RungsSettings): boolean {
    const before = this.settings.get(uri);
    this.settings.set(uri, s);
    if (before && JSON.stringify(before) === JSON.stringify(s)) return false;
    this.generation++;
    return true;
  }

  /** Forgets cached settings, config and lexicon files (configuration or watched files changed). */
  invalidate(): void {
    this.settings.clear();
    this.logged.clear();
    clearConfigCache();
    this.generation++;
  }

  close(uri: string): void {
    this.states.delete(uri);
    this.settings.delete(uri);
  }

  /** True when an open script's last analysis read or looked for this file. */
  dependsOn(path: string): boolean {
    const key = pathKey(path);
    for (const st of this.states.values()) if (st.dependencies.has(key)) return true;
    return false;
  }

  /** The files open scripts read or looked for, other than config files (those are watched by name). */
  lexiconPaths(isConfigFile: (path: string) => boolean): string[] {
    const out = new Set<string>();
    for (const st of this.states.values()) for (const p of st.dependencies.values()) if (!isConfigFile(p)) out.add(p);
    return [...out].sort();
  }

  /**
   * Problems in config and lexicon files, by file, over every open script's last analysis. A file
   * shared by several scripts reports each problem once.
   */
  fileProblems(): Map<string, Problem[]> {
    const byFile = new Map<string, Map<string, Problem>>();
    for (const st of this.states.values()) {
      for (const { file, problem } of st.fileProblems) {
        let m = byFile.get(file);
        if (!m) byFile.set(file, (m = new Map()));
        m.set(JSON.stringify([problem.line, problem.character, problem.endLine, problem.endCharacter, problem.rule, problem.message]), problem);
      }
    }
    return new Map([...byFile].map(([file, m]) => [file, [...m.values()]]));
  }

  /** The analysis of exactly this document version, computed now if needed. Never throws. */
  get(doc: TextDocument): Snapshot {
    let state = this.states.get(doc.uri);
    if (!state) {
      state = { settingsGeneration: -1, dependencies: new Map(), fileProblems: [] };
      this.states.set(doc.uri, state);
    }
    const s = state.snapshot;
    // Keyed on the text as well as the version: a client that reuses an older version number
    // must not be answered from the snapshot of another text.
    if (s && s.version === doc.version && s.text === doc.getText() && state.settingsGeneration === this.generation) return s;
    const fresh = this.analyse(doc, state);
    state.snapshot = fresh;
    state.settingsGeneration = this.generation;
    this.hooks.analyzed(fresh);
    return fresh;
  }

  private analyse(doc: TextDocument, state: DocState): Snapshot {
    const t0 = performance.now();
    const text = doc.getText();
    const settings = this.settingsFor(doc.uri);
    try {
      const path = uriToPath(doc.uri);
      // Editor settings are the resolver's lowest layer above the defaults; workspace config
      // files and the script header win over them, as in `rungs lint`.
      const baseDir = this.folderOf(path);
      const dependencies = new Map<string, string>();
      const ctx = resolveScriptContext(path ?? join(baseDir, 'untitled.rungs'), recordingFs(nodeConfigFs, dependencies), {
        editor: { settings: toConfigObject(settings), baseDir, name: EDITOR_LAYER },
      });
      state.dependencies = dependencies;
      const { output, cache } = analyzeIncremental(
        { text, data: this.data, options: ctx.options, lexicon: ctx.lexicon, reuse: state.reuse },
        state.cache,
      );
      state.cache = cache;
      state.reuse = output.pronouncer;
      const problems = (lines: string[]) => this.lintSafely(doc.uri, output, text, ctx.lint, lines);
      // Problems in files become diagnostics on those files; editor settings have no file to
      // show them in, so those are logged.
      state.fileProblems = ctx.problems.filter((c) => c.file !== EDITOR_LAYER && isAbsolute(c.file));
      this.logConfigProblems(
        ctx.problems.filter((c) => !state.fileProblems.includes(c)).map((c) => `${c.file}: ${c.problem.message}`),
      );
      return makeSnapshot(doc.uri, doc.version, text, output, problems, settings, performance.now() - t0);
    } catch (err) {
      // A bad document (or a bug) becomes a diagnostic, never a crash of the server.
      this.hooks.error(`analysis of ${doc.uri} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
      state.cache = undefined;
      state.reuse = undefined;
      state.fileProblems = [];
      const empty = analyzeIncremental({ text: '', data: this.data }, undefined).output;
      const problem: Problem = {
        rule: 'internal-error',
        severity: 'error',
        message: `Rungs could not analyse this script (${err instanceof Error ? err.message : String(err)}); see the Rungs output for details`,
        line: 0,
        character: 0,
        endLine: 0,
        endCharacter: 0,
      };
      return makeSnapshot(doc.uri, doc.version, text, empty, () => [problem], settings, performance.now() - t0);
    }
  }

  /** Every rule's problems; a rule that throws becomes one problem, never a broken server. */
  private lintSafely(uri: string, output: AnalyzeOutput, text: string, settings: LintSettings, lines: string[]): Problem[] {
    try {
      return lint(output, text, settings, lines);
    } catch (err) {
      this.hooks.error(`checking ${uri} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
      const message = `Rungs could not check this script (${err instanceof Error ? err.message : String(err)}); see the Rungs output for details`;
      return [{ rule: 'internal-error', severity: 'error', message, line: 0, character: 0, endLine: 0, endCharacter: 0 }];
    }
  }

  /** Problems in editor settings are logged once each, not on every keystroke. */
  private logConfigProblems(messages: string[]): void {
    for (const m of messages) {
      if (this.logged.has(m)) continue;
      this.logged.add(m);
      this.hooks.log(m);
    }
  }

  /** The workspace folder holding a script (editor lexicon paths are relative to it). */
  folderOf(scriptPath: string | null): string {
    return (
      (scriptPath && this.workspaceFolders.find((f) => scriptPath.startsWith(f.endsWith(sep) ? f : f + sep))) ??
      this.workspaceFolders[0] ??
      (scriptPath ? dirname(scriptPath) : process.cwd())
    );
  }
}
