// The plain data a report is drawn from: one `ScriptReport` per script, built from the analysis
// and the lint results. JSON-safe (the language server sends it to the editor, which draws the
// same report), with 1-based lines as people read them.
import { compareSets, type SetComparison } from '../core/sets';
import type { Analysis, ItemAnalysis, Problem, Severity } from '../core/types';
import type { LadderStep } from '../lsp/contract';
import { ladderSteps } from './ladderSteps';
import { buildPlan, type ReportPlan } from './planSection';

export interface ReportItem {
  line: number;
  text: string;
  id: string | null;
  note: string | null;
  sets: string[];
  words: number;
  syllables: number;
  phonemes: number;
  wcm: number;
  zipfMean: number;
  zipfMin: number;
  lowFrequencyWords: number;
  /** Spoken words whose pronunciation is estimated (no dictionary entry or override). */
  estimated: string[];
  difficulty: number;
  rank: number;
  /** Seconds at each of the rung's paces, in the order of `ReportRung.paces`. */
  seconds: number[];
}

export interface ReportProblem {
  line: number;
  column: number;
  severity: Severity;
  rule: string;
  message: string;
}

export interface ReportRung {
  name: string;
  line: number;
  paces: string[];
  /** Median, easiest and hardest difficulty; null for a rung without items. */
  median: number | null;
  min: number | null;
  max: number | null;
  totalSeconds: number[];
  items: ReportItem[];
  /** Problems on the rung's header or items, in line order. */
  problems: ReportProblem[];
}

export interface ScriptReport {
  /** The file as the user named it (relative to the working folder), or a display name. */
  file: string;
  title: string | null;
  paces: string[];
  /** The client's unassisted rate in words per second, when the script states it. */
  baseline: number | null;
  direction: 'rising' | 'falling';
  maxStep: number;
  rungs: ReportRung[];
  /** Steps between neighbouring rungs with items; rung indices into `rungs`. */
  steps: LadderStep[];
  /** Problems outside every rung (header settings, config files), in line order. */
  scriptProblems: ReportProblem[];
  /** Session lengths per rung and pace with gaps, from the cue timing plan (core/timing.ts). */
  plan: ReportPlan;
  /** Balance of the labelled item sets (core/sets.ts), as the script's set settings ask. */
  sets: SetComparison;
}

/** The facts of an item every output shows first, under these names (JSON schema, report). */
export function itemFacts(it: ItemAnalysis) {
  return {
    line: it.node.line + 1,
    text: it.node.text,
    id: it.node.id,
    note: it.node.note,
    sets: it.sets,
    words: it.wordCount,
    syllables: it.syllables,
    phonemes: it.phonemes,
    wcm: it.wcm,
  };
}

const finite = (n: number): number | null => (Number.isFinite(n) ? n : null);

function reportProblem(p: Problem): ReportProblem {
  return { line: p.line + 1, column: p.character + 1, severity: p.severity, rule: p.rule, message: p.message };
}

export function buildScriptReport(file: string, a: Analysis, problems: Problem[]): ScriptReport {
  const title = a.script.header.find((h) => h.key === 'title')?.value.trim() || null;
  const sorted = [...problems].sort((x, y) => x.line - y.line || x.character - y.character);
  const claimed = new Set<Problem>();
  const rungs: ReportRung[] = a.rungs.map((r, i) => {
    // A rung owns the lines from its header up to the next rung's header.
    const start = Math.min(r.node.line, ...r.items.map((it) => it.node.line));
    const next = a.rungs[i + 1];
    const end = next ? Math.min(next.node.line, ...next.items.map((it) => it.node.line)) : Infinity;
    const own = sorted.filter((p) => p.line >= start && p.line < end);
    for (const p of own) claimed.add(p);
    const empty = r.items.length === 0;
    return {
      name: r.node.name,
      line: r.node.line + 1,
      paces: r.paces.map((p) => p.label),
      median: empty ? null : finite(r.median),
      min: empty ? null : finite(r.min),
      max: empty ? null : finite(r.max),
      totalSeconds: r.totalSeconds,
      items: r.items.map((it) => ({
        ...itemFacts(it),
        zipfMean: it.zipfMean,
        zipfMin: it.zipfMin,
        lowFrequencyWords: it.lowFrequencyWords,
        estimated: [...new Set(it.words.filter((w) => w.source === 'estimate' || w.source === 'morphology').map((w) => w.spoken))],
        difficulty: it.difficulty,
        rank: it.rank,
        seconds: it.timings.map((t) => t.seconds),
      })),
      problems: own.map(reportProblem),
    };
  });
  return {
    file,
    title,
    paces: a.options.paces.map((p) => p.label),
    baseline: a.options.baseline,
    direction: a.options.direction,
    maxStep: a.options.maxStep,
    rungs,
    steps: ladderSteps(a, problems),
    scriptProblems: sorted.filter((p) => !claimed.has(p)).map(reportProblem),
    plan: buildPlan(a),
    sets: compareSets(a),
  };
}
