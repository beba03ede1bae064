// Hovers: a word (pronunciation, WCM breakdown, frequency, source, other listed pronunciations),
// an item (counts, difficulty and rank, durations at every pace), a rung header (summary and the
// step from the rung before) and a setting key (what it does). Compact Markdown throughout.
import { isEstimated } from '../core/pronounce';
import { MarkupKind, type Hover } from 'vscode-languageserver/node';
import { settingSpec } from '../core/settings';
import type { Candidate } from '../core/g2p/decode';
import { rankNote } from '../core/g2p/estimator';
import { toIpa } from '../core/phones';
import { LOW_FREQUENCY_ZIPF } from '../core/frequency';
import type { ItemAnalysis, RungAnalysis, Setting, WcmParts, WordAnalysis } from '../core/types';
import { WCM_PARAMETER_NAMES } from '../core/wcm';
import { describeLengths, describeRungLength, formatLength, rungLength, sessionLengths } from '../core/timing';
import type { Snapshot } from './documents';
import { setLabelHover, setSettingHover } from './setHover';
import { ladderMetric, METRIC_NAMES, rungStatsByIndex, stepLimit } from '../rules/shared';
import { diff, diffMarked, ESTIMATED_MARK, estimatedWords, md, rate, secs, signed, total, two } from './display';

const markdown = (value: string, line: number, start: number, end: number): Hover => ({
  contents: { kind: MarkupKind.Markdown, value },
  range: { start: { line, character: start }, end: { line, character: end } },
});

/** The written variant mark of a token ("record(2)" -> 2). */
function writtenVariant(surface: string): number | null {
  const m = /\((\d+)\)$/.exec(surface);
  return m ? Number(m[1]) : null;
}

function wcmBreakdown(parts: WcmParts): string {
  const rows = (Object.keys(WCM_PARAMETER_NAMES) as (keyof WcmParts)[])
    .filter((k) => parts[k] > 0)
    .map((k) => `| ${WCM_PARAMETER_NAMES[k]} | ${parts[k]} |`);
  if (!rows.length) return 'No WCM points (all eight parameters 0).';
  return ['| WCM parameter | points |', '|---|---:|', ...rows].join('\n');
}

/** Where the pronunciation came from; an estimate says so and how to settle it. */
function sourceText(w: WordAnalysis, how: string): string {
  return isEstimated(w) ? `${ESTIMATED_MARK} estimated pronunciation (${how}): check it, or add a pronunciation override` : how;
}

/**
 * The estimator's ranked candidates with their shares; a quick fix writes any of them as @say.
 * When morphology's reading came first (`fromStems`), its score includes the weight it was given.
 */
function estimatorAlternatives(word: string, alternatives: Candidate[], fromStems: boolean): string {
  const rows = alternatives.map((c, i) => `| ${i + 1} | \`${c.phones.join(' ')}\` /${toIpa(c.phones)}/ | ${Math.round(100 * c.share)} % | ${c.log10.toFixed(2)} | ${rankNote(c.phones)} |`);
  const head = fromStems
    ? `Readings of ${md(word)}: the first is built from listed stems, its score weighted ×10 against the estimator's own (share among them; log10 probability); a quick fix writes one as \`@say\`:`
    : `Estimator's alternatives for ${md(word)} (share among them; log10 probability); a quick fix writes one as \`@say\`:`;
  return [head, '', '| # | phones | share | log10 p | note |', '|---:|---|---:|---:|---|', ...rows].join('\n');
}

