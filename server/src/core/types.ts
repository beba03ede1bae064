// Plain data shared by every part of Rungs. Positions are 0-based (line, character in UTF-16 code
// units, as JavaScript strings index them); the CLI and the LSP layer convert them once at the edge.
import type { RecordsOptions } from './records/settings';
import type { Finding } from './findings';

import type { Candidate } from './g2p/decode';

export type Severity = 'error' | 'warning' | 'info' | 'hint';

/** A range inside the script text, 0-based, end exclusive. */
export interface Range {
  line: number;
  character: number;
  endLine: number;
  endCharacter: number;
}

/** One replacement of a range of text; fixes are lists of these. */
export interface TextEdit extends Range {
  newText: string;
}

/** A mechanical fix attached to a problem; applying it must never change text outside its edits. */
export interface Fix {
  title: string;
  edits: TextEdit[];
  /**
   * False for fixes a person must choose one by one (they remove an item or turn an estimate into
   * an override): offered as editor quick fixes only, never applied by `--fix` or fix-all.
   */
  batch?: boolean;
}

export interface RelatedInfo extends Range {
  message: string;
}

export interface Problem extends Range {
  /** Rule id (the join key for docs, settings, LSP codes and SARIF). Parse problems use `syntax`. */
  rule: string;
  severity: Severity;
  message: string;
  related?: RelatedInfo[];
  fix?: Fix;
  /** Marks a problem about something that is no longer needed (rendered faded in editors). */
  unnecessary?: boolean;
}

export type PaceUnit = 'wps' | 'sps';

/** A target pace: words per second (the trade's unit) or syllables per second when stated. */
export interface Pace {
  value: number;
  unit: PaceUnit;
  /** Canonical label, used as the key of `durations`: e.g. "1.5 wps", "4 sps". */
  label: string;
}

export type Direction = 'rising' | 'falling';

export interface DifficultyWeights {
  length: number;
  complexity: number;
  rarity: number;
}

export interface WcmOptions {
  /** Count /h/ (HH) as a fricative (parameter 7). Default false. */
  hAsFricative: boolean;
  /** Count only clusters inside one syllable (parameter 4); default false = any consonant run. */
  clustersWithinSyllable: boolean;
  /**
   * Parameter 2 (stress on any syllable but the first): when true, secondary stress on the first
   * syllable counts as initial stress, so words like "understand" score 0 there. Default false:
   * only the primary stress (digit 1) decides.
   */
  secondaryStressIsInitial: boolean;
}

/** Timing of paced delivery (cue tracks, model audio, practice page, session lengths). */
export interface TimingOptions {
  /** Word slots inside an item: in proportion to syllables, or equal per spoken word. */
  slots: 'syllables' | 'equal';
  /** Pause added after phrase-break punctuation inside an item, in seconds. */
  phrasePause: number;
  /** Silence between items, in seconds. */
  gap: number;
  /** Echo mode: the client's response window as a multiple of the model's length. */
  echoWindow: number;
}

/** Everything that tunes analysis. The script header overrides config files, which override defaults. */
export interface AnalysisOptions {
  paces: Pace[];
  /** Client's unassisted rate in words per second, if known. */
  baseline: number | null;
  direction: Direction;
  /** Largest allowed rise (or fall) between neighbouring rung medians, in difficulty points. */
  maxStep: number;
  /** Fewest items a rung should hold. */
  minItems: number;
  /** Longest item, in words (0 = no limit). */
  maxWords: number;
  /** Longest item, in syllables (0 = no limit). */
  maxSyllables: number;
  /** Longest item, in phonemes (0 = no limit). */
  maxPhonemes: number;
  weights: DifficultyWeights;
  wcm: WcmOptions;
  /** Adult reading-aloud norm in words per second (Brysbaert 2019: 183 wpm). */
  readingNormWps: number;
  /** Matched sets (core/setOptions.ts): equivalence bound in SD units. */
  setBound: number;
  /** Matched sets: fewest items a set needs before it is compared. */
  setMinItems: number;
  /** Matched sets: compare over the whole script or rung by rung. */
  setScope: SetScope;
  /** Settings of client rate records (records/settings.ts). */
  records: RecordsOptions;
  timing: TimingOptions;
}

export type SetScope = 'script' | 'rung';

/** A pronunciation override: a spelling and its ARPAbet phones, or a choice of a listed variant. */
export interface Override {
  /** The word's lookup form (lower case, no accents on Latin letters), as items are looked up. */
  word: string;
  /** The word as written on its line (for messages, and ranges: its UTF-16 length). */
  written: string;
  /** ARPAbet phones with stress digits on vowels; empty when `variant` chooses a listed one. */
  phones: string[];
  /** 1-based index into the dictionary's listed pronunciations, when choosing rather than spelling. */
  variant: number | null;
  /** Where it was written: script line, or the lexicon file's name (for messages). */
  origin: string;
  line: number;
  character: number;
}

