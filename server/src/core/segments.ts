// Incremental analysis of an edited script, rung by rung. A script is cut into segments at its
// rung headers: the head (settings, and items before any header) and one segment per rung. When
// an edit leaves the head alone and touches only rungs that hold nothing script-wide (no `@say`,
// no script setting), only those rungs are parsed and scored again; the rungs after them keep
// their analyses, moved down or up by the lines the edit added or removed. Anything else is
// analysed whole. Either way the result equals `analyze` of the same text
// (tests/core/incremental.property.test.ts checks this over thousands of random edits).
import { analyze, analyzeRung, type AnalyzeInput, type AnalyzeOutput, type RungContext } from './analyze';
import { parseScript, RUNG_KEYS, splitLabels, splitLines } from './parse';
import { concatAll, pushAll } from './arrays';
import type { Finding } from './findings';
import type { CommentLine, ItemAnalysis, RungAnalysis, RungNode, Setting } from './types';

/** A rung's part of the text: from its header line to the line before the next header. */
interface Segment {
  /** 0-based line of the segment's first line. */
  line: number;
  text: string;
  /**
   * Its part of the whole text's lines (splitLines): without the empty line after its last line
   * break, for every segment but the last. Worked out when first asked for and kept while its
   * text is (a segment stays last or not while the script keeps its number of rungs, which the
   * incremental path requires).
   */
  body?: string[];
}

/** What the next incremental analysis of the same document needs from this one. */
export interface SegmentState {
  inputKey: string;
  segments: Segment[];
  output: AnalyzeOutput;
  /** Rungs parsed and scored again by this analysis; null when the whole script was. */
  redone: number[] | null;
  /** The text's lines, joined from the segments' (segmentLines). */
  lines?: string[];
}

/**
 * A copy of a part of the text that does not keep the whole text alive. A slice of a string may
 * point into it, so a rung kept across edits would hold on to the text of the version it was read
 * from; a copy holds only its own characters.
 */
export function detach(part: string): string {
  return part.length ? (' ' + part).slice(1) : '';
}

/**
 * The text's lines (as splitLines gives them), from the segments' own: a segment an edit did not
 * touch keeps its lines, so an edit splits the rungs it changed and joins the arrays.
 */
export function segmentLines(state: SegmentState): string[] {
  if (state.lines) return state.lines;
  const last = state.segments.length - 1;
  // Every segment but the last ends with its last line's break: leave out the empty line after it.
  const parts = state.segments.map((s, k) => {
    if (s.body) return s.body;
    const own = splitLines(detach(s.text));
    return (s.body = k < last ? own.slice(0, -1) : own);
  });
  return (state.lines = concatAll(parts));
}

/** Segments: [head, rung 1, rung 2, ...]; a rung header is a line whose text starts with `==`. */
export function segmentsOf(text: string): Segment[] {
  const out: Segment[] = [];
  let segStart = 0;
  let segLine = 0;
  let line = 0;
  let i = 0;
  const n = text.length;
  const HEADER = /[^\S\r\n]*==/y;
  const noCr = !text.includes('\r');
  while (i <= n) {
    // i is the start of a line.
    const c = text.charCodeAt(i);
    if (i < n && (c === 0x3d || c === 0x20 || c === 0x09 || c > 0x7f || c === 0x0b || c === 0x0c)) {
      HEADER.lastIndex = i;
      if (HEADER.test(text)) {
        out.push({ line: segLine, text: text.slice(segStart, i) });
        segStart = i;
        segLine = line;
      }
    }
    // Find the end of this line (\r\n, \r or \n, as splitLines reads them); text without a
    // carriage return is searched natively.
    let j: number;
    if (noCr) {
      j = text.indexOf('\n', i);
      if (j < 0) j = n;
    } else {
      j = i;
      while (j < n) {
        const d = text.charCodeAt(j);
        if (d === 0x0a || d === 0x0d) break;
        j++;
      }
    }
    if (j >= n) break;
    i = text.charCodeAt(j) === 0x0d && text.charCodeAt(j + 1) === 0x0a ? j + 2 : j + 1;
    line++;
  }
  out.push({ line: segLine, text: text.slice(segStart) });
  return out;
}

function inputKey(input: AnalyzeInput): string {
  return JSON.stringify([input.options ?? null, input.lexicon ?? null]);
}

/** Every setting and override of the parse lies in the head (before the first rung header). */
function scriptWideInHead(output: AnalyzeOutput, headEnd: number): boolean {
  const s = output.script;
  return s.header.every((h) => h.line < headEnd) && s.overrides.every((o) => o.line < headEnd);
}

const shiftRange = <T extends { line: number; endLine: number }>(r: T, d: number): T => ({ ...r, line: r.line + d, endLine: r.endLine + d });

/** A finding moved by d lines (findings carry their range only: no related places, no fix). */
const shiftFinding = (f: Finding, d: number): Finding => shiftRange(f, d);

function shiftSetting(s: Setting, d: number): Setting {
  return { ...s, line: s.line + d };
}

function shiftNode(n: RungNode, d: number): RungNode {
  const items = n.items.map((it) => ({ ...it, line: it.line + d }));
  return { ...n, line: n.line + d, endLine: n.endLine + d, settings: n.settings.map((s) => shiftSetting(s, d)), items };
}

/** A rung's analysis moved by d lines: new nodes, the same scores. */
function shiftRung(r: RungAnalysis, d: number): RungAnalysis {
  const node = shiftNode(r.node, d);
  const items: ItemAnalysis[] = r.items.map((it, k) => ({ ...it, node: node.items[k] }));
  return { ...r, node, items };
}

