// Reads one config file (JSON or YAML) or an editor-settings object into a layer the resolver
// merges. Pure: text in, data out. A `.json` file must be JSON as JSON.parse reads it (no comments,
// no trailing commas); its keys and values are then located with the YAML 1.2 parser, which reads
// every JSON text. Every problem has a position in the file, and whatever cannot be read is left
// out: in YAML, the top-level entry a syntax error falls in; in JSON, the whole file.
import { dirname, isAbsolute, join } from 'node:path';
import { isCollection, isMap, isScalar, LineCounter, parseDocument, visit, type Document, type Node as YamlNode } from 'yaml';
import { finding, type Finding } from '../core/findings';
import { nearestName } from '../core/nearest';
import { SETTINGS, settingSpec, settingText } from '../core/settings';
import type { Range, Setting } from '../core/types';
import { RULE_IDS } from '../rules/index';
import { jsonSyntaxError } from './jsonError';
import { excerpt } from '../core/excerpt';
import { LADDER_METRICS, type LadderMetric, type LadderSettings, type SeverityOverrides } from '../rules/types';

/** Looked for in each folder, in this order; the first found is the folder's config. */
export const CONFIG_FILE_NAMES = ['.rungs.json', '.rungs.yaml', '.rungs.yml'];

/** Top-level keys that are not analysis settings. */
const RESERVED = ['root', 'rules', 'ladder', 'lexicon'];
const SEVERITIES = ['error', 'warning', 'info', 'hint', 'off'];
/** Largest ladder maxStep: in any metric's units (syllables, points), more than any real step. */
const LADDER_MAX_STEP = 10_000;

export interface ConfigLayer {
  file: string;
  /** False for editor settings, which have no file to watch. */
  fromFile: boolean;
  root: boolean;
  settings: Setting[];
  rules: SeverityOverrides;
  ladder: LadderSettings;
  lexicon: { name: string; path: string; range: Range }[];
  /** What could not be read, in domain terms (the rules word them). */
  findings: Finding[];
}

/** A key and value with where they were written (0-based); zero ranges for plain objects. */
interface Entry {
  key: string;
  keyRange: Range;
  value: unknown;
  valueRange: Range;
  children: Entry[] | null;
}

/** A value as a message quotes it: JSON, short and escaped. */
const shown = (v: unknown): string => excerpt(JSON.stringify(v) ?? String(v));

const NOWHERE: Range = { line: 0, character: 0, endLine: 0, endCharacter: 0 };

function fromYaml(node: unknown, text: string, lc: LineCounter): Entry[] | null {
  if (!isMap(node)) return null;
  const at = (offset: number) => {
    const p = lc.linePos(offset);
    return { line: p.line - 1, character: p.col - 1 };
  };
  const range = (start: number, end: number): Range => {
    const a = at(start);
    const b = at(Math.max(start, end));
    return { line: a.line, character: a.character, endLine: b.line, endCharacter: b.character };
  };
  return node.items.map((pair) => {
    const k = pair.key as YamlNode | null;
    const v = pair.value as YamlNode | null;
    let [ks, ke] = k?.range ?? [0, 0];
    if (/["']/.test(text[ks] ?? '') && ke - ks >= 2) [ks, ke] = [ks + 1, ke - 1];
    const kr = range(ks, ke);
    const vr = v?.range ? range(v.range[0], v.range[1]) : { ...kr, character: kr.endCharacter };
    return {
      key: String(isScalar(k) ? k.value : k ?? ''),
      keyRange: kr,
      value: v && typeof (v as { toJSON?: unknown }).toJSON === 'function' ? (v as { toJSON(): unknown }).toJSON() : v,
      valueRange: vr,
      children: fromYaml(v, text, lc),
    };
  });
}

function fromObject(value: unknown): Entry[] | null {
  if (!value || typeof value !== 'object' || Array.isArray(value)) return null;
  return Object.entries(value as Record<string, unknown>).map(([key, v]) => ({
    key,
    keyRange: NOWHERE,
    value: v,
    valueRange: NOWHERE,
    children: fromObject(v),
  }));
}

function syntaxFinding(explanation: string, start: Range, end: Range): Finding {
  return finding({ line: start.line, character: start.character, endLine: end.line, endCharacter: end.character }, { kind: 'config-syntax', explanation });
}

/** 0-based line and character of an offset, counting \n, \r\n and \r as line breaks. */
function positionOf(text: string, offset: number): Range {
  let line = 0;
  let start = 0;
  for (let i = 0; i < offset && i < text.length; i++) {
    if (text[i] === '\n' || (text[i] === '\r' && text[i + 1] !== '\n')) {
      line++;
      start = i + 1;
    }
  }
  const character = Math.min(offset, text.length) - start;
  return { line, character, endLine: line, endCharacter: character };
}

/**
 * Where to report a YAML error. The parser puts an unclosed flow collection's error where it gave
 * up (often the end of the file); the bracket that was never closed is the useful place.
 */
function yamlErrorStart(doc: Document, pos: number, message: string): number {
  if (!/^Flow (sequence|map)/.test(message)) return pos;
  let opened = pos;
  visit(doc, (_key, node) => {
    if (isCollection(node) && node.flow && node.range && node.range[1] === pos && node.range[0] < opened) opened = node.range[0];
  });
  return opened;
}

/** Keys repeated within one map, as the parser reports them with `uniqueKeys` (in linear time). */
function duplicateKeys(root: unknown): { message: string; pos: [number, number] }[] {
  const out: { message: string; pos: [number, number] }[] = [];
  // An explicit stack: a deeply nested file must not overflow the call stack.
  const stack: unknown[] = [root];
  while (stack.length) {
    const node = stack.pop();
    if (!isCollection(node)) continue;
    const seen = new Set<string>();
    for (const item of node.items as unknown[]) {
      if (isMap(node)) {
        const pair = item as { key: unknown; value: unknown };
        const k = pair.key;
        if (isScalar(k)) {
          const id = `${typeof k.value}:${String(k.value)}`;
          if (seen.has(id) && k.range) out.push({ message: 'Map keys must be unique', pos: [k.range[0], k.range[1]] });
          seen.add(id);
        }
        stack.push(pair.value);
      } else stack.push(item);
    }
  }
  return out;
}

/** Whether a sorted list holds a value in [from, to). */
function anyIn(sorted: number[], from: number, to: number): boolean {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < from) lo = mid + 1;
    else hi = mid;
  }
  return lo < sorted.length && sorted[lo] < to;
}

