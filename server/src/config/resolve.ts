// Resolves what a script is analysed and linted with: built-in defaults, then editor settings (from
// the language server), then workspace config files, then the script's own header (applied inside
// the core). Shared by the CLI and the language server so the editor and CI always agree.
//
// Config files: the first of CONFIG_FILE_NAMES found in each folder, from the script's folder up to
// the file-system root or a file with `root: true`; a nearer file overrides a farther one. They are
// JSON or YAML, never code. Settings keys and values are read by the same table as script headers
// (core/options.ts), so a value means the same thing in both places.
import { dirname, isAbsolute, join, relative, resolve } from 'node:path';
import { applySettings, defaultOptions } from '../core/options';
import { parseLexicon } from '../core/parse';
import { finding, type Finding } from '../core/findings';
import type { AnalysisOptions, Override } from '../core/types';
import type { LadderSettings, LintSettings, SeverityOverrides } from '../rules/types';
import { parseConfigText, parseConfigObject, type ConfigLayer } from './parseConfig';

export { CONFIG_FILE_NAMES, parseConfigText, parseConfigObject, type ConfigLayer } from './parseConfig';
import { CONFIG_FILE_NAMES } from './parseConfig';
import { pushAll } from '../core/arrays';

export interface ScriptContext {
  options: AnalysisOptions;
  lexicon: Override[];
  lint: LintSettings;
  /** What could not be read in config or lexicon files, with the file it is in (rules word them). */
  findings: { file: string; finding: Finding }[];
  /** Config files that applied, farthest first (for watching and for `--print-config`). */
  configFiles: string[];
}

export interface ConfigFs {
  readFile(path: string): string;
  exists(path: string): boolean;
  /** False for pipes, devices and folders (absent: every existing path is a regular file). */
  isFile?(path: string): boolean;
  /** The path with links resolved, to confine lexicons to their folder (absent: the path). */
  realpath?(path: string): string;
}

export interface ResolveOptions {
  /**
   * Settings from the editor, in the shape of a config file (`{ "max-step": 12, rules: {...} }`),
   * layered below config files. `baseDir` resolves their lexicon paths (the workspace folder) and
   * is the highest folder searched for config files (for a script outside it: the script's folder).
   */
  editor?: { settings: unknown; baseDir: string; name?: string };
}

// Parsed files are cached by path and kept while their text is unchanged, so a language server
// re-resolving on every keystroke re-reads but does not re-parse.
const layerCache = new Map<string, { text: string; layer: ConfigLayer }>();
const lexiconCache = new Map<string, { text: string; overrides: Override[]; findings: Finding[] }>();

/** Forgets cached config and lexicon files (the server calls this when watched files change). */
export function clearConfigCache(): void {
  layerCache.clear();
  lexiconCache.clear();
}

function readLayer(file: string, fs: ConfigFs): ConfigLayer | { file: string; error: string } {
  let text: string;
  try {
    text = fs.readFile(file);
  } catch (err) {
    return { file, error: (err as NodeJS.ErrnoException).code ?? String(err) };
  }
  const hit = layerCache.get(file);
  if (hit && hit.text === text) return hit.layer;
  let layer: ConfigLayer;
  try {
    layer = parseConfigText(text, file);
  } catch (err) {
    // The YAML library recurses over nesting; a file nested thousands deep must not stop the run.
    return { file, error: `cannot read the config file (${err instanceof RangeError ? 'nested too deeply' : String(err)})` };
  }
  layerCache.set(file, { text, layer });
  return layer;
}

/**
 * The config files that apply to a script, farthest first (pure: only `fs` is read). The walk goes
 * up to the root or a file with `root: true`; with `top`, it also ends at that folder (or, for a
 * script outside it, at the script's own folder).
 */
export function findConfigFiles(scriptPath: string, fs: ConfigFs, top?: string): ConfigLayer[] {
  const found: ConfigLayer[] = [];
  let dir = dirname(scriptPath);
  const last = top === undefined ? undefined : inside(resolve(top), resolve(dir)) ? resolve(top) : resolve(dir);
  for (;;) {
    const name = CONFIG_FILE_NAMES.find((n) => fs.exists(join(dir, n)));
    if (name) {
      const layer = readLayer(join(dir, name), fs);
      if ('error' in layer) {
        found.push(parseConfigObject({}, layer.file, dirname(layer.file), [finding(FILE_START, { kind: 'config-unreadable', code: layer.error })]));
      } else {
        found.push(layer);
        if (layer.root) break;
      }
    }
    const up = dirname(dir);
    if (up === dir || (last !== undefined && resolve(dir) === last)) break;
    dir = up;
  }
  return found.reverse();
}

