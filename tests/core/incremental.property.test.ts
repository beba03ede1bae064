// Property: the incremental path (core/segments.ts, used by the language server) gives exactly
// what a fresh `analyze` of the same text gives, after every edit of a long random sequence:
// items, problems (the core's and every rule's), rung summaries and the parsed script, and what
// the server keeps per rung or per problem: lines, ladder statistics, session lengths (code lens),
// converted diagnostics and the published message. Edits
// are typed text, deletions, line splits and joins, rung headers added and removed, settings and
// pronunciations changed, and editor options changed. The reference is the CLI's own path.
import { fc, test } from '@fast-check/vitest';
import { expect, it } from 'vitest';
import { analyze, type AnalyzeOutput } from '../../server/src/core/analyze';
import { defaultOptions } from '../../server/src/core/options';
import { analyzeSegments, segmentLines, segmentsOf, type SegmentState } from '../../server/src/core/segments';
import { splitLines } from '../../server/src/core/parse';
import { planSession, sessionLengths } from '../../server/src/core/timing';
import { diagnosticsOf, messageBytes } from '../../server/src/lsp/diagnostics';
import { toLspDiagnostic } from '../../server/src/lsp/convert';
import { rungStat } from '../../server/src/rules/shared';
import { LADDER_METRICS } from '../../server/src/rules/types';
import type { AnalysisOptions } from '../../server/src/core/types';
import { lint, renderFindings } from '../../server/src/rules/index';
import { words } from '../helpers/data';
import { bigScript } from '../lsp/bigScript';

const START = bigScript(60, 12);

const URI = 'file:///w/a.rungs';

/**
 * What the language server builds on the analysis, kept per rung and converted once per problem:
 * the lines, every rung's summary on every ladder metric, the session lengths the code lens and
 * hovers show, the problems as LSP diagnostics and the bytes of their publish message. For the
 * incremental path these come from what the previous analyses kept; the fresh one works them out.
 */
const served = (a: AnalyzeOutput, text: string, lines: string[]) => {
  const problems = lint(a, text, undefined, lines);
  const diagnostics = diagnosticsOf(problems, URI);
  const message = { jsonrpc: '2.0', method: 'textDocument/publishDiagnostics', params: { uri: URI, version: 1, diagnostics } };
  return JSON.stringify({
    lines,
    stats: LADDER_METRICS.map((m) => a.rungs.filter((r) => r.items.length).map((r) => rungStat(r, m)).map((st) => [st.rung.index, st.values, st.median, st.min, st.max])),
    lengths: sessionLengths(a),
    echo: sessionLengths(a, 'echo'),
    diagnostics,
    message: JSON.parse(messageBytes(message as never).toString('utf-8')),
  });
};

/**
 * Everything a reader of the analysis sees: the parsed script, every item's scores, every rung's
 * summary, the core's problems and every rule's (lint). Words are compared by their scores.
 */
const view = (a: AnalyzeOutput, text: string) =>
  JSON.stringify({
    script: a.script,
    options: a.options,
    rungs: a.rungs.map((r) => [r.index, r.node.line, r.paces.map((p) => p.label), r.median, r.min, r.max, r.totalSeconds, r.items.length]),
    items: a.items.map((i) => [
      i.node.line, i.node.textStart, i.node.text, i.rung, i.rank, i.difficulty, i.wordCount, i.syllables, i.phonemes, i.wcm,
      i.zipfMean, i.zipfMin, i.estimatedWords, i.sets, i.timings.map((t) => t.seconds), i.words.map((w) => [w.start, w.spoken, w.source, w.syllables]),
    ]),
    problems: renderFindings(a.findings),
    lint: lint(a, text),
  });

const SNIPPETS = [
  'e', ' ', 'the ', 'Dr. ', '3:30 ', 'read(2) ', '| note #id', '| @set trained', '// rungs: allow item-outlier', '//', '@',
  '\n', '\r\n', '\n\n', '== New rung\n', '== Fast @pace 2.5 wps\n', '  == Indented\n', '@pace 0.5 wps\n', '@set a, b\n',
  '@paces 1, 2 sps\n', '@say clarinet = K L EH1 R IH0 N EH2 T\n', '@say zork = Z AO1 R K\n', '@max-step 5\n', '@title X\n',
  '@weights 1, 0, 0\n', '@pacse 2\n', 'Zork plays the clarinet.\n', 'Good morning.\n', '==', '@say read = 2\n',
];

type Edit =
  | { kind: 'insert'; at: number; text: string }
  | { kind: 'delete'; at: number; length: number }
  | { kind: 'deleteLine'; line: number }
  | { kind: 'options'; maxStep: number };

