// Rate records in the editor: diagnostics, a hover per row (its rate, ratio, the unassisted rate
// it was compared with and the mark), a code lens per client and rung with the trend, the
// progress view's payload, and the latest ratios shown in a script's rung hover. Scripts named in
// records are read from open documents first, then from disk.
import { dirname, join, resolve } from 'node:path';
import { MarkupKind, type CodeLens, type Hover } from 'vscode-languageserver/node';
import { resolveScriptContext, type ResolveOptions } from '../config/resolve';
import { CAUTION } from '../core/caution';
import { formatNumber } from '../core/pace';
import { isRecordsFile, scriptFacts, type ProgressResult, type RateRecord, type ScriptFacts, type ScriptLookup } from '../core/records';
import { readProgress } from '../rules/records';
import type { WordData } from '../core/types';
import type { ProgressView } from './contract';
import { nodeFs, pathKey } from '../node/nodeFs';
import { md } from './display';

/** Text of an open document by file path, if it is open. */
export type OpenText = (path: string) => string | undefined;

const n2 = (x: number): string => formatNumber(x, 2);

export function isRecordsPath(path: string | null): boolean {
  return path !== null && isRecordsFile(path);
}

/** A file's text from disk, or null when it is missing or cannot be read. */
export function readFileText(path: string): string | null {
  try {
    return nodeFs.exists(path) && !nodeFs.isDirectory(path) ? nodeFs.readFile(path) : null;
  } catch {
    return null;
  }
}

function readText(path: string, open: OpenText): string | null {
  const t = open(path);
  return t !== undefined ? t : readFileText(path);
}

/** Editor settings as the resolver's lowest layer above the defaults (config files win). */
export type EditorLayer = ResolveOptions['editor'];

/** Reads a file's text (null when missing); by default open documents, then the disk. */
export type TextReader = (path: string) => string | null;

/** Scripts relative to a records file: open documents win over the copy on disk. */
export function lookupFor(recordsPath: string, open: OpenText, editor?: EditorLayer, read: TextReader = (p) => readText(p, open)): ScriptLookup {
  const cache = new Map<string, ScriptFacts | null>();
  return (written) => {
    const full = resolve(dirname(recordsPath), written);
    if (!cache.has(full)) {
      const text = read(full);
      cache.set(full, text === null ? null : scriptFacts(text, resolveScriptContext(full, nodeFs, { editor }).options));
    }
    return cache.get(full)!;
  };
}

export function today(now = new Date()): string {
  const z = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${z(now.getMonth() + 1)}-${z(now.getDate())}`;
}

/** Progress of one records file, with its settings from the editor and config files beside it. */
export function recordsProgress(
  path: string,
  text: string,
  open: OpenText,
  data?: WordData,
  editor?: EditorLayer,
  read?: TextReader,
): { result: ProgressResult; mark: number } {
  const options = resolveScriptContext(path, nodeFs, { editor }).options.records;
  return { result: readProgress({ text, scripts: lookupFor(path, open, editor, read), options, today: today(), data }), mark: options.benefitMark };
}

function baselineText(r: RateRecord): string {
  const b = r.baseline;
  if (!b || b.from === 'none') return 'no unassisted rate: no unassisted row of this client on or before this day, and the script has no `@baseline`';
  if (b.from === 'script') return `the script's \`@baseline\` ${n2(b.wps)} words/s`;
  const lines = b.lines.map((l) => l + 1).join(', ');
  return `${n2(b.wps)} words/s unassisted (${b.from === 'same-day' ? 'same day' : b.date}, line${b.lines.length === 1 ? '' : 's'} ${lines})`;
}

export function recordHoverText(r: RateRecord, mark: number): string {
  const out: string[] = [];
  const what = r.condition === 'paced' ? `paced · ${md(r.rungName ?? r.rung ?? '')}` : `unassisted${r.task ? ` · ${md(r.task)}` : ''}`;
  out.push(`**${md(r.client)}** · ${r.date} · ${what}`, '');
  out.push(`${r.words} words${r.wordsFromTranscript ? ' (counted from the transcript' + (r.fillersLeftOut.length ? `, leaving out ${r.fillersLeftOut.length} filler${r.fillersLeftOut.length === 1 ? '' : 's'}: ${md(r.fillersLeftOut.join(', '))}` : '') + ')' : ''} in ${formatNumber(r.seconds, 2)} s = **${n2(r.wps)} words/s**${r.sps !== null ? ` · ${n2(r.sps)} syllables/s` : ''}`);
  if (r.condition === 'paced') {
    out.push('');
    if (r.ratio !== null) {
      out.push(`Ratio **${n2(r.ratio)}** to ${baselineText(r)}: ${r.benefit ? `meets the mark of ${n2(mark)}` : `below the mark of ${n2(mark)}`}`);
    } else out.push(`No ratio: ${baselineText(r)}`);
    if (r.pace) {
      out.push('', `Model pace ${r.pace.label} (${r.paceFrom === 'row' ? 'this row' : "the rung's first pace"})${r.paceKept !== null ? `: kept ${formatNumber(r.paceKept * 100, 0)}%` : ''}`);
    }
  }
  if (r.accuracy !== null) out.push('', `Accuracy ${r.correct}/${r.words} = ${formatNumber(r.accuracy * 100, 0)}%`);
  out.push('', `_${CAUTION}_`);
  return out.join('\n');
}

