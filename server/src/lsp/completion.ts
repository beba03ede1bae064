// Completion of setting keys (header or rung, from the core's table of settings), their values, set
// labels (the usual ones plus every label already used in the script), pace units, and the
// words of `@say` (words the script had to estimate) and lint directives ("// rungs: allow ID").
// Signature help shows what a key takes while its value is typed.
import { isEstimated } from '../core/pronounce';
import {
  CompletionItemKind,
  InsertTextFormat,
  MarkupKind,
  type CompletionItem,
  type SignatureHelp,
} from 'vscode-languageserver/node';
import { RUNG_KEYS, SETTINGS as KEYS, settingSpec as keySpec, type SettingSpec as KeySpec } from '../core/settings';
import { DIRECTIVE_PREFIX, DIRECTIVE_VERBS } from '../rules/directives';
import { RULES } from '../rules/index';
import type { Snapshot } from './documents';

const UNITS: { label: string; detail: string }[] = [
  { label: 'wps', detail: 'words per second (the default unit)' },
  { label: 'sps', detail: 'syllables per second' },
];

function keyItem(spec: KeySpec, line: number, from: number, to: number): CompletionItem {
  return {
    label: `@${spec.key}`,
    kind: CompletionItemKind.Property,
    detail: spec.summary,
    documentation: { kind: MarkupKind.Markdown, value: `${spec.summary}\n\nExample: \`@${spec.key} ${spec.example}\`` },
    textEdit: {
      range: { start: { line, character: from }, end: { line, character: to } },
      newText: `@${spec.key} `,
    },
    filterText: `@${spec.key}`,
    command: spec.values?.length ? { title: 'values', command: 'editor.action.triggerSuggest' } : undefined,
  };
}

/** Every set label in use in the script, plus the usual ones. */
function setLabels(s: Snapshot): string[] {
  const labels = new Set(keySpec('set')?.values ?? []);
  for (const r of s.analysis.rungs) {
    for (const l of r.node.sets) labels.add(l);
    for (const it of r.items) for (const l of it.node.sets) labels.add(l);
  }
  return [...labels];
}

function isInHeader(s: Snapshot, line: number): boolean {
  const first = s.analysis.rungs.find((r) => !r.node.implicit);
  return !first || line < first.node.line;
}

