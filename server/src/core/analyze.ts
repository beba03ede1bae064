// The analysis core: text and options in, plain data out. No files, no protocol, no process:
// the CLI, the language server and the tests all call `analyze` the same way.
import { finding, type Finding } from './findings';
import { composite, difficultyComponents, medianOfSorted } from './difficulty';
import { applySettings, defaultOptions } from './options';
import { scoringKey } from './settings';
import { timeAt } from './pace';
import { parseScript, splitLabels } from './parse';
import { Pronouncer, type WordScore } from './pronounce';
import { tokenize } from './tokenize';
import { plainItemWords } from './plainWords';
import { ItemTotals } from './itemTotals';
import type {
  Analysis,
  AnalysisOptions,
  ItemAnalysis,
  ItemNode,
  Override,
  Pace,
  PaceTiming,
  RungAnalysis,
  RungNode,
  WordAnalysis,
  WordData,
} from './types';
import { pushAll } from './arrays';

export interface AnalyzeInput {
  text: string;
  data: WordData;
  /** Defaults merged with any workspace config; the script header is applied on top. */
  options?: AnalysisOptions;
  /** Workspace lexicon overrides; the script's own `@say` lines win over them. */
  lexicon?: Override[];
  /**
   * A pronouncer to reuse between analyses of the same document (the language server keeps one
   * per document so unchanged words are not scored again). Used only when its key matches.
   */
  reuse?: { key: string; pronouncer: Pronouncer };
  /**
   * Item analyses of the previous run of the same document. Items whose text, indentation and
   * paces are unchanged are taken from it instead of being tokenised and scored again, so a
   * one-character edit of a 10,000-item script re-scores one item.
   */
  itemCache?: ItemCache;
}

export interface AnalyzeOutput extends Analysis {
  /** The pronouncer used, with a key for reuse on the next analysis. */
  pronouncer: { key: string; pronouncer: Pronouncer };
  /** The item cache to pass to the next analysis of the same document. */
  itemCache: ItemCache;
}

export interface CachedItem {
  /** The paces (labels joined) and text column the item was scored with: a hit needs both equal. */
  paces: string;
  textStart: number;
  item: ItemAnalysis;
  /** Findings while scoring the item (their line is rewritten on reuse). */
  findings: readonly Finding[];
}

export interface ItemCache {
  /** Everything besides an item's own text, paces and column that its analysis depends on. */
  context: string;
  /** By item text (the string the parse made: no key is built per item). */
  entries: Map<string, CachedItem>;
}

/**
 * A word where it stands in an item. Everything that does not depend on position is shared with
 * the pronouncer's per-spelling score, so a 10,000-item script allocates little per word.
 */
class PlacedWord implements WordAnalysis {
  constructor(
    readonly surface: string,
    readonly start: number,
    readonly end: number,
    readonly spoken: string,
    private readonly score: WordScore,
  ) {}
  get phones() { return this.score.phones; }
  get source() { return this.score.source; }
  get variant() { return this.score.variant; }
  get variants() { return this.score.variants; }
  get syllables() { return this.score.syllables; }
  get phonemes() { return this.score.phonemes; }
  get wcm() { return this.score.wcm; }
  get count() { return this.score.count; }
  get zipf() { return this.score.zipf; }
  get lg10wf() { return this.score.lg10wf; }
  /** Plain data for serialisers (getters are not own properties). */
  toJSON(): WordAnalysis {
    const { surface, start, end, spoken, phones, source, variant, variants, syllables, phonemes, wcm, count, zipf, lg10wf } = this;
    return { surface, start, end, spoken, phones, source, variant, variants, syllables, phonemes, wcm, count, zipf, lg10wf };
  }
}

/**
 * Placed words shared by the items of one analysis. A word is the same object wherever it stands
 * at the same column with the same spelling and score: a library's items often begin alike ("I
 * want ...", "The nurse ..."), and every object an analysis keeps costs the collector time, so
 * sharing them is much of what keeps analysis of a large script near the cost of its look-ups.
 * Placed words are read-only, so sharing one is safe.
 */