export function recordsHover(result: ProgressResult, mark: number, line: number): Hover | null {
  const r = result.records.find((x) => x.line === line);
  if (!r) return null;
  return { contents: { kind: MarkupKind.Markdown, value: recordHoverText(r, mark) }, range: { start: { line, character: 0 }, end: { line, character: 0 } } };
}

export function recordsLenses(result: ProgressResult): CodeLens[] {
  return result.trends.map((t) => {
    const slope = t.slopePerWeek === null ? '' : ` · ${t.slopePerWeek >= 0 ? '+' : ''}${formatNumber(t.slopePerWeek, 2)}/week`;
    const title = `${t.client} · ${t.rung}: ratios ${t.ratios.map(n2).join(', ') || '–'}${slope} · ${t.note}`;
    return { range: { start: { line: t.line, character: 0 }, end: { line: t.line, character: 0 } }, command: { title, command: '' } };
  });
}

const dayNumber = (d: string) => Date.UTC(Number(d.slice(0, 4)), Number(d.slice(5, 7)) - 1, Number(d.slice(8, 10))) / 86_400_000;

export function progressView(result: ProgressResult, mark: number): ProgressView {
  return {
    benefitMark: mark,
    rows: result.rows,
    recordsRead: result.records.length,
    problems: result.problems.filter((p) => p.severity === 'error').length,
    trends: result.trends.map((t) => {
      const first = dayNumber(t.sessions[0].date);
      return {
        client: t.client,
        script: t.script,
        rung: t.rung,
        note: t.note,
        ready: t.ready,
        slopePerWeek: t.slopePerWeek,
        points: t.sessions.map((s) => ({ date: s.date, day: dayNumber(s.date) - first, ratio: s.ratio, benefit: s.benefit, line: Math.max(...s.lines) })),
      };
    }),
  };
}

/** Records files below the workspace folders (skipping dot folders and node_modules), at most `cap`. */
export function findRecordsFiles(folders: string[], cap = 200): string[] {
  const out: string[] = [];
  const walk = (dir: string, depth: number) => {
    if (out.length >= cap || depth > 8) return;
    let names: string[];
    try {
      names = nodeFs.readdir(dir).sort();
    } catch {
      return;
    }
    for (const name of names) {
      if (name.startsWith('.') || name === 'node_modules') continue;
      const p = join(dir, name);
      if (isRecordsFile(name)) out.push(p);
      else if (!name.includes('.')) {
        // A folder that vanished or cannot be read has no records to show (isDirectory: false).
        if (nodeFs.isDirectory(p)) walk(p, depth + 1);
      }
    }
  };
  for (const f of folders) if (nodeFs.exists(f)) walk(f, 0);
  return out;
}

/** The latest paced row of each client, by script (pathKey) and rung index. */
export type LatestRatios = Map<string, Map<number, Map<string, { r: RateRecord; mark: number }>>>;

/** A records file's latest paced row per client, script and rung: what a rung hover shows of it. */
export function latestRatios(file: string, result: ProgressResult, mark: number): LatestRatios {
  const out: LatestRatios = new Map();
  for (const r of result.records) {
    if (r.condition !== 'paced' || !r.script || r.rungIndex === null || r.rungIndex === undefined) continue;
    const script = pathKey(resolve(dirname(file), r.script));
    let byRung = out.get(script);
    if (!byRung) out.set(script, (byRung = new Map()));
    let byClient = byRung.get(r.rungIndex);
    if (!byClient) byRung.set(r.rungIndex, (byClient = new Map()));
    keepLatest(byClient, r.client, { r, mark });
  }
  return out;
}

/** Keeps a client's row when it is the latest seen (a later row of the same date wins). */
function keepLatest(latest: Map<string, { r: RateRecord; mark: number }>, client: string, hit: { r: RateRecord; mark: number }): void {
  const prev = latest.get(client);
  if (!prev || prev.r.date <= hit.r.date) latest.set(client, hit);
}

/**
 * Markdown lines for a script's rung hover: the latest ratio of each client whose records (in the
 * workspace, or open) name this script and rung, over the records files in order. Empty when no
 * records name it.
 */
export function rungRecordsNote(scriptPath: string, rungIndex: number, files: LatestRatios[]): string[] {
  const latest = new Map<string, { r: RateRecord; mark: number }>();
  const key = pathKey(scriptPath);
  for (const f of files) {
    for (const [client, hit] of f.get(key)?.get(rungIndex) ?? []) keepLatest(latest, client, hit);
  }
  if (!latest.size) return [];
  const lines = ['', '**Latest paced/unassisted ratio** (rate records):'];
  for (const [client, { r, mark }] of [...latest].sort((a, b) => a[0].localeCompare(b[0]))) {
    const ratio = r.ratio === null ? 'no unassisted rate' : `${n2(r.ratio)} ${r.benefit ? `(meets ${n2(mark)})` : `(below ${n2(mark)})`}`;
    lines.push(`- ${md(client)} · ${r.date}: ${ratio}`);
  }
  return lines;
}
