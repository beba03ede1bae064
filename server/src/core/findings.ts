// What the core and the config reader found, in domain terms: an unknown key with the nearest
// known one, a value that cannot be read with the form it should take, a phone that is not
// ARPAbet. They carry no rule id and no wording: the rule that owns a kind (server/src/rules/,
// its `kinds`) turns each finding into a message, a severity and a fix.
import type { Range } from './types';

export type Finding = Range &
  (
    | /** A setting key Rungs does not know (script `@key` or config-file key). */ {
        kind: 'unknown-setting';
        key: string;
        nearest: string | null;
        /** Where it was written: a script (`@key`) or a config file (bare key). */
        where: 'script' | 'config';
        /** False where no edit can be offered (editor settings have no text to edit). */
        fixable: boolean;
      }
    | { kind: 'script-key-on-rung'; key: string }
    | { kind: 'records-key-in-script'; key: string }
    | { kind: 'missing-value'; key: string; example: string }
    /** A value its reader could not read; `expected` is the reader's account of what it takes. */
    | { kind: 'unreadable-value'; key: string; expected: string }
    | { kind: 'setting-without-key' }
    | { kind: 'note-without-sentence' }
    | { kind: 'override-without-phones' }
    | { kind: 'phone-not-arpabet'; phone: string; reason: string }
    /**
     * `@say word = N` or a `word(N)` mark in an item with no Nth listed pronunciation (`listed` 0:
     * the word is not listed); `word` as written.
     */
    | { kind: 'variant-not-listed'; word: string; listed: number; variant: number }
    | { kind: 'config-syntax'; explanation: string }
    | { kind: 'config-not-object' }
    | { kind: 'config-unreadable'; code: string }
    /** A config entry of the wrong shape (`root`, `rules`, `ladder`, `lexicon`); `expected` says what it takes. */
    | { kind: 'config-entry-shape'; expected: string }
    | { kind: 'unknown-rule'; name: string; nearest: string | null; fixable: boolean }
    | { kind: 'bad-severity'; ruleId: string; value: unknown; choices: readonly string[] }
    | { kind: 'lexicon-missing'; name: string; path: string }
    | { kind: 'lexicon-unreadable'; name: string; code: string }
    /** A lexicon a config file may not read (outside its folder, or not a regular file); `reason` says which. */
    | { kind: 'lexicon-refused'; name: string; reason: string }
    | { kind: 'script-only-key'; key: string }
    | { kind: 'unreadable-config-value'; key: string; example: string }
    /** A rate-records cell that cannot be used: its column, and what is wrong with what it takes. */
    | { kind: 'record-bad-cell'; column: string; value: string; problem: RecordCellProblem }
    | { kind: 'record-unknown-column'; name: string; known: readonly string[] }
    | { kind: 'record-repeated-column'; name: string }
    | { kind: 'record-missing-column'; column: string }
    /** A records row equal to an earlier one (`earlierLine` 0-based); it is counted once. */
    | { kind: 'record-duplicate-row'; earlierLine: number }
    /** A records row the CSV parser cannot read; `explanation` is the parser's account. */
    | { kind: 'record-syntax'; explanation: string }
    /** Rungs itself failed: a rule threw (its id), or the whole analysis did (null). */
    | { kind: 'internal-failure'; rule: string | null; error: string }
    /** A line longer than `limit` characters (core/limits.ts): analysed up to the bound. */
    | { kind: 'line-over-limit'; limit: number; length: number }
    /** A script over `limit` bytes: its first `checkedLines` whole lines are analysed. */
    | { kind: 'script-over-limit'; limit: number; checkedLines: number }
  );

export type FindingKind = Finding['kind'];
export type FindingOf<K extends FindingKind> = Extract<Finding, { kind: K }>;

/** A finding's data without its range, kind by kind. */
export type FindingData = Finding extends infer F ? (F extends Finding ? Omit<F, keyof Range> : never) : never;

/** A finding at a range. */
export function finding(range: Range, data: FindingData): Finding {
  return { line: range.line, character: range.character, endLine: range.endLine, endCharacter: range.endCharacter, ...data } as Finding;
}

/** Why a required records cell may not be empty (said after "... is empty"). */
export type EmptyCellReason = 'condition-choices' | 'no-transcript' | 'paced-needs-script' | 'paced-needs-rung';

/** What is wrong with one records cell (`value` of the finding is the cell, trimmed). */
export type RecordCellProblem =
  | { what: 'empty'; why: EmptyCellReason | null }
  | { what: 'not-iso-date' }
  | { what: 'not-in-calendar' }
  | { what: 'in-future'; today: string }
  | { what: 'unknown-condition' }
  | { what: 'not-a-number' }
  | { what: 'not-above-zero' }
  | { what: 'not-a-count' }
  | { what: 'implausible-rate'; words: number; seconds: string; rate: number; limit: number }
  | { what: 'more-correct-than-words'; words: number }
  | { what: 'no-such-script' }
  | { what: 'no-such-rung'; script: string; rungs: string[] }
  | { what: 'unreadable-pace'; explanation: string }
  | { what: 'not-one-pace'; count: number }
  | { what: 'rung-without-pace' }
  | { what: 'no-pace' };