export function parseConfigText(text: string, file: string): ConfigLayer {
  if (/\.json$/i.test(file)) {
    const bad = jsonSyntaxError(text);
    if (bad) {
      const at = positionOf(text, bad.offset);
      const end = positionOf(text, Math.min(text.length, bad.offset + 1));
      return parseConfigObject({}, file, dirname(file), [syntaxFinding(bad.message, at, end.line === at.line ? end : { ...at, character: at.character + 1 })]);
    }
  }
  const lc = new LineCounter();
  // The parser's own duplicate-key check compares every key with every other (quadratic in the
  // number of keys); duplicateKeys does the same job with a set per map.
  const doc = parseDocument(text, { lineCounter: lc, uniqueKeys: false, prettyErrors: false });
  const at = (offset: number): Range => {
    const p = lc.linePos(offset);
    return { line: p.line - 1, character: p.col - 1, endLine: p.line - 1, endCharacter: p.col - 1 };
  };
  const errorAt: number[] = [];
  const errors = [...doc.errors.map((e) => ({ message: e.message, pos: e.pos })), ...duplicateKeys(doc.contents)].sort((x, y) => x.pos[0] - y.pos[0]);
  const problems: Finding[] = errors.map((e) => {
    const first = e.message.split('\n')[0].replace(/ at line \d+, column \d+:?$/, '');
    const start = yamlErrorStart(doc, e.pos[0], first);
    errorAt.push(e.pos[0], start);
    return syntaxFinding(first, at(start), at(start === e.pos[0] ? Math.max(e.pos[1], e.pos[0] + 1) : start + 1));
  });
  const contents = doc.contents;
  if (contents === null || (isScalar(contents) && contents.value === null)) return parseConfigObject({}, file, dirname(file), problems);
  const entries = fromYaml(contents, text, lc);
  if (!entries) {
    if (problems.length) return parseConfigObject({}, file, dirname(file), problems);
    return parseConfigObject({}, file, dirname(file), [
      finding({ line: 0, character: 0, endLine: 0, endCharacter: 1 }, { kind: 'config-not-object' }),
    ]);
  }
  // After a syntax error the parser still gives a document; each top-level entry spans from the
  // start of its key's line to the start of the next key's line, and an entry an error falls in
  // is left out (it may be misread), so the rest of the file applies.
  const items = isMap(contents) ? contents.items : [];
  const lineStart = (offset: number) => text.lastIndexOf('\n', offset - 1) + 1;
  const sortedErrors = [...errorAt].sort((x, y) => x - y);
  const kept = entries.filter((_e, i) => {
    const from = lineStart((items[i].key as YamlNode | null)?.range?.[0] ?? 0);
    const nextKey = (items[i + 1]?.key as YamlNode | null | undefined)?.range?.[0];
    const to = nextKey === undefined ? Infinity : lineStart(nextKey);
    return !anyIn(sortedErrors, from, to);
  });
  return interpret(kept, file, dirname(file), true, problems);
}