/** Where each problem, comment and rung of an analysis sits: in which segment. */
function segmentIndex(segments: Segment[], line: number): number {
  let lo = 0;
  let hi = segments.length - 1;
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1;
    if (segments[mid].line <= line) lo = mid;
    else hi = mid - 1;
  }
  return lo;
}

function groupBySegment<T>(segments: Segment[], xs: T[], lineOf: (x: T) => number): T[][] {
  const out: T[][] = segments.map(() => []);
  for (const x of xs) out[segmentIndex(segments, lineOf(x))].push(x);
  return out;
}

/**
 * Analyses `input.text`, reusing `previous` (the state of the last analysis of the same document)
 * where the edit allows. Returns the analysis and the state for the next call.
 */
export function analyzeSegments(input: AnalyzeInput, previous: SegmentState | undefined): SegmentState {
  const key = inputKey(input);
  const segments = segmentsOf(input.text);
  const redone: number[] = [];
  const fast = previous && previous.inputKey === key ? reanalyse(input, previous, segments, redone) : null;
  if (fast) return { inputKey: key, segments, output: fast, redone };
  const output = analyze({ ...input, reuse: input.reuse ?? previous?.output.pronouncer, itemCache: input.itemCache ?? previous?.output.itemCache });
  return { inputKey: key, segments, output, redone: null };
}

function reanalyse(input: AnalyzeInput, prev: SegmentState, segments: Segment[], redone: number[]): AnalyzeOutput | null {
  const old = prev.output;
  const before = prev.segments;
  if (segments.length !== before.length || segments.length < 2 || segments[0].text !== before[0].text) return null;
  if (!scriptWideInHead(old, before[1].line)) return null;
  const changed: number[] = [];
  for (let k = 1; k < segments.length; k++) {
    if (segments[k].text !== before[k].text) changed.push(k);
    // A segment the edit left alone keeps the lines worked out before.
    else segments[k].body = before[k].body;
  }
  segments[0].body = before[0].body;
  if (!changed.length) return old;
  // A rung segment maps to rung k - 1, or k when the head holds an implicit rung of items.
  const offset = old.rungs.length - (before.length - 1);
  if (offset !== 0 && offset !== 1) return null;

  // Parse each changed rung alone; anything script-wide in it sends the edit down the full path.
  const parsed = new Map<number, ReturnType<typeof parseScript>>();
  for (const k of changed) {
    // Parsed from a copy: the rung's nodes (kept while later edits leave the rung alone) must not
    // hold this version of the whole text.
    const p = parseScript(detach(segments[k].text));
    if (p.header.length || p.overrides.length || p.rungs.length !== 1 || p.rungs[0].implicit) return null;
    if (p.rungs[0].settings.some((s) => !RUNG_KEYS.has(s.key))) return null;
    parsed.set(k, p);
  }

  const oldFindings = groupBySegment(before, old.findings, (f) => f.line);
  const oldComments = groupBySegment(before, old.script.comments, (c) => c.line);
  const oldParse = groupBySegment(before, old.script.findings, (f) => f.line);
  const entries = old.itemCache.entries;
  const shared: RungContext = {
    options: old.options,
    scriptSets: old.script.header.filter((h) => h.key === 'set' || h.key === 'sets').flatMap((h) => splitLabels(h.value)),
    pronouncer: old.pronouncer.pronouncer,
    previous: undefined,
    entries,
  };

  const rungs: RungAnalysis[] = offset ? [old.rungs[0]] : [];
  const findings: Finding[] = [...oldFindings[0]];
  const comments: CommentLine[] = [...oldComments[0]];
  const parseFindings: Finding[] = [...oldParse[0]];
  for (let k = 1; k < segments.length; k++) {
    const d = segments[k].line - before[k].line;
    const index = k - 1 + offset;
    const p = parsed.get(k);
    if (p) {
      const at = segments[k].line;
      const node = shiftNode(p.rungs[0], at);
      const own = p.findings.map((f) => shiftFinding(f, at));
      pushAll(parseFindings, own);
      for (const c of p.comments) comments.push({ ...c, line: c.line + at });
      const found: Finding[] = [...own];
      rungs.push(analyzeRung(node, index, shared, found));
      redone.push(index);
      found.sort((a, b) => a.line - b.line || a.character - b.character);
      pushAll(findings, found);
      continue;
    }
    const r = old.rungs[index];
    rungs.push(d === 0 ? r : shiftRung(r, d));
    for (const f of oldFindings[k]) findings.push(d === 0 ? f : shiftFinding(f, d));
    for (const f of oldParse[k]) parseFindings.push(d === 0 ? f : shiftFinding(f, d));
    for (const c of oldComments[k]) comments.push(d === 0 ? c : { ...c, line: c.line + d });
  }
  const items = concatAll(rungs.map((r) => r.items));
  // The cache keeps every item seen since the last full analysis; a long session of edits
  // starts a fresh one (the full path keeps only the items in use) before it grows large.
  if (entries.size > 2 * items.length + 1000) return null;
  const lineCount = segments[segments.length - 1].line + segments[segments.length - 1].text.split(/\r\n|\r|\n/).length;
  return {
    ...old,
    script: { ...old.script, rungs: rungs.map((r) => r.node), comments, findings: parseFindings, lineCount },
    rungs,
    items,
    findings,
  };
}
