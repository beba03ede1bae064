// Re-analysis that re-scores only what changed. It produces exactly what `analyze()` produces
// (tests/lsp/incremental.test.ts compares the two after random edits), but keeps every item's
// analysis from the previous run keyed by its text, indentation and pace list, so after a
// one-character edit of a 10,000-item script only the edited item goes through the tokenizer
// and scorer again. Word scores are shared through the reused Pronouncer as in `analyze()`.
//
// This mirrors the orchestration in core/analyze.ts; if the core grows its own item cache, this
// file should shrink to a call of it.
import { analyzeItem, type AnalyzeInput, type AnalyzeOutput } from '../core/analyze';
import { median } from '../core/difficulty';
import { applySettings, defaultOptions } from '../core/options';
import { parseScript } from '../core/parse';
import { Pronouncer } from '../core/pronounce';
import type { AnalysisOptions, ItemAnalysis, Override, Problem, RungAnalysis } from '../core/types';

interface CachedItem {
  item: ItemAnalysis;
  /** Problems analyzeItem reported for the item (line numbers are rewritten on reuse). */
  problems: Problem[];
}

export interface ItemCache {
  /** Everything besides the item's own text that its analysis depends on. */
  context: string;
  entries: Map<string, CachedItem>;
}

/** Same key as core/analyze.ts uses to decide whether a pronouncer can be reused. */
function pronouncerKey(overrides: Override[], options: AnalysisOptions): string {
  const o = overrides.map((x) => `${x.word}=${x.phones.join(' ')}/${x.variant ?? ''}`).join(';');
  return `${JSON.stringify(options.wcm)}|${o}`;
}

function rankItems(items: ItemAnalysis[]): void {
  const sorted = [...items].sort((a, b) => a.difficulty - b.difficulty || a.node.line - b.node.line);
  let rank = 0;
  let last = NaN;
  sorted.forEach((it, i) => {
    if (it.difficulty !== last) rank = i + 1;
    last = it.difficulty;
    it.rank = rank;
  });
}

export function analyzeIncremental(
  input: AnalyzeInput,
  previous: ItemCache | undefined,
): { output: AnalyzeOutput; cache: ItemCache } {
  const script = parseScript(input.text);
  const problems: Problem[] = [...script.problems];
  const header = applySettings(input.options ?? defaultOptions(), script.header, 'script');
  const options = header.options;
  problems.push(...header.problems);

  const overrides = [...(input.lexicon ?? []), ...script.overrides];
  const key = pronouncerKey(overrides, options);
  const pronouncer =
    input.reuse && input.reuse.key === key ? input.reuse.pronouncer : new Pronouncer(input.data, overrides, options.wcm);
  for (const o of script.overrides) {
    if (o.variant === null) continue;
    const listed = input.data.pronunciations(o.word)?.length ?? 0;
    if (o.variant < 1 || o.variant > listed) {
      problems.push({
        rule: 'bad-variant',
        severity: 'warning',
        message: listed
          ? `"${o.word}" has ${listed} listed pronunciation${listed === 1 ? '' : 's'}, not ${o.variant}; the first is used`
          : `"${o.word}" is not in the dictionary, so there is no listed pronunciation ${o.variant} to choose`,
        line: o.line,
        character: o.character,
        endLine: o.line,
        endCharacter: o.character + o.word.length,
      });
    }
  }

  const context = `${key}|${options.baseline}|${options.readingNormWps}|${JSON.stringify(options.weights)}`;
  const old = previous && previous.context === context && pronouncer === input.reuse?.pronouncer ? previous.entries : undefined;
  const entries = new Map<string, CachedItem>();

  const rungs: RungAnalysis[] = [];
  const items: ItemAnalysis[] = [];
  script.rungs.forEach((node, index) => {
    const rungSettings = applySettings(options, node.settings, 'rung');
    problems.push(...rungSettings.problems);
    const explicitPaces = node.settings.some((s) => s.key === 'pace' || s.key === 'paces');
    const paces = explicitPaces ? rungSettings.options.paces : options.paces;
    node.paces = explicitPaces ? paces : null;
    const pacesKey = paces.map((p) => p.label).join(',');
    const rungItems = node.items.map((it) => {
      const itemKey = `${pacesKey}\u0001${it.textStart}\u0001${it.text}`;
      const hit = entries.get(itemKey) ?? old?.get(itemKey);
      if (hit) {
        entries.set(itemKey, hit);
        for (const p of hit.problems) problems.push({ ...p, line: it.line, endLine: it.line });
        return { ...hit.item, node: it, rung: index, rank: 0 };
      }
      const own: Problem[] = [];
      const item = analyzeItem(it, index, paces, options, pronouncer, own);
      entries.set(itemKey, { item, problems: own });
      problems.push(...own);
      return item;
    });
    rankItems(rungItems);
    const ds = rungItems.map((i) => i.difficulty);
    rungs.push({
      node,
      index,
      paces,
      items: rungItems,
      median: median(ds),
      min: ds.length ? Math.min(...ds) : 0,
      max: ds.length ? Math.max(...ds) : 0,
      totalSeconds: paces.map((_, pi) => rungItems.reduce((sum, it) => sum + it.timings[pi].seconds, 0)),
    });
    items.push(...rungItems);
  });

  problems.sort((a, b) => a.line - b.line || a.character - b.character);
  return {
    output: { script, options, rungs, items, problems, pronouncer: { key, pronouncer } },
    cache: { context, entries },
  };
}
