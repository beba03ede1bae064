// A unified diff of two texts, line by line (longest common subsequence), for --fix-dry-run.
// Scripts are small, so the quadratic table is fine; context is 3 lines as in `diff -u`.

export function unifiedDiff(file: string, before: string, after: string, context = 3): string {
  if (before === after) return '';
  const a = before.split('\n');
  const b = after.split('\n');
  const n = a.length;
  const m = b.length;
  const lcs: Uint32Array[] = Array.from({ length: n + 1 }, () => new Uint32Array(m + 1));
  for (let i = n - 1; i >= 0; i--) for (let j = m - 1; j >= 0; j--) lcs[i][j] = a[i] === b[j] ? lcs[i + 1][j + 1] + 1 : Math.max(lcs[i + 1][j], lcs[i][j + 1]);
  // Each op remembers how many lines of a and b come before it, for the hunk headers.
  const ops: { t: ' ' | '-' | '+'; s: string; ai: number; bi: number }[] = [];
  let i = 0;
  let j = 0;
  while (i < n || j < m) {
    const at = { ai: i, bi: j };
    if (i < n && j < m && a[i] === b[j]) {
      ops.push({ t: ' ', s: a[i], ...at });
      i++;
      j++;
    } else if (i < n && (j >= m || lcs[i + 1][j] >= lcs[i][j + 1])) ops.push({ t: '-', s: a[i++], ...at });
    else ops.push({ t: '+', s: b[j++], ...at });
  }
  const out = [`--- a/${file}`, `+++ b/${file}`];
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
    for (const o of hunk) out.push(`${o.t}${o.s}`);
    k = stop;
  }
  return `${out.join('\n')}\n`;
}