export class PlacedWords {
  private readonly byScore = new Map<WordScore, (PlacedWord | undefined)[]>();

  get(surface: string, start: number, end: number, spoken: string, score: WordScore): PlacedWord {
    let at = this.byScore.get(score);
    if (at === undefined) this.byScore.set(score, (at = []));
    const hit = at[start];
    if (hit !== undefined && hit.end === end && hit.surface === surface && hit.spoken === spoken) return hit;
    const w = new PlacedWord(surface, start, end, spoken, score);
    at[start] = w;
    return w;
  }
}

function pronouncerKey(overrides: Override[], options: AnalysisOptions): string {
  const o = overrides.map((x) => `${x.word}=${x.phones.join(' ')}/${x.variant ?? ''}`).join(';');
  return `${JSON.stringify(options.wcm)}|${o}`;
}

/**
 * An item's timings depend only on its paces, word and syllable counts and the script's options,
 * and a rung of hundreds of items has a few dozen such pairs: items that share one share one
 * (read-only) timings array, which saves most of the objects an analysis would otherwise keep.
 */
export class TimingTable {
  private readonly byCounts = new Map<number, PaceTiming[]>();

  constructor(
    private readonly paces: Pace[],
    private readonly options: AnalysisOptions,
  ) {}

  at(words: number, syllables: number): PaceTiming[] {
    const { baseline, readingNormWps } = this.options;
    // Both counts are small integers; the pair fits one number key (no string per item).
    if (syllables >= 0x100000) return this.paces.map((p) => timeAt(p, words, syllables, baseline, readingNormWps));
    const key = words * 0x100000 + syllables;
    let hit = this.byCounts.get(key);
    if (hit === undefined) {
      hit = this.paces.map((p) => timeAt(p, words, syllables, baseline, readingNormWps));
      this.byCounts.set(key, hit);
    }
    return hit;
  }
}

/**
 * The words of a plain item (plainWords.ts: ASCII words and skipped punctuation only), scored
 * without building tokens; null for any other item. Each plain word is one spoken word, its
 * lower case, with no variant mark: what the tokens give (a property test checks they agree).
 */
function plainItemScores(node: ItemNode, pronouncer: Pronouncer, placed: PlacedWords, totals: ItemTotals): WordAnalysis[] | null {
  const plain = plainItemWords(node.text);
  if (plain === null) return null;
  const words: WordAnalysis[] = new Array(plain.length);
  const offset = node.textStart;
  for (let k = 0; k < plain.length; k++) {
    const p = plain[k];
    const s = pronouncer.score(p.spoken, null);
    words[k] = placed.get(p.surface, p.end - p.surface.length + offset, p.end + offset, p.spoken, s);
    totals.add(s);
  }
  return words;
}

/** The words of any item, read from its tokens (numbers, abbreviations, variant marks...). */
function tokenScores(node: ItemNode, pronouncer: Pronouncer, placed: PlacedWords, totals: ItemTotals, findings: Finding[]): WordAnalysis[] {
  const tokens = tokenize(node.text, node.textStart);
  // Sized exactly: an array grown by push keeps room for 17 words, and every item keeps its array.
  let total = 0;
  for (const t of tokens) total += t.words.length;
  const words: WordAnalysis[] = new Array(total);
  let w = 0;
  for (const t of tokens) {
    const last = t.words.length - 1;
    for (let wi = 0; wi <= last; wi++) {
      const spoken = t.words[wi];
      // A variant mark stands after the token, so it chooses for its last word only:
      // "well-read(2)" picks the second "read", not a second "well".
      const variant = wi === last ? t.variant : null;
      const s = pronouncer.score(spoken, variant);
      if (s.variantMissed && variant !== null) {
        // The word as written: the token without its mark, or the marked word of several.
        const word = last > 0 ? spoken : t.surface.replace(/\(\d+\)$/, '');
        const at = { line: node.line, character: t.start, endLine: node.line, endCharacter: t.end };
        findings.push(finding(at, { kind: 'variant-not-listed', word, listed: s.variants.length, variant }));
      }
      words[w++] = placed.get(t.surface, t.start, t.end, spoken, s);
      totals.add(s);
    }
  }
  return words;
}