const editArb: fc.Arbitrary<Edit> = fc.oneof(
  { weight: 6, arbitrary: fc.record({ kind: fc.constant('insert' as const), at: fc.nat(), text: fc.constantFrom(...SNIPPETS) }) },
  { weight: 3, arbitrary: fc.record({ kind: fc.constant('delete' as const), at: fc.nat(), length: fc.integer({ min: 1, max: 40 }) }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant('deleteLine' as const), line: fc.nat() }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant('options' as const), maxStep: fc.integer({ min: 1, max: 30 }) }) },
);

function apply(text: string, e: Edit): string {
  if (e.kind === 'insert') {
    const at = e.at % (text.length + 1);
    // Whole lines go in at a line start, as a person adds a header or a setting line.
    const start = e.text.endsWith('\n') ? text.lastIndexOf('\n', at - 1) + 1 : at;
    return text.slice(0, start) + e.text + text.slice(start);
  }
  if (e.kind === 'delete') {
    const at = e.at % (text.length + 1);
    return text.slice(0, at) + text.slice(at + e.length);
  }
  if (e.kind === 'deleteLine') {
    const lines = text.split('\n');
    lines.splice(e.line % lines.length, 1);
    return lines.join('\n');
  }
  return text;
}

/** How many edits took the rung-by-rung path, over every run (see the last test). */
let fastEdits = 0;

test.prop([fc.array(editArb, { minLength: 40, maxLength: 60 })], { numRuns: 40 })(
  'after every random edit the incremental analysis equals a fresh one',
  (edits) => {
    let text = START;
    let options: AnalysisOptions = defaultOptions();
    let state: SegmentState | undefined = analyzeSegments({ text, data: words, options }, undefined);
    // The fresh analysis reuses only word scores (by spelling), as the CLI does within one run;
    // it parses and scores every item again and has no item or rung cache.
    let reuse = analyze({ text, data: words, options }).pronouncer;
    for (const e of edits) {
      if (e.kind === 'options') options = { ...defaultOptions(), maxStep: e.maxStep };
      text = apply(text, e);
      state = analyzeSegments({ text, data: words, options }, state);
      if (state.redone) fastEdits++;
      const fresh = analyze({ text, data: words, options, reuse });
      reuse = fresh.pronouncer;
      expect(view(state.output, text)).toBe(view(fresh, text));
      expect(served(state.output, text, segmentLines(state))).toBe(served(fresh, text, splitLines(text)));
    }
  },
  300_000,
);

it('the property above exercised the rung-by-rung path, not only the full one', () => {
  expect(fastEdits).toBeGreaterThan(100);
});

it('a one-character edit inside a rung re-does that rung only', () => {
  const first = analyzeSegments({ text: START, data: words }, undefined);
  const lines = START.split('\n');
  const line = lines.findIndex((l, i) => i > 20 && /^[A-Z]/.test(l));
  lines[line] = `${lines[line].slice(0, 3)}e${lines[line].slice(3)}`;
  const next = analyzeSegments({ text: lines.join('\n'), data: words }, first);
  const rung = next.output.items.find((i) => i.node.line === line)!.rung;
  expect(next.redone).toEqual([rung]);
  // Untouched rungs are the very same objects as before.
  expect(next.output.rungs.filter((r) => r.index !== rung).every((r) => first.output.rungs.includes(r))).toBe(true);
});

test.prop([fc.string({ unit: fc.constantFrom('a', ' ', '=', '\n', '\r', '\t', '\u00a0', '@') , maxLength: 60 })])(
  'segments cut the text at rung header lines and cover it whole',
  (text) => {
    const segs = segmentsOf(text);
    // computed: joining the segments gives the text back, and every segment after the head
    // starts with a line whose text starts with "==" (the parser's rung header test).
    expect(segs.map((s) => s.text).join('')).toBe(text);
    const lines = text.split(/\r\n|\r|\n/);
    const headers = lines.flatMap((l, i) => (l.trimStart().startsWith('==') ? [i] : []));
    expect(segs.slice(1).map((s) => s.line)).toEqual(headers);
  },
);

it('kept session lengths equal planning afresh, and kept diagnostics equal converting afresh', () => {
  // A fresh analysis (nothing kept yet) checked against the functions the caches stand in for.
  const a = analyze({ text: START, data: words });
  const lengths = sessionLengths(a);
  for (const r of a.rungs) {
    // computed: a rung's length is its own plan's (planSession with that rung and pace).
    expect(lengths.rungs[r.index].paces.map((p) => p.seconds)).toEqual(r.paces.map((pace) => planSession(a, { rung: r.index, pace }).seconds));
  }
  // computed: the whole script's length is the plan of every rung at that pace, summed rung by rung.
  for (const [k, pace] of a.options.paces.entries()) expect(lengths.script[k].seconds).toBeCloseTo(planSession(a, { pace }).seconds, 9);
  const problems = lint(a, START);
  expect(JSON.stringify(diagnosticsOf(problems, URI))).toBe(JSON.stringify(problems.map((p) => toLspDiagnostic(p, URI))));
});
