// Semantic tokens for the parts of the format: comments, setting keys and values, the rung mark
// and name, variant marks in items, and the trailer's bar, id and set labels. Item text itself is
// left to the TextMate grammar, so themes colour sentences as plain prose.
import { SemanticTokensBuilder, type SemanticTokens, type SemanticTokensLegend } from 'vscode-languageserver/node';
import type { Snapshot } from './documents';
import { pushAll } from '../core/arrays';

export const TOKEN_TYPES = ['comment', 'keyword', 'string', 'namespace', 'operator', 'label', 'enumMember', 'number'] as const;
type TokenType = (typeof TOKEN_TYPES)[number];
export const LEGEND: SemanticTokensLegend = { tokenTypes: [...TOKEN_TYPES], tokenModifiers: [] };

interface Tok {
  start: number;
  length: number;
  type: TokenType;
}

const SETTING_LINE = /^(\s*)(@[A-Za-z][\w-]*)(\s*:?\s*)(.*?)\s*$/;

function settingTokens(raw: string): Tok[] {
  const m = SETTING_LINE.exec(raw);
  if (!m) return [];
  const out: Tok[] = [{ start: m[1].length, length: m[2].length, type: 'keyword' }];
  if (m[4]) out.push({ start: m[1].length + m[2].length + m[3].length, length: m[4].length, type: 'string' });
  return out;
}

function trailerTokens(raw: string, bar: number): Tok[] {
  const out: Tok[] = [{ start: bar, length: 1, type: 'operator' }];
  const trailer = raw.slice(bar + 1);
  const base = bar + 1;
  for (const m of trailer.matchAll(/(^|\s)(#[\w.:-]+)/g)) out.push({ start: base + m.index! + m[1].length, length: m[2].length, type: 'label' });
  for (const m of trailer.matchAll(/(^|\s)(@set)(\s+)([^@#]*?)\s*(?=$|\s[@#])/g)) {
    const keyAt = base + m.index! + m[1].length;
    out.push({ start: keyAt, length: m[2].length, type: 'keyword' });
    let at = keyAt + m[2].length + m[3].length;
    for (const part of m[4].split(/([,\s]+)/)) {
      if (part && !/^[,\s]+$/.test(part)) out.push({ start: at, length: part.length, type: 'enumMember' });
      at += part.length;
    }
  }
  return out;
}

export function semanticTokens(s: Snapshot): SemanticTokens {
  const perLine = new Map<number, Tok[]>();
  const add = (line: number, toks: Tok[]) => perLine.set(line, [...(perLine.get(line) ?? []), ...toks]);
  for (const c of s.analysis.script.comments) add(c.line, [{ start: c.start, length: (s.lines[c.line] ?? '').trimEnd().length - c.start, type: 'comment' }]);
  const headerLines = new Set(s.analysis.rungs.filter((r) => !r.node.implicit).map((r) => r.node.line));
  s.lines.forEach((raw, line) => {
    const t = raw.trimStart();
    if (t.startsWith('@')) add(line, settingTokens(raw));
    else if (headerLines.has(line)) {
      const rung = s.rungAtHeader(line)!;
      const start = raw.length - t.length;
      const mark = /^=+/.exec(t)![0].length;
      const toks: Tok[] = [{ start, length: mark, type: 'operator' }];
      const nameAt = raw.indexOf(rung.node.name, start + mark);
      if (nameAt >= 0 && !rung.node.name.startsWith('Rung ')) toks.push({ start: nameAt, length: rung.node.name.length, type: 'namespace' });
      for (const st of rung.node.settings.filter((x) => x.line === line)) {
        toks.push({ start: st.keyStart, length: st.keyEnd - st.keyStart, type: 'keyword' });
        if (st.valueEnd > st.valueStart) toks.push({ start: st.valueStart, length: st.valueEnd - st.valueStart, type: 'string' });
      }
      const tail = /\s(=+)\s*$/.exec(raw);
      if (tail && tail.index + 1 > start + mark) toks.push({ start: tail.index + 1, length: tail[1].length, type: 'operator' });
      add(line, toks);
    }
  });
  for (const it of s.analysis.items) {
    const raw = s.lines[it.node.line] ?? '';
    const toks: Tok[] = [];
    for (const m of it.node.text.matchAll(/\p{L}\((\d+)\)/gu)) toks.push({ start: it.node.textStart + m.index! + 1, length: m[1].length + 2, type: 'number' });
    const bar = raw.indexOf('|', it.node.textEnd);
    if (bar >= 0) pushAll(toks, trailerTokens(raw, bar));
    add(it.node.line, toks);
  }
  const builder = new SemanticTokensBuilder();
  const types = new Map(TOKEN_TYPES.map((t, i) => [t, i]));
  for (const line of [...perLine.keys()].sort((a, b) => a - b)) {
    const toks = perLine.get(line)!.filter((t) => t.length > 0).sort((a, b) => a.start - b.start);
    let end = -1;
    for (const t of toks) {
      if (t.start < end) continue; // never overlap
      builder.push(line, t.start, t.length, types.get(t.type)!, 0);
      end = t.start + t.length;
    }
  }
  return builder.build();
}