export function wordHoverText(s: Snapshot, w: WordAnalysis, variantMark: number | null): string {
  const score = s.analysis.pronouncer.pronouncer.score(w.spoken, variantMark);
  const lines: string[] = [];
  lines.push(`**${md(w.spoken)}** · ${sourceText(w, score.how)}`);
  lines.push('');
  lines.push(`\`${w.phones.join(' ')}\` · /${toIpa(w.phones)}/`);
  lines.push('');
  lines.push('| syllables | phonemes | WCM | Zipf | Lg10WF | SUBTLEX count |');
  lines.push('|---:|---:|---:|---:|---:|---:|');
  lines.push(`| ${w.syllables} | ${w.phonemes} | ${w.wcm.total} | ${two(w.zipf)} | ${two(w.lg10wf)} | ${w.count} |`);
  lines.push('');
  lines.push(wcmBreakdown(w.wcm.parts));
  if (w.zipf < LOW_FREQUENCY_ZIPF) {
    lines.push('');
    lines.push(w.count === 0 ? 'Not seen in SUBTLEX-US (lowest Zipf).' : `Low frequency (Zipf below ${LOW_FREQUENCY_ZIPF}).`);
  }
  if (score.alternatives.length > 1) {
    lines.push('');
    lines.push(estimatorAlternatives(w.spoken, score.alternatives, score.source === 'morphology'));
  }
  if (w.variants.length > 1 || (w.variants.length === 1 && w.source !== 'dictionary')) {
    lines.push('');
    lines.push('Listed pronunciations (CMU):');
    for (const { v, n } of w.variants.map((v, i) => ({ v, n: i + 1 }))) {
      const used = w.source === 'dictionary' && n === w.variant;
      lines.push(`${n}. \`${v.join(' ')}\` /${toIpa(v)}/${used ? ' (used)' : ` — write \`${md(w.spoken)}(${n})\``}`);
    }
  }
  return lines.join('\n');
}

function paceTable(s: Snapshot, item: ItemAnalysis): string {
  const withBaseline = s.analysis.options.baseline !== null;
  const head = withBaseline
    ? ['| pace | duration | words/s | syllables/s | × baseline |', '|---|---:|---:|---:|---:|']
    : ['| pace | duration | words/s | syllables/s |', '|---|---:|---:|---:|'];
  const rows = item.timings.map((t) => {
    const cells = [t.pace.label + (t.aboveReadingNorm ? ' ⚠' : ''), secs(t.seconds), rate(t.wordRate), rate(t.syllableRate)];
    if (withBaseline) cells.push(t.baselineRatio === null ? '–' : rate(t.baselineRatio));
    return `| ${cells.join(' | ')} |`;
  });
  return [...head, ...rows].join('\n');
}

export function itemHoverText(s: Snapshot, item: ItemAnalysis): string {
  const rung = s.analysis.rungs[item.rung];
  const o = s.analysis.options;
  const lines: string[] = [];
  lines.push(
    `**Item** in rung "${md(rung.node.name)}" · difficulty **${diffMarked(item.difficulty, item.estimatedWords)}**, rank ${item.rank} of ${rung.items.length} (1 = easiest)`,
  );
  lines.push('');
  lines.push('| words | syllables | phonemes | WCM | Zipf mean | Zipf min |');
  lines.push('|---:|---:|---:|---:|---:|---:|');
  lines.push(
    `| ${item.wordCount} | ${item.syllables} | ${item.phonemes} | ${item.wcm} | ${two(item.zipfMean)} | ${two(item.zipfMin)} |`,
  );
  lines.push('');
  lines.push(paceTable(s, item));
  lines.push('');
  const c = item.components;
  const notes = [
    `length ${two(c.length)} · complexity ${two(c.complexity)} · rarity ${two(c.rarity)} (weights ${o.weights.length}/${o.weights.complexity}/${o.weights.rarity})`,
  ];
  if (item.lowFrequencyWords) notes.push(`${item.lowFrequencyWords} low-frequency word${item.lowFrequencyWords === 1 ? '' : 's'}`);
  const est = item.words.filter((w) => isEstimated(w)).map((w) => w.spoken);
  if (est.length) notes.push(`${ESTIMATED_MARK} ${estimatedWords(est.length)}: ${[...new Set(est)].map(md).join(', ')}`);
  if (item.timings.some((t) => t.aboveReadingNorm)) notes.push(`⚠ faster than adult reading aloud (${rate(o.readingNormWps)} words/s)`);
  lines.push(notes.join('; '));
  return lines.join('\n');
}

/** The rung before `rung` that has items (ladder steps skip empty rungs). */
export function previousRung(s: Snapshot, rung: RungAnalysis): RungAnalysis | undefined {
  for (let i = rung.index - 1; i >= 0; i--) if (s.analysis.rungs[i].items.length) return s.analysis.rungs[i];
  return undefined;
}

export function rungHoverText(s: Snapshot, rung: RungAnalysis): string {
  const o = s.analysis.options;
  const n = rung.items.length;
  // The numbers the ladder rules judge: the configured metric and step (config `ladder`).
  const metric = ladderMetric({ settings: s.lint });
  const stats = rungStatsByIndex(s.analysis, s.lint);
  const on = (r: RungAnalysis) => (metric === 'difficulty' ? r : stats.get(r.index)!);
  const name = METRIC_NAMES[metric];
  const limit = stepLimit(s.analysis, s.lint).value;
  const lines: string[] = [];
  lines.push(`**Rung ${rung.index + 1} "${md(rung.node.name)}"** · ${n} item${n === 1 ? '' : 's'}`);
  lines.push('');
  if (n) lines.push(`${name[0].toUpperCase()}${name.slice(1)} ${diff(on(rung).min)}–${diff(on(rung).max)}, median **${diff(on(rung).median)}**`);
  const prev = previousRung(s, rung);
  if (prev && n) {
    const delta = on(rung).median - on(prev).median;
    const allowed = limit === undefined ? 'no largest step set' : `largest allowed ${diff(limit)}`;
    lines.push('');
    lines.push(
      `Step from rung ${prev.index + 1} "${md(prev.node.name)}" (median ${diff(on(prev).median)}): **${signed(delta)}** (${allowed}, ${o.direction})`,
    );
  }
  const lengths = rungLength(s.analysis, rung.index);
  const session = lengths.paces;
  if (n && session.length) {
    lines.push('');
    lines.push(`Session: ${describeRungLength(lengths, 0)}`);
  }
  lines.push('');
  lines.push('| pace | speech | session with gaps |');
  lines.push('|---|---:|---:|');
  rung.paces.forEach((p, i) => lines.push(`| ${p.label} | ${total(rung.totalSeconds[i])} | ${formatLength(session[i].seconds)} |`));
  lines.push('');
  lines.push(`Speech leaves out pauses; the session adds ${o.timing.gap} s between items (\`@item-gap\`)${o.timing.phrasePause ? ` and ${o.timing.phrasePause} s at phrase breaks` : ''}.`);
  const script = sessionLengths(s.analysis).script;
  if (script.length && s.analysis.rungs.length > 1) lines.push('', `Whole script with gaps: ${describeLengths(script)}.`);
  return lines.join('\n');
}

function settingHoverText(setting: Setting): string | null {
  const spec = settingSpec(setting.key);
  if (!spec) return null;
  const aliases = spec.aliases.length ? ` (also ${spec.aliases.map((a) => `@${a}`).join(', ')})` : '';
  const where = spec.scope === 'script' ? 'script header' : spec.scope === 'rung' ? 'rung' : 'script header or a rung';
  if (spec.recordsOnly) return `**@${spec.key}** — ${spec.summary}\n\nA rate-records setting: it is read from a config file (\`.rungs.json\`, \`.rungs.yaml\`) or the editor settings beside the records file, and a script header does not reach it.`;
  return `**@${spec.key}**${aliases} — ${spec.summary}\n\nExample: \`@${spec.key} ${spec.example}\` · applies in the ${where}`;
}

export function hover(s: Snapshot, line: number, character: number): Hover | null {
  const item = s.itemAt(line);
  if (item) {
    const onLabel = setLabelHover(s, item, character);
    if (onLabel) return onLabel;
    const hit = item.words.filter((w) => character >= w.start && character <= w.end);
    if (hit.length && character < item.node.textEnd + 1) {
      const t = hit[0];
      const text = hit.map((w) => wordHoverText(s, w, writtenVariant(w.surface))).join('\n\n---\n\n');
      return markdown(text, line, t.start, t.end);
    }
    return markdown(itemHoverText(s, item), line, item.node.textStart, item.node.textEnd);
  }
  const settings = [...s.analysis.script.header, ...s.analysis.rungs.flatMap((r) => r.node.settings)];
  const setting = settings.find((x) => x.line === line && character >= x.keyStart && character <= x.keyEnd);
  if (setting) {
    const text = settingHoverText(setting);
    if (text) return markdown(text, line, setting.keyStart, setting.keyEnd);
  }
  const onSetLine = setSettingHover(s, line, character);
  if (onSetLine) return onSetLine;
  const override = s.analysis.script.overrides.find(
    (o) => o.line === line && character >= o.character && character <= o.character + o.written.length,
  );
  if (override) {
    const score = s.analysis.pronouncer.pronouncer.score(override.word, null);
    const w: WordAnalysis = {
      surface: override.word,
      start: override.character,
      end: override.character + override.written.length,
      spoken: override.word,
      ...score,
    };
    return markdown(wordHoverText(s, w, null), line, w.start, w.end);
  }
  const rung = s.rungAtHeader(line);
  if (rung && !rung.node.implicit) {
    return markdown(rungHoverText(s, rung), line, 0, s.lines[line]?.length ?? 0);
  }
  const keyLine = settings.find((x) => x.line === line);
  if (keyLine && !s.rungAtHeader(line)) {
    const text = settingHoverText(keyLine);
    if (text) return markdown(text, line, keyLine.keyStart, keyLine.valueEnd);
  }
  return null;
}