export function analyzeItem(
  node: ItemNode,
  rung: number,
  paces: Pace[],
  options: AnalysisOptions,
  pronouncer: Pronouncer,
  findings: Finding[],
  timings: TimingTable = new TimingTable(paces, options),
  placed: PlacedWords = new PlacedWords(),
): ItemAnalysis {
  const totals = new ItemTotals();
  const words = plainItemScores(node, pronouncer, placed, totals) ?? tokenScores(node, pronouncer, placed, totals, findings);
  const wordCount = words.length;
  const { syllables, phonemes, wcm } = totals;
  const { zipfMean, zipfMin, low } = totals.frequency(words);
  const components = difficultyComponents({ syllables, words: wordCount, wcm, zipfMean, zipfMin });
  return {
    node,
    rung,
    words,
    wordCount,
    syllables,
    phonemes,
    wcm,
    wcmParts: totals.parts,
    zipfMean,
    zipfMin,
    lowFrequencyWords: low,
    estimatedWords: totals.estimated,
    difficulty: composite(components, options.weights),
    components,
    rank: 0,
    timings: timings.at(wordCount, syllables),
    sets: node.sets,
  };
}

/**
 * Ranks items 1..n by difficulty within a rung (ties share the lower rank, in line order): an
 * item's rank is one more than the number of items easier than it, found in the rung's
 * difficulties sorted once (the same sorted list gives the median, minimum and maximum).
 */
export function rankSorted(items: ItemAnalysis[], sorted: Float64Array): void {
  for (const it of items) {
    const d = it.difficulty;
    let lo = 0;
    let hi = sorted.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (sorted[mid] < d) lo = mid + 1;
      else hi = mid;
    }
    it.rank = lo + 1;
  }
}

/** The general ranking, for a rung with a difficulty that is not a number (no order to search). */
export function rankItems(items: ItemAnalysis[]): void {
  const sorted = [...items].sort((a, b) => a.difficulty - b.difficulty || a.node.line - b.node.line);
  let rank = 0;
  let last = NaN;
  sorted.forEach((it, i) => {
    if (it.difficulty !== last) rank = i + 1;
    last = it.difficulty;
    it.rank = rank;
  });
}

/** A cached item, when it was scored at the same paces and column (else it is scored again). */
function usable(hit: CachedItem | undefined, paces: string, textStart: number): CachedItem | undefined {
  return hit !== undefined && hit.textStart === textStart && hit.paces === paces ? hit : undefined;
}

/** The findings of the many items that have none (shared; never added to). */
const NO_FINDINGS: readonly Finding[] = Object.freeze([]);

/** What every rung of one analysis shares. */
export interface RungContext {
  options: AnalysisOptions;
  /** Labels of the script's `@set` lines, for rungs and items that name none. */
  scriptSets: string[];
  pronouncer: Pronouncer;
  /** Item analyses of the previous run, when they are valid for this one. */
  previous: Map<string, CachedItem> | undefined;
  /** Item analyses of this run, filled as items are scored. */
  entries: Map<string, CachedItem>;
  /** Placed words shared by the items of this run (absent: shared within the rung). */
  placed?: PlacedWords;
}

/**
 * One rung: its settings, its items (from the caches when unchanged), ranks and summary. Findings
 * go to `findings` in the order a reader meets them. The incremental path (segments.ts)
 * calls this for the rungs an edit touched, so both paths score a rung the same way.
 */
