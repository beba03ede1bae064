// The one checking pipeline every edge calls (`rungs lint`, `rungs score`, the language server):
// resolve config (editor settings below config files), analyse (reusing an open document's item
// cache), lint, and gather the problems in config and lexicon files. Pure apart from the injected
// file-system view, so tests run it on an in-memory file system.
import type { AnalyzeOutput, ItemCache } from '../core/analyze';
import { boundText } from '../core/limits';
import { splitLines } from '../core/parse';
import { analyzeSegments, segmentLines, type SegmentState } from '../core/segments';
import type { AnalysisOptions, Problem, WordData } from '../core/types';
import { resolveScriptContext, type ConfigFs } from '../config/resolve';
import { compareProblems, lint, renderFindings } from '../rules/index';
import { applyFixes, batchFixes } from '../rules/fixes';
import type { LintSettings } from '../rules/types';

/** A problem in a file other than the script (a config file, a lexicon, or the editor settings). */
export interface FileProblem {
  file: string;
  problem: Problem;
}

/**
 * What the server keeps between analyses of one open document so an edit redoes only what changed:
 * the last analysis cut into rungs (core/segments.ts: rungs an edit did not touch keep their
 * analyses), its item cache and its word scores. `rungs lint` passes only the word scores on from
 * one script to the next.
 */
export interface CheckCache {
  segments?: SegmentState;
  items?: ItemCache;
  pronouncer?: AnalyzeOutput['pronouncer'];
}

export interface CheckInput {
  text: string;
  /**
   * Where the script lives, for finding its config files. For standard input or an unsaved buffer,
   * a made-up file in the folder to search from (e.g. `<cwd>/stdin.rungs`).
   */
  path: string;
  fs: ConfigFs;
  data: WordData;
  /** Editor settings in config-file shape (server only), layered below config files. */
  editor?: { settings: unknown; baseDir: string; name: string };
  cache?: CheckCache;
  /** Adjusts the resolved options before the script's header applies (e.g. `rungs sets --by`). */
  adjust?: (o: AnalysisOptions) => AnalysisOptions;
}

export interface CheckResult {
  text: string;
  analysis: AnalyzeOutput;
  /**
   * The script's problems: the core's and every rule's, directives and severities applied, sorted.
   * Worked out when first read, so a caller that only needs the analysis never runs the rules.
   */
  readonly problems: Problem[];
  /** The same problems, linted with lines the caller has already split (the server's snapshot). */
  problemsWith(lines: string[]): Problem[];
  /**
   * The text's lines (splitLines), worked out when first read; an incremental analysis joins the
   * lines of the rungs an edit did not touch with those it split again.
   */
  readonly lines: string[];
  /** Problems in config and lexicon files (and the editor-settings layer, by its name). */
  fileProblems: FileProblem[];
  /** Every file the resolver read or looked for (config files and lexicons, found or missing). */
  dependencies: string[];
  /** The resolved lint settings (severities, ladder metric and step) the rules ran with. */
  lint: LintSettings;
  options: AnalysisOptions;
  cache: CheckCache;
}

export function checkScript(input: CheckInput): CheckResult {
  const seen = new Set<string>();
  const recording: ConfigFs = {
    readFile: (p) => (seen.add(p), input.fs.readFile(p)),
    exists: (p) => (seen.add(p), input.fs.exists(p)),
    ...(input.fs.isFile && { isFile: input.fs.isFile.bind(input.fs) }),
    ...(input.fs.realpath && { realpath: input.fs.realpath.bind(input.fs) }),
  };
  const ctx = resolveScriptContext(input.path, recording, input.editor ? { editor: input.editor } : {});
  // Only the part within the size bounds is analysed; the original text stays the result's text.
  const bounded = boundText(input.text);
  const segments = analyzeSegments(
    {
      text: bounded.text,
      data: input.data,
      options: input.adjust ? input.adjust(ctx.options) : ctx.options,
      lexicon: ctx.lexicon,
      reuse: input.cache?.pronouncer,
      itemCache: input.cache?.items,
    },
    input.cache?.segments,
  );
  const cut = bounded.findings.length > 0;
  const analysis = cut ? { ...segments.output, findings: [...segments.output.findings, ...bounded.findings] } : segments.output;
  let problems: Problem[] | undefined;
  let cutLines: string[] | undefined;
  // Positions in the analysed part lie in the original lines too. With a part cut off no fix is
  // offered: a fix built from the part (a sorted rung, say) could drop what lies past the bound.
  const problemsWith = (lines: string[]) =>
    (problems ??= cut ? lint(analysis, bounded.text, ctx.lint, lines).map(({ fix: _fix, ...p }) => p) : lint(analysis, input.text, ctx.lint, lines));
  return {
    text: input.text,
    analysis,
    get problems() {
      return problems ?? problemsWith(this.lines);
    },
    problemsWith,
    get lines() {
      return cut ? (cutLines ??= splitLines(input.text)) : segmentLines(segments);
    },
    fileProblems: ctx.findings.map(({ file, finding }) => ({ file, problem: renderFindings([finding])[0] })),
    dependencies: [...seen],
    lint: ctx.lint,
    options: ctx.options,
    cache: { segments, items: analysis.itemCache, pronouncer: analysis.pronouncer },
  };
}

/** Fixes can enable others (a sorted rung after a removed duplicate): re-check up to this often. */
export const FIX_PASSES = 5;

/**
 * `--fix`: applies the batch fixes (rules/fixes.ts, the same edits as the editor's fix-all) and
 * re-checks, until none is left or FIX_PASSES ran. Quick-fix-only fixes are left alone.
 */
export function checkAndFix(input: CheckInput): CheckResult {
  let cur = checkScript(input);
  for (let pass = 0; pass < FIX_PASSES; pass++) {
    const fixes = batchFixes(cur.problems);
    if (!fixes.length) break;
    const { text } = applyFixes(cur.text, fixes);
    if (text === cur.text) break;
    cur = checkScript({ ...input, text, cache: cur.cache });
  }
  return cur;
}

/**
 * Config-file problems over many scripts that share files: each problem once per file, in
 * position order. Used by `rungs lint` (per run) and the server (over open documents).
 */
export function mergeFileProblems(lists: Iterable<FileProblem[]>): Map<string, Problem[]> {
  const byFile = new Map<string, Map<string, Problem>>();
  for (const list of lists) {
    for (const { file, problem } of list) {
      let m = byFile.get(file);
      if (!m) byFile.set(file, (m = new Map()));
      m.set(JSON.stringify(problem), problem);
    }
  }
  return new Map([...byFile].map(([file, m]) => [file, [...m.values()].sort(compareProblems)]));
}