export function completion(s: Snapshot, line: number, character: number): CompletionItem[] {
  const raw = s.lines[line] ?? '';
  const before = raw.slice(0, character);
  const trimmed = before.trimStart();
  const indent = before.length - trimmed.length;

  // A lint directive in a comment: "// rungs: allow step-too-big, dup|".
  const directive = /^\/\/\s*rungs\s*:\s*(\S*)(\s+[^]*)?$/i.exec(trimmed);
  if (directive) {
    if (directive[2] === undefined) {
      return DIRECTIVE_VERBS.map((v) => ({ label: v, kind: CompletionItemKind.Keyword, detail: v === 'allow' ? 'silence rules on the next line' : 'silence rules in the whole script' }));
    }
    return RULES.map((r) => ({ label: r.id, kind: CompletionItemKind.EnumMember, detail: r.summary }));
  }
  if (/^\/\/\s*r?u?n?g?s?$/i.test(trimmed) && trimmed.length > 2) {
    return [{ label: DIRECTIVE_PREFIX, kind: CompletionItemKind.Keyword, detail: 'lint directive: rungs: allow RULE', insertText: `${DIRECTIVE_PREFIX} ` }];
  }
  // A key being typed at the start of a line: "@pa|".
  const keyTyped = /^@[\w-]*$/.exec(trimmed);
  if (keyTyped) {
    const header = isInHeader(s, line);
    // Rate-records keys belong in config files beside the records, never in a script.
    return KEYS.filter((k) => !k.recordsOnly && (header ? k.scope !== 'rung' : k.scope !== 'script' || RUNG_KEYS.has(k.key))).map((k) =>
      keyItem(k, line, indent, character),
    );
  }
  // An inline attribute on a rung header: "== Breakfast @p|".
  const inline = /(^|\s)@([\w-]*)$/.exec(before);
  if (inline && trimmed.startsWith('==')) {
    const from = before.length - inline[2].length - 1;
    return KEYS.filter((k) => k.key === 'paces' || k.key === 'set').map((k) => keyItem(k, line, from, character));
  }
  // In an item's trailer: "... | note @s|" or "... @set tr|".
  if (!trimmed.startsWith('@') && !trimmed.startsWith('//') && !trimmed.startsWith('==') && before.includes('|')) {
    if (/(^|\s)@set\s+(?:[\w-]+[\s,]+)*[\w-]*$/.test(before)) return labelItems(s);
    if (inline) {
      const from = before.length - inline[2].length - 1;
      return [keyItem(keySpec('set')!, line, from, character)];
    }
    return [];
  }
  // A value after a key: "@direction r|", "@set tr|", "@paces 1, 1.5 |".
  const valueTyped = /^@([\w-]+)(?:\s*:)?\s+(.*)$/.exec(trimmed) ?? /(?:^|\s)@(pace|paces|set)\s+([^@]*)$/.exec(trimmed);
  if (valueTyped) {
    const spec = keySpec(valueTyped[1]);
    if (!spec) return [];
    if (spec.key === 'set') return labelItems(s);
    if (spec.key === 'paces' && /\d\s*$/.test(valueTyped[2])) {
      return UNITS.map((u) => ({ label: u.label, kind: CompletionItemKind.Unit, detail: u.detail }));
    }
    if (spec.key === 'say' && !valueTyped[2].includes('=')) return sayItems(s);
    return (spec.values ?? []).map((v) => ({ label: v, kind: CompletionItemKind.Value, detail: `@${spec.key} ${v}` }));
  }
  // A new rung header.
  if (/^=?=?$/.test(trimmed) && trimmed.length > 0) {
    return [
      {
        label: '== rung',
        kind: CompletionItemKind.Snippet,
        detail: 'a new rung (level)',
        insertTextFormat: InsertTextFormat.Snippet,
        textEdit: { range: { start: { line, character: indent }, end: { line, character } }, newText: '== ${1:Name}' },
      },
    ];
  }
  return [];
}

function labelItems(s: Snapshot): CompletionItem[] {
  return setLabels(s).map((l) => ({ label: l, kind: CompletionItemKind.EnumMember, detail: 'set label' }));
}

/** `@say` words: the estimated words of the script, with their estimated phones to start from. */
function sayItems(s: Snapshot): CompletionItem[] {
  const seen = new Map<string, string>();
  for (const it of s.analysis.items) {
    for (const w of it.words) {
      if (isEstimated(w) && !seen.has(w.spoken)) seen.set(w.spoken, w.phones.join(' '));
    }
  }
  return [...seen].map(([word, phones]) => ({
    label: word,
    kind: CompletionItemKind.Text,
    detail: `estimated: ${phones}`,
    insertText: `${word} = ${phones}`,
  }));
}

/** Signature-like help while a setting's value is typed. */
export function signatureHelp(s: Snapshot, line: number, character: number): SignatureHelp | null {
  const before = (s.lines[line] ?? '').slice(0, character);
  const m = /(?:^\s*|\s)@([\w-]+)(?:\s*:)?\s+[^@]*$/.exec(before);
  if (!m) return null;
  const spec = keySpec(m[1]);
  if (!spec) return null;
  const param = spec.values?.length ? spec.values.join(' | ') : spec.example;
  const label = `@${spec.key} ${param}`;
  return {
    signatures: [
      {
        label,
        documentation: { kind: MarkupKind.Markdown, value: `${spec.summary}\n\nExample: \`@${spec.key} ${spec.example}\`` },
        parameters: [{ label: [label.length - param.length, label.length] }],
      },
    ],
    activeSignature: 0,
    activeParameter: 0,
  };
}
