// Cue tracks of a session plan: WebVTT (W3C WebVTT, one cue per item with a timestamp tag before
// each word after the first), SRT (one cue per item) and a CSV of every word's start and end.
// Pure renderers: a plan in, a string out; the CLI and the editor write the files.
import { stringify } from 'csv-stringify/sync';
import type { PlannedItem, SessionPlan } from './timing';

/** Shown in the response window of echo mode, when the client repeats the model. */
export const RESPONSE_CUE_TEXT = '(your turn)';

function clock(seconds: number, sep: '.' | ','): string {
  const ms = Math.max(0, Math.round(seconds * 1000));
  const h = Math.floor(ms / 3_600_000);
  const m = Math.floor(ms / 60_000) % 60;
  const s = Math.floor(ms / 1000) % 60;
  const pad = (n: number, w = 2) => String(n).padStart(w, '0');
  return `${pad(h)}:${pad(m)}:${pad(s)}${sep}${pad(ms % 1000, 3)}`;
}

/** A WebVTT timestamp, hh:mm:ss.ttt. */
export const vttTime = (seconds: number): string => clock(seconds, '.');
/** An SRT timestamp, hh:mm:ss,ttt. */
export const srtTime = (seconds: number): string => clock(seconds, ',');

/** Cue text escaping of WebVTT: &, < and > are the only characters with meaning in cue text. */
function vttEscape(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

/** A one-line cue identifier: it may not hold "-->" or a line break (WebVTT 4.1). */
function identifier(text: string): string {
  return text.replace(/-->/g, '- ->').replace(/[\r\n]+/g, ' ').trim();
}

/** The cue identifier of an item: its `#id`, or its 1-based line. */
export function itemLabel(item: PlannedItem): string {
  return item.id ? `${item.id}` : `line ${item.line + 1}`;
}

/**
 * The text of one item's cue, as written (punctuation kept): every word after the first follows
 * its onset's timestamp tag.
 */
function wordTimedText(item: PlannedItem): string {
  let last = Math.round(item.start * 1000);
  return item.words
    .map((w, i) => {
      const from = i === 0 ? 0 : w.start - item.textStart;
      const to = i + 1 < item.words.length ? item.words[i + 1].start - item.textStart : item.text.length;
      const written = item.text.slice(from, to);
      const ms = Math.round(w.onset * 1000);
      // Inner timestamps must lie strictly after the cue start and after each other (WebVTT 4.2.1).
      const tag = i > 0 && ms > last ? `<${vttTime(ms / 1000)}>` : '';
      if (tag) last = ms;
      return `${tag}${vttEscape(written)}`;
    })
    .join('')
    .replace(/[\r\n]+/g, ' ');
}

export function renderVtt(plan: SessionPlan, note?: string): string {
  const out = ['WEBVTT', ''];
  if (note) out.push(`NOTE ${identifier(note)}`, '');
  for (const item of plan.items) {
    out.push(identifier(itemLabel(item)), `${vttTime(item.start)} --> ${vttTime(item.end)}`, wordTimedText(item), '');
    if (item.response) {
      out.push(identifier(`${itemLabel(item)} response`), `${vttTime(item.response.start)} --> ${vttTime(item.response.end)}`, RESPONSE_CUE_TEXT, '');
    }
  }
  return out.join('\n');
}

export function renderSrt(plan: SessionPlan): string {
  const out: string[] = [];
  let n = 0;
  for (const item of plan.items) {
    out.push(String(++n), `${srtTime(item.start)} --> ${srtTime(item.end)}`, item.text.replace(/[\r\n]+/g, ' '), '');
    if (item.response) out.push(String(++n), `${srtTime(item.response.start)} --> ${srtTime(item.response.end)}`, RESPONSE_CUE_TEXT, '');
  }
  return out.join('\n');
}

/** One row per word: where it is written and its slot, seconds with millisecond precision. */
export function renderWordCsv(plan: SessionPlan): string {
  const names = new Map(plan.rungs.map((r) => [r.index, r.name]));
  const rows: (string | number)[][] = [['rung', 'item_line', 'item_id', 'word_index', 'word', 'start', 'end', 'syllables']];
  for (const item of plan.items) {
    item.words.forEach((w, i) => {
      rows.push([names.get(item.rung) ?? '', item.line + 1, item.id ?? '', i + 1, w.text, Number(w.onset.toFixed(3)), Number(w.offset.toFixed(3)), w.syllables]);
    });
  }
  return stringify(rows);
}
