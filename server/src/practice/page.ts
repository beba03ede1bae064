// The practice page: one self-contained HTML file that runs a session from a laptop or tablet. One
// item at a time in very large type, each word lit on the timing plan, an optional pacer bar, the
// model audio when it was made, keyboard and touch controls, and a count of items done. Built for
// clients with aphasia: high contrast, nothing else on screen, large targets.
//
// A pure renderer: plan in, HTML out. Nothing the script says is ever parsed as HTML: item text
// travels as JSON in a data block and is put on screen with textContent. The Content-Security-
// Policy allows only this page's own script and style (by hash) and data: audio; no network.
import { createHash } from 'node:crypto';
import type { SessionPlan } from '../core/timing';
import { documentHead, escapeHtml } from '../report/html';
import { PAGE_SCRIPT, PAGE_STYLE } from './pageAssets';

export interface PracticeItem {
  text: string;
  /** The text cut into words (w = word index) and what lies between them (w = -1). */
  parts: { t: string; w: number }[];
  /** Words with their planned onset and end, in milliseconds from the item's start. */
  words: { text: string; at: number; end: number }[];
  /** Length of the model, and of the whole turn (with the echo window), in milliseconds. */
  model: number;
  turn: number;
  /** A data: URI of the item's model audio, or null. */
  audio: string | null;
}

export interface PracticeOptions {
  title: string;
  /** One line under the controls, e.g. "Rung 2 at 1.2 wps, unison". */
  subtitle: string;
  caution: string;
  /** Model audio per planned item (same order as plan.items), as WAV bytes. */
  audio?: (Uint8Array | null)[];
}

const sha256 = (text: string) => `'sha256-${createHash('sha256').update(text, 'utf8').digest('base64')}'`;


/** JSON that cannot close the data block it sits in (every <, > and & is written as \uXXXX). */
function safeJson(value: unknown): string {
  return JSON.stringify(value).replace(/[<>&\u2028\u2029]/g, (c) => `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

export function practiceItems(plan: SessionPlan, audio: (Uint8Array | null)[] = []): PracticeItem[] {
  const ms = (s: number) => Math.round(s * 1000);
  return plan.items.map((item, k) => {
    const bytes = audio[k];
    const parts: PracticeItem['parts'] = [];
    let at = 0;
    item.words.forEach((w, i) => {
      const from = w.start - item.textStart;
      const to = w.end - item.textStart;
      if (from > at) parts.push({ t: item.text.slice(at, from), w: -1 });
      parts.push({ t: item.text.slice(from, to), w: i });
      at = to;
    });
    if (at < item.text.length) parts.push({ t: item.text.slice(at), w: -1 });
    return {
      text: item.text,
      parts,
      words: item.words.map((w) => ({ text: item.text.slice(w.start - item.textStart, w.end - item.textStart), at: ms(w.onset - item.start), end: ms(w.offset - item.start) })),
      model: ms(item.end - item.start),
      turn: ms((item.response?.end ?? item.end) - item.start),
      audio: bytes ? `data:audio/wav;base64,${Buffer.from(bytes).toString('base64')}` : null,
    };
  });
}

export function renderPracticePage(plan: SessionPlan, options: PracticeOptions): string {
  const data = safeJson({ items: practiceItems(plan, options.audio), mode: plan.mode });
  const csp = [
    "default-src 'none'",
    `script-src ${sha256(PAGE_SCRIPT)}`,
    `style-src ${sha256(PAGE_STYLE)}`,
    'media-src data:',
    "img-src 'none'",
    "connect-src 'none'",
    "base-uri 'none'",
    "form-action 'none'",
  ].join('; ');
  return `${documentHead({ csp, title: options.title, style: PAGE_STYLE })}
<main>
<p id="count" aria-live="polite"></p>
<p id="item" lang="en" aria-live="off"></p>
<div id="pacer" aria-hidden="true"><div id="pacer-fill"></div></div>
<p id="turn" aria-live="polite"></p>
</main>
<nav aria-label="Controls">
<button id="prev" type="button" aria-keyshortcuts="ArrowLeft">&#9664; Back</button>
<button id="play" type="button" aria-keyshortcuts="Space">&#9654; Start</button>
<button id="repeat" type="button" aria-keyshortcuts="R">&#8635; Again</button>
<button id="next" type="button" aria-keyshortcuts="ArrowRight">Next &#9654;</button>
</nav>
<footer>
<p>${escapeHtml(options.title)} · ${escapeHtml(options.subtitle)} · keys: Space start/stop, R again, ← →, V pacer</p>
<p>${escapeHtml(options.caution)}</p>
</footer>
<script type="application/json" id="plan">${data}</script>
<script>${PAGE_SCRIPT}</script>
</body>
</html>
`;
}