/** A layer from a plain object (editor settings); positions are line 1, column 1. */
export function parseConfigObject(value: unknown, name: string, baseDir: string, problems: Finding[] = []): ConfigLayer {
  return interpret(fromObject(value) ?? [], name, baseDir, false, problems);
}

function interpret(entries: Entry[], file: string, baseDir: string, fromFile: boolean, problems: Finding[]): ConfigLayer {
  const layer: ConfigLayer = { file, fromFile, root: false, settings: [], rules: {}, ladder: {}, lexicon: [], findings: problems };
  const bad = (r: Range, expected: string) => problems.push(finding(r, { kind: 'config-entry-shape', expected }));
  for (const e of entries) {
    const key = e.key.toLowerCase();
    if (key === 'root') {
      if (typeof e.value !== 'boolean') bad(e.valueRange, `"root" takes true or false, not ${shown(e.value)}`);
      else layer.root = e.value;
    } else if (key === 'rules') {
      if (!e.children) bad(e.valueRange, '"rules" maps rule ids to error, warning, info, hint or off');
      for (const r of e.children ?? []) {
        const id = r.key.toLowerCase();
        if (!RULE_IDS.includes(id)) {
          problems.push(finding(r.keyRange, { kind: 'unknown-rule', name: r.key, nearest: nearestName(id, RULE_IDS), fixable: fromFile }));
        } else if (typeof r.value !== 'string' || !SEVERITIES.includes(r.value.toLowerCase())) {
          problems.push(finding(r.valueRange, { kind: 'bad-severity', ruleId: id, value: r.value, choices: SEVERITIES }));
        } else layer.rules[id] = r.value.toLowerCase() as SeverityOverrides[string];
      }
    } else if (key === 'ladder') {
      if (!e.children) bad(e.valueRange, '"ladder" is an object: {"metric": "syllables", "maxStep": 3}');
      for (const l of e.children ?? []) {
        if (l.key === 'metric' && LADDER_METRICS.includes(l.value as LadderMetric)) layer.ladder.metric = l.value as LadderMetric;
        else if (l.key === 'metric') bad(l.valueRange, `ladder metric is one of ${LADDER_METRICS.join(', ')}, not ${shown(l.value)}`);
        else if (l.key === 'maxStep' && typeof l.value === 'number' && Number.isFinite(l.value) && l.value > 0 && l.value <= LADDER_MAX_STEP) layer.ladder.maxStep = l.value;
        else if (l.key === 'maxStep') bad(l.valueRange, `ladder maxStep is a number above 0 and at most ${LADDER_MAX_STEP}, not ${shown(l.value)}`);
        else bad(l.keyRange, `unknown ladder key "${excerpt(l.key)}": use metric or maxStep`);
      }
    } else if (key === 'lexicon') {
      const list = typeof e.value === 'string' ? [e.value] : e.value;
      if (!Array.isArray(list) || !list.every((x) => typeof x === 'string')) {
        bad(e.valueRange, '"lexicon" is a file name or a list of file names, relative to the config file');
        continue;
      }
      for (const name of list as string[]) layer.lexicon.push({ name, path: isAbsolute(name) ? name : join(baseDir, name), range: e.valueRange });
    } else if (settingSpec(key)) {
      const spec = settingSpec(key)!;
      if (spec.scriptOnly) {
        problems.push(finding(e.keyRange, { kind: 'script-only-key', key: e.key }));
        continue;
      }
      const value = settingText(e.value);
      if (value === null) {
        problems.push(finding(e.valueRange, { kind: 'unreadable-config-value', key: e.key, example: spec.example }));
        continue;
      }
      const vr = e.valueRange;
      layer.settings.push({
        key,
        value,
        line: e.keyRange.line,
        keyStart: e.keyRange.character,
        keyEnd: e.keyRange.endCharacter,
        valueStart: vr.line === e.keyRange.line ? vr.character : e.keyRange.endCharacter,
        valueEnd: vr.line === e.keyRange.line && vr.endLine === vr.line ? vr.endCharacter : e.keyRange.endCharacter,
      });
    } else {
      const near = nearestName(key, [...RESERVED, ...SETTINGS.filter((k) => !k.scriptOnly).map((k) => k.key)]);
      problems.push(finding(e.keyRange, { kind: 'unknown-setting', key: e.key, nearest: near, where: 'config', fixable: fromFile }));
    }
  }
  return layer;
}