/** A parsed header or attribute setting, kept with its position for diagnostics and completion. */
export interface Setting {
  key: string;
  value: string;
  line: number;
  keyStart: number;
  keyEnd: number;
  valueStart: number;
  valueEnd: number;
}

export interface CommentLine {
  line: number;
  text: string;
  /** Offset where the comment marker starts. */
  start: number;
}

export interface ItemNode {
  line: number;
  /** The spoken text, as written (trailing note stripped, inner variant marks kept). */
  text: string;
  textStart: number;
  textEnd: number;
  id: string | null;
  note: string | null;
  sets: string[];
}

export interface RungNode {
  name: string;
  line: number;
  /** Line of the last item or comment that belongs to the rung. */
  endLine: number;
  /** True for the rung made up when items come before any rung header. */
  implicit: boolean;
  paces: Pace[] | null;
  sets: string[];
  settings: Setting[];
  items: ItemNode[];
}

export interface ParsedScript {
  header: Setting[];
  rungs: RungNode[];
  comments: CommentLine[];
  overrides: Override[];
  /** What could not be read, in domain terms (rules render them; see core/findings.ts). */
  findings: Finding[];
  lineCount: number;
}

export type PronunciationSource = 'dictionary' | 'override' | 'morphology' | 'estimate';

export interface WcmParts {
  syllables: number;
  nonInitialStress: number;
  finalConsonant: number;
  clusters: number;
  velars: number;
  liquids: number;
  fricatives: number;
  voicedFricatives: number;
}

export interface WcmResult {
  total: number;
  parts: WcmParts;
}

/** A word's counts and frequency, the same wherever it stands. */
export interface WordFigures {
  syllables: number;
  phonemes: number;
  wcm: WcmResult;
  /** SUBTLEX-US raw count (0 when unseen). */
  count: number;
  zipf: number;
  lg10wf: number;
}

export interface WordAnalysis extends WordFigures {
  /** The word as written in the item. */
  surface: string;
  /** Offsets in the line of the written token this word comes from. */
  start: number;
  end: number;
  /** The spoken form used for lookups (lower case). */
  spoken: string;
  phones: string[];
  source: PronunciationSource;
  /** 1-based index of the listed pronunciation used, when from the dictionary. */
  variant: number;
  /** All listed dictionary pronunciations (empty if none). */
  variants: string[][];
}

export interface PaceTiming {
  pace: Pace;
  seconds: number;
  /** Syllables per second implied by the pace on this item. */
  syllableRate: number;
  /** Words per second implied by the pace on this item. */
  wordRate: number;
  /** Pace divided by the client's baseline words per second, when a baseline is set (word paces). */
  baselineRatio: number | null;
  aboveReadingNorm: boolean;
}

export interface ItemAnalysis {
  node: ItemNode;
  rung: number;
  words: WordAnalysis[];
  wordCount: number;
  syllables: number;
  phonemes: number;
  wcm: number;
  wcmParts: WcmParts;
  zipfMean: number;
  zipfMin: number;
  lowFrequencyWords: number;
  estimatedWords: number;
  /** Composite difficulty 0-100 (see difficulty.ts). */
  difficulty: number;
  /** Components of the composite, each 0-1, before weighting. */
  components: { length: number; complexity: number; rarity: number };
  /** 1 = easiest item in its rung. */
  rank: number;
  timings: PaceTiming[];
  /**
   * Set labels in force for the item: its own `@set` labels, else its rung's, else the script
   * header's (an item's own labels replace the rung's rather than add to them).
   */
  sets: string[];
}

export interface RungAnalysis {
  node: RungNode;
  index: number;
  paces: Pace[];
  items: ItemAnalysis[];
  median: number;
  min: number;
  max: number;
  /** Sum of item durations at each pace, in seconds (same order as paces). */
  totalSeconds: number[];
}

export interface Analysis {
  script: ParsedScript;
  options: AnalysisOptions;
  rungs: RungAnalysis[];
  items: ItemAnalysis[];
  /** What the parser and the analysis could not read or resolve, for the rules to render. */
  findings: Finding[];
}

/** Read-only access to the shipped word data; implemented over compact tables outside the core. */
export interface WordData {
  /** Listed pronunciations of a lower-case word, each an ARPAbet string, in dictionary order. */
  pronunciations(word: string): string[] | undefined;
  /** SUBTLEX-US count of a lower-case word, 0 when unseen. */
  count(word: string): number;
  /**
   * Up to `k` estimated pronunciations of a lower-case spelling from the trained estimator
   * (core/g2p), best first; undefined when no model is available (the letter-to-sound rules
   * are used instead). `prior`, a reading built by morphology, is weighed with the estimator's
   * own (core/g2p/estimator.ts).
   */
  estimate?(word: string, k: number, prior?: readonly string[], hiatus?: readonly number[]): Candidate[] | undefined;
  /**
   * Whether a pronunciation of a lower-case spelling says the vowels at each hiatus apart
   * (core/hiatus.ts), by the estimator's alignment; undefined when no model is available.
   */
  keepsHiatus?(word: string, phones: string[], hiatus: readonly number[]): boolean | undefined;
}
