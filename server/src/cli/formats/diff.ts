// A unified diff of two texts, line by line (longest common subsequence), for --fix-dry-run.
// The quadratic table covers only the changed middle, up to a bound; context is 3 lines as in `diff -u`.

import { terminalSafe } from '../../core/excerpt';

/** Largest line-pair table built (cells); beyond it the changed middle is shown whole. */
const MAX_TABLE = 4_000_000;

export function unifiedDiff(file: string, before: string, after: string, context = 3): string {
  if (before === after) return '';
  const a = before.split('\n');
  const b = after.split('\n');
  // Lines the texts share at both ends are matched directly; only the middle gets the table, and
  // a middle too large for it (a huge file rewritten throughout) is shown as removed then added.
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;
  const n = a.length - tail;
  const m = b.length - tail;
  const table = (n - head + 1) * (m - head + 1) <= MAX_TABLE;
  const lcs: Uint32Array[] = table ? Array.from({ length: n - head + 1 }, () => new Uint32Array(m - head + 1)) : [];
  if (table) for (let i = n - 1; i >= head; i--) for (let j = m - 1; j >= head; j--) lcs[i - head][j - head] = a[i] === b[j] ? lcs[i - head + 1][j - head + 1] + 1 : Math.max(lcs[i - head + 1][j - head], lcs[i - head][j - head + 1]);
  const L = (i: number, j: number) => lcs[i - head][j - head];
  // Each op remembers how many lines of a and b come before it, for the hunk headers.
  const ops: { t: ' ' | '-' | '+'; s: string; ai: number; bi: number }[] = [];
  let i = 0;
  let j = 0;
  for (; i < head; i++, j++) ops.push({ t: ' ', s: a[i], ai: i, bi: j });
  while (i < n || j < m) {
    const at = { ai: i, bi: j };
    if (i < n && j < m && a[i] === b[j]) {
      ops.push({ t: ' ', s: a[i], ...at });
      i++;
      j++;
    } else if (i < n && (j >= m || !table || L(i + 1, j) >= L(i, j + 1))) ops.push({ t: '-', s: a[i++], ...at });
    else ops.push({ t: '+', s: b[j++], ...at });
  }
  for (let k = 0; k < tail; k++, i++, j++) ops.push({ t: ' ', s: a[i], ai: i, bi: j });
  const out = [`--- a/${terminalSafe(file)}`, `+++ b/${terminalSafe(file)}`];
  let k = 0;
  while (k < ops.length) {
    if (ops[k].t === ' ') {
      k++;
      continue;
    }
    const start = Math.max(0, k - context);
    let end = k;
    // Extend the hunk while changes are within 2 × context lines of each other.
    for (let q = k; q < ops.length; q++) {
      if (ops[q].t !== ' ') end = q;
      else if (q - end > 2 * context) break;
    }
    const stop = Math.min(ops.length, end + context + 1);
    const hunk = ops.slice(start, stop);
    const aStart = hunk[0].ai;
    const bStart = hunk[0].bi;
    const aLen = hunk.filter((o) => o.t !== '+').length;
    const bLen = hunk.filter((o) => o.t !== '-').length;
    out.push(`@@ -${aLen ? aStart + 1 : aStart},${aLen} +${bLen ? bStart + 1 : bStart},${bLen} @@`);
    // Escaped for the terminal; a CR ending a line (CRLF files) is kept, as it shows nothing.
    for (const o of hunk) out.push(`${o.t}${o.s.endsWith('\r') ? `${terminalSafe(o.s.slice(0, -1))}\r` : terminalSafe(o.s)}`);
    k = stop;
  }
  return `${out.join('\n')}\n`;
}
