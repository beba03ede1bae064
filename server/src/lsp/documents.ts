// Open scripts and their analyses. Each document keeps its last analysis, its Pronouncer and its
// item cache, so a request always gets the analysis of the text it was sent against (analysed
// synchronously when the text or the settings moved on) and an edit re-scores only what changed.
import { dirname, isAbsolute, join, sep } from 'node:path';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { checkScript, mergeFileProblems, type CheckCache, type FileProblem } from '../check/checkScript';
import { analyze, type AnalyzeOutput } from '../core/analyze';
import { splitLines } from '../core/parse';
import type { ItemAnalysis, Problem, RungAnalysis, WordData } from '../core/types';
import { clearConfigCache, type ResolveOptions } from '../config/resolve';
import { nodeFs, pathKey, uriToPath } from '../node/nodeFs';
import { analysisFailed } from '../rules/internalError';
import type { LintSettings } from '../rules/types';
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
  /** The resolved lint settings the rules run with: the ladder view, hover and lenses use the same metric and step. */
  lint: LintSettings;
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
  cache?: CheckCache;
  /** Every file the resolver read or looked for (config files and lexicons, found or missing), by pathKey. */
  dependencies: Map<string, string>;
  /** Problems in config and lexicon files (absolute paths) from the last analysis. */
  fileProblems: FileProblem[];
}

export { uriToPath };

function makeSnapshot(
  uri: string,
  version: number,
  text: string,
  analysis: AnalyzeOutput,
  split: () => string[],
  problems: (lines: string[]) => Problem[],
  settings: RungsSettings,
  lint: LintSettings,
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
      return (lines ??= split());
    },
    analysis,
    get problems() {
      return (linted ??= problems((lines ??= split())));
    },
    settings,
    lint,
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
    return mergeFileProblems([...this.states.values()].map((st) => st.fileProblems));
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
    const fresh = this.analyzeDocument(doc, state);
    state.snapshot = fresh;
    state.settingsGeneration = this.generation;
    this.hooks.analyzed(fresh);
    return fresh;
  }

  private analyzeDocument(doc: TextDocument, state: DocState): Snapshot {
    const t0 = performance.now();
    const text = doc.getText();
    const settings = this.settingsFor(doc.uri);
    try {
      const path = uriToPath(doc.uri);
      // Editor settings are the resolver's lowest layer above the defaults; workspace config
      // files and the script header win over them, as in `rungs lint`.
      const editor = this.editorLayer(doc.uri, path);
      const checked = checkScript({
        text,
        path: path ?? join(editor.baseDir, 'untitled.rungs'),
        fs: nodeFs,
        data: this.data,
        editor,
        cache: state.cache,
      });
      state.dependencies = new Map(checked.dependencies.map((p) => [pathKey(p), p]));
      state.cache = checked.cache;
      // Problems in files become diagnostics on those files; editor settings have no file to
      // show them in, so those are logged.
      state.fileProblems = checked.fileProblems.filter((c) => c.file !== EDITOR_LAYER && isAbsolute(c.file));
      this.logConfigProblems(
        checked.fileProblems.filter((c) => !state.fileProblems.includes(c)).map((c) => `${c.file}: ${c.problem.message}`),
      );
      return makeSnapshot(doc.uri, doc.version, text, checked.analysis, () => checked.lines, (lines) => this.lintSafely(doc.uri, () => checked.problemsWith(lines)), settings, checked.lint, performance.now() - t0);
    } catch (err) {
      // A bad document (or a bug) becomes a diagnostic, never a crash of the server.
      this.hooks.error(`analysis of ${doc.uri} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
      state.cache = undefined;
      state.fileProblems = [];
      const empty = analyze({ text: '', data: this.data });
      return makeSnapshot(doc.uri, doc.version, text, empty, () => splitLines(text), () => [analysisFailed(err)], settings, { severities: {} }, performance.now() - t0);
    }
  }

  /** Every rule's problems; a failure outside the rules' own guard becomes one problem, never a broken server. */
  private lintSafely(uri: string, problems: () => Problem[]): Problem[] {
    try {
      return problems();
    } catch (err) {
      this.hooks.error(`checking ${uri} failed: ${err instanceof Error ? err.stack ?? err.message : String(err)}`);
      return [analysisFailed(err)];
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

  /**
   * A document's editor settings as the resolver's editor layer (scripts and records files alike):
   * config-file shape, lexicon paths relative to the document's workspace folder.
   */
  editorLayer(uri: string, path: string | null): NonNullable<ResolveOptions['editor']> & { name: string } {
    return { settings: toConfigObject(this.settingsFor(uri)), baseDir: this.folderOf(path), name: EDITOR_LAYER };
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