const FILE_START = { line: 0, character: 0, endLine: 0, endCharacter: 1 };

function readLexicon(file: string, fs: ConfigFs, origin: string): { overrides: Override[]; findings: Finding[] } {
  const text = fs.readFile(file);
  const hit = lexiconCache.get(file);
  if (hit && hit.text === text) return hit;
  const parsed = parseLexicon(text, origin);
  lexiconCache.set(file, { text, ...parsed });
  return parsed;
}

/**
 * Context for one script path: defaults < editor settings < config files (farthest first) and,
 * inside the core, the script header on top. For standard input pass a path inside the folder to
 * search from (e.g. `<cwd>/stdin.rungs`).
 */
export function resolveScriptContext(path: string, fs: ConfigFs, opts: ResolveOptions = {}): ScriptContext {
  const layers: ConfigLayer[] = [];
  if (opts.editor) {
    layers.push(parseConfigObject(opts.editor.settings, opts.editor.name ?? 'editor settings', opts.editor.baseDir));
  }
  // In the editor, config files are looked for up to the workspace folder only: one a folder
  // above it (a home folder, a shared drive) is not the workspace's and is not read.
  layers.push(...findConfigFiles(path, fs, opts.editor?.baseDir));

  let options = defaultOptions();
  const severities: SeverityOverrides = {};
  let ladder: LadderSettings = {};
  const lexicon: Override[] = [];
  const findings: ScriptContext['findings'] = [];
  for (const layer of layers) {
    for (const f of layer.findings) findings.push({ file: layer.file, finding: f });
    const applied = applySettings(options, layer.settings, 'config');
    options = applied.options;
    for (const f of applied.findings) findings.push({ file: layer.file, finding: f });
    Object.assign(severities, layer.rules);
    ladder = { ...ladder, ...layer.ladder };
    const roots = [layer.fromFile ? dirname(layer.file) : opts.editor?.baseDir, opts.editor?.baseDir].filter((r): r is string => Boolean(r));
    for (const entry of layer.lexicon) {
      const refused = lexiconRefusal(entry.path, roots, fs);
      if (refused) {
        findings.push({ file: layer.file, finding: finding(entry.range, { kind: 'lexicon-refused', name: entry.name, reason: refused }) });
        continue;
      }
      if (!fs.exists(entry.path)) {
        findings.push({ file: layer.file, finding: finding(entry.range, { kind: 'lexicon-missing', name: entry.name, path: entry.path }) });
        continue;
      }
      try {
        const lex = readLexicon(entry.path, fs, entry.name);
        pushAll(lexicon, lex.overrides);
        for (const f of lex.findings) findings.push({ file: entry.path, finding: f });
      } catch (err) {
        findings.push({ file: layer.file, finding: finding(entry.range, { kind: 'lexicon-unreadable', name: entry.name, code: (err as NodeJS.ErrnoException).code ?? String(err) }) });
      }
    }
  }
  const lint: LintSettings = { severities };
  if (Object.keys(ladder).length) lint.ladder = ladder;
  return { options, lexicon, lint, findings, configFiles: layers.filter((l) => l.fromFile).map((l) => l.file) };
}

/** True when `path` is `root` or lies below it. */
function inside(root: string, path: string): boolean {
  const r = relative(root, path);
  return r === '' || (!r.startsWith('..') && !isAbsolute(r));
}

/**
 * Why a lexicon may not be read, or null. A config file may name only files in its own folder tree
 * (or, in the editor, the workspace folder): a config that arrives with a checked-out project must
 * not read the machine's other files into lint output. Links are resolved before the check.
 */
function lexiconRefusal(path: string, roots: string[], fs: ConfigFs): string | null {
  const real = (p: string) => (fs.realpath ? fs.realpath(p) : p);
  const ok = roots.some((root) => inside(resolve(root), resolve(path)) && (!fs.exists(path) || inside(real(root), real(path))));
  if (!ok) return 'is outside the folder of the config file that names it (a lexicon must be in that folder or below it)';
  if (fs.exists(path) && fs.isFile && !fs.isFile(path)) return 'is not a regular file';
  return null;
}