export function analyzeRung(node: RungNode, index: number, shared: RungContext, findings: Finding[]): RungAnalysis {
  const { options, scriptSets, pronouncer, previous, entries } = shared;
  const rungSettings = applySettings(options, node.settings, 'rung');
  pushAll(findings, rungSettings.findings);
  const explicitPaces = node.settings.some((s) => s.key === 'pace' || s.key === 'paces');
  const paces = explicitPaces ? rungSettings.options.paces : options.paces;
  node.paces = explicitPaces ? paces : null;
  const pacesKey = paces.map((p) => p.label).join(',');
  const timings = new TimingTable(paces, options);
  const placed = shared.placed ?? new PlacedWords();
  const rungItems = node.items.map((it) => {
    const hit = usable(entries.get(it.text), pacesKey, it.textStart) ?? usable(previous?.get(it.text), pacesKey, it.textStart);
    if (hit) {
      entries.set(it.text, hit);
      for (const f of hit.findings) findings.push({ ...f, line: it.line, endLine: it.line });
      return { ...hit.item, node: it, rung: index, rank: 0 };
    }
    // The item's findings go straight to the rung's; the cache keeps its own copy only when it has any.
    const before = findings.length;
    const item = analyzeItem(it, index, paces, options, pronouncer, findings, timings, placed);
    entries.set(it.text, { paces: pacesKey, textStart: it.textStart, item, findings: findings.length > before ? findings.slice(before) : NO_FINDINGS });
    return item;
  });
  const inherited = node.sets.length ? node.sets : scriptSets;
  for (const it of rungItems) it.sets = it.node.sets.length ? it.node.sets : inherited;
  const ds = rungItems.map((i) => i.difficulty);
  const sorted = Float64Array.from(ds).sort();
  const n = sorted.length;
  const ordered = n === 0 || !Number.isNaN(sorted[n - 1]);
  if (ordered) rankSorted(rungItems, sorted);
  else rankItems(rungItems);
  return {
    node,
    index,
    paces,
    items: rungItems,
    // A typed array sorts a NaN last, as `median` would: the same median either way.
    median: medianOfSorted(sorted),
    min: ordered ? (n ? sorted[0] : 0) : ds.reduce((m, d) => Math.min(m, d), n ? Infinity : 0),
    max: ordered ? (n ? sorted[n - 1] : 0) : ds.reduce((m, d) => Math.max(m, d), n ? -Infinity : 0),
    totalSeconds: paces.map((_, pi) => rungItems.reduce((sum, it) => sum + it.timings[pi].seconds, 0)),
  };
}

export function analyze(input: AnalyzeInput): AnalyzeOutput {
  const script = parseScript(input.text);
  const findings: Finding[] = [...script.findings];
  const header = applySettings(input.options ?? defaultOptions(), script.header, 'script');
  const options = header.options;
  pushAll(findings, header.findings);

  const overrides = [...(input.lexicon ?? []), ...script.overrides];
  const key = pronouncerKey(overrides, options);
  const pronouncer =
    input.reuse && input.reuse.key === key ? input.reuse.pronouncer : new Pronouncer(input.data, overrides, options.wcm);
  for (const o of script.overrides) {
    if (o.variant === null) continue;
    const listed = pronouncer.listed(o.word).length;
    if (o.variant < 1 || o.variant > listed) {
      const at = { line: o.line, character: o.character, endLine: o.line, endCharacter: o.character + o.written.length };
      findings.push(finding(at, { kind: 'variant-not-listed', word: o.written, listed, variant: o.variant }));
    }
  }

  // Every setting the table marks as scoring is in the key, so none can be forgotten here.
  const context = `${key}|${scoringKey(options)}`;
  const previous =
    input.itemCache && input.itemCache.context === context && pronouncer === input.reuse?.pronouncer
      ? input.itemCache.entries
      : undefined;
  const entries = new Map<string, CachedItem>();

  const scriptSets = script.header.filter((h) => h.key === 'set' || h.key === 'sets').flatMap((h) => splitLabels(h.value));
  const rungs: RungAnalysis[] = [];
  const items: ItemAnalysis[] = [];
  const shared: RungContext = { options, scriptSets, pronouncer, previous, entries, placed: new PlacedWords() };
  script.rungs.forEach((node, index) => {
    const rung = analyzeRung(node, index, shared, findings);
    rungs.push(rung);
    for (const it of rung.items) items.push(it);
  });

  findings.sort((a, b) => a.line - b.line || a.character - b.character);
  return { script, options, rungs, items, findings, pronouncer: { key, pronouncer }, itemCache: { context, entries } };
}
