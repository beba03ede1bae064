// Draws a script's difficulty ladder as SVG plus a summary table, and wraps it in the webview page.
// Pure functions from the server's `rungs/ladder` payload to markup, so they are unit-tested
// without an editor. Every string that came from the script is escaped here; colours come from
// the editor theme's CSS variables, so the view follows light, dark and high-contrast themes.
import { documentHead, escapeHtml, webviewPolicy } from '../../server/src/report/html';
import { estimatedMark, estimatedNote } from './present';
import { SET_MARK_CSS, setLegend, setMarks, setMarkSvg } from './ladderSets';
import type { Ladder, LadderProblem, LadderRung, LadderStep } from './protocol';

export { escapeHtml };

const fmt = (n: number): string => (Number.isFinite(n) ? n.toFixed(1) : '–');

/** Words with estimated pronunciations in a whole rung (its median and range rest on them). */
const rungEstimated = (r: LadderRung): number => r.items.reduce((n, it) => n + (it.estimatedWords ?? 0), 0);

function truncate(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

/** The problem a step mark explains: the same rule, reported on the upper rung's header if possible. */
export function problemForStep(ladder: Ladder, step: LadderStep): LadderProblem | undefined {
  if (!step.problem) return undefined;
  const at = ladder.rungs[step.to]?.line;
  const same = ladder.problems.filter((p) => p.rule === step.problem);
  return same.find((p) => p.line === at) ?? same[0];
}

const PLOT = { top: 24, bottom: 64, left: 44, right: 16, height: 340, band: 120 };

/** The chart and the table, without the page around them (the webview swaps this on updates). */
export function renderLadderBody(ladder: Ladder | null): string {
  if (!ladder || ladder.rungs.length === 0 || ladder.rungs.every((r) => r.items.length === 0)) {
    return '<p class="empty">No items to draw yet: write a sentence on a line of its own.</p>';
  }
  const n = ladder.rungs.length;
  const width = PLOT.left + PLOT.right + n * PLOT.band;
  const plotH = PLOT.height - PLOT.top - PLOT.bottom;
  // The scale is the ladder metric's: difficulty 0-100, or 0 to the largest value (syllables, ...).
  const top = ladder.scaleMax ?? 100;
  const metric = ladder.metric ?? 'difficulty';
  const y = (d: number): number => PLOT.top + ((top - Math.max(0, Math.min(top, d))) / top) * plotH;
  const x = (i: number): number => PLOT.left + (i + 0.5) * PLOT.band;
  const out: string[] = [];
  const label = ladder.title ? `Difficulty ladder of ${ladder.title}` : 'Difficulty ladder';
  out.push(
    `<svg class="ladder" viewBox="0 0 ${width} ${PLOT.height}" width="100%" preserveAspectRatio="xMinYMin meet" role="img" aria-label="${escapeHtml(label)}">`,
  );

  // Grid and axis: difficulty runs 0-100 bottom to top.
  for (const v of [0, 0.25, 0.5, 0.75, 1].map((f) => Math.round(f * top * 10) / 10)) {
    out.push(`<line class="grid" x1="${PLOT.left}" x2="${width - PLOT.right}" y1="${y(v)}" y2="${y(v)}"/>`);
    out.push(`<text class="axis" x="${PLOT.left - 6}" y="${y(v) + 4}" text-anchor="end">${v}</text>`);
  }

  // The allowed step: from each rung's median, how far the next rung's median may move.
  const maxStep = ladder.maxStep;
  for (const s of maxStep === null ? [] : ladder.steps) {
    const m = ladder.rungs[s.from].median;
    const [lo, hi] = ladder.direction === 'falling' ? [m - maxStep!, m] : [m, m + maxStep!];
    const w = PLOT.band * 0.8;
    out.push(
      `<rect class="allowed" x="${x(s.to) - w / 2}" y="${y(hi)}" width="${w}" height="${Math.max(1, y(lo) - y(hi))}">` +
        `<title>Allowed range for the median of ${escapeHtml(ladder.rungs[s.to].name)}: ${fmt(Math.max(0, lo))}-${fmt(Math.min(top, hi))} (step ${fmt(maxStep!)})</title></rect>`,
    );
  }

  // Items, spread across their rung's band by rank so the order within a rung shows too.
  const marks = setMarks(ladder);
  ladder.rungs.forEach((r, i) => {
    const count = r.items.length;
    r.items.forEach((it) => {
      const spread = count > 1 ? ((it.rank - 1) / (count - 1) - 0.5) * PLOT.band * 0.55 : 0;
      const cx = x(i) + spread;
      // A point whose difficulty rests on estimated pronunciations is drawn hollow.
      const est = it.estimatedWords ?? 0;
      const note = estimatedNote(est);
      out.push(
        `<circle class="item" data-line="${it.line}"${est ? ` data-estimated="${est}"` : ''} tabindex="0" role="button" cx="${cx.toFixed(1)}" cy="${y(it.value ?? it.difficulty).toFixed(1)}" r="4.5">` +
          `<title>${escapeHtml(it.text)} — ${escapeHtml(metric)} ${estimatedMark(est)}${fmt(it.value ?? it.difficulty)}, rank ${it.rank} of ${count} (line ${it.line + 1})${note ? `; ${note}` : ''}${it.sets?.length ? `; set ${escapeHtml(it.sets.join(', '))}` : ''}</title></circle>` +
          setMarkSvg(marks, it, cx, y(it.value ?? it.difficulty), escapeHtml),
      );
    });
  });

  // Medians joined step by step; a step that breaks a rule is drawn as a problem and marked.
  for (const s of ladder.steps) {
    const a = ladder.rungs[s.from];
    const b = ladder.rungs[s.to];
    const cls = s.problem ? 'step problem' : 'step';
    out.push(
      `<line class="${cls}" x1="${x(s.from)}" y1="${y(a.median).toFixed(1)}" x2="${x(s.to)}" y2="${y(b.median).toFixed(1)}"/>`,
    );
  }
  ladder.rungs.forEach((r, i) => {
    const cx = x(i);
    const cy = y(r.median);
    out.push(
      `<path class="median" data-line="${r.line}" tabindex="0" role="button" d="M${cx} ${(cy - 7).toFixed(1)} L${cx + 7} ${cy.toFixed(1)} L${cx} ${(cy + 7).toFixed(1)} L${cx - 7} ${cy.toFixed(1)} Z">` +
        `<title>${escapeHtml(r.name)}: median ${fmt(r.median)} (${fmt(r.min)}-${fmt(r.max)}), ${r.items.length} items</title></path>`,
    );
  });
  for (const s of ladder.steps) {
    if (!s.problem) continue;
    const p = problemForStep(ladder, s);
    const mx = (x(s.from) + x(s.to)) / 2;
    const my = (y(ladder.rungs[s.from].median) + y(ladder.rungs[s.to].median)) / 2;
    const line = p?.line ?? ladder.rungs[s.to].line;
    out.push(
      `<g class="mark" data-rule="${escapeHtml(s.problem)}" data-line="${line}" tabindex="0" role="button" transform="translate(${mx.toFixed(1)} ${my.toFixed(1)})">` +
        `<circle r="9"/><text y="4" text-anchor="middle">!</text>` +
        `<title>${escapeHtml(s.problem)}: ${escapeHtml(p?.message ?? `step of ${fmt(s.delta)}`)}</title></g>`,
    );
  }

  // Rung names under the axis; a click goes to the header.
  ladder.rungs.forEach((r, i) => {
    out.push(
      `<text class="rung-name" data-line="${r.line}" tabindex="0" role="button" x="${x(i)}" y="${PLOT.height - PLOT.bottom + 20}" text-anchor="middle">${escapeHtml(truncate(r.name, 18))}<title>${escapeHtml(r.name)}</title></text>`,
    );
    out.push(
      `<text class="axis" x="${x(i)}" y="${PLOT.height - PLOT.bottom + 36}" text-anchor="middle">median ${fmt(r.median)}</text>`,
    );
  });
  out.push('</svg>');

  // The same facts as a table, for screen readers and for reading exact numbers.
  out.push('<table class="summary"><thead><tr><th>Rung</th><th>Items</th><th>Median</th><th>Range</th><th>Estimated</th><th>Step</th><th>Problem</th></tr></thead><tbody>');
  ladder.rungs.forEach((r, i) => {
    const step = ladder.steps.find((s) => s.to === i);
    const prob = step ? problemForStep(ladder, step) : undefined;
    const est = rungEstimated(r);
    const mark = estimatedMark(est);
    const estCell = est ? `<td class="estimated" title="${escapeHtml(estimatedNote(est))}">${mark}${est}</td>` : '<td></td>';
    out.push(
      `<tr data-line="${r.line}" tabindex="0"><td>${escapeHtml(r.name)}</td><td>${r.items.length}</td><td>${mark}${fmt(r.median)}</td>` +
        `<td>${mark}${fmt(r.min)}-${mark}${fmt(r.max)}</td>${estCell}<td>${step ? (step.delta >= 0 ? '+' : '') + fmt(step.delta) : ''}</td>` +
        `<td class="${step?.problem ? 'problem' : ''}">${step?.problem ? escapeHtml(prob?.message ?? step.problem) : ''}</td></tr>`,
    );
  });
  out.push('</tbody></table>');
  const dir = ladder.direction === 'falling' ? 'falling' : 'rising';
  const anyEstimated = ladder.rungs.some((r) => rungEstimated(r) > 0);
  const estimatedLegend = anyEstimated ? ` Hollow points and ${estimatedMark(1)} mark difficulties that rest on words with an estimated pronunciation.` : '';
  out.push(`<p class="legend">Direction ${dir}; ${maxStep === null ? `${escapeHtml(metric)} ladder, no step limit set` : `allowed step ${fmt(maxStep)} ${metric === 'difficulty' ? 'points' : escapeHtml(metric)} (shaded)`}.${estimatedLegend}${setLegend(marks, escapeHtml)} Click a point, a mark or a rung to go to its line.</p>`);
  return out.join('\n');
}

const STYLE = `
body { font-family: var(--vscode-font-family); font-size: var(--vscode-font-size); color: var(--vscode-foreground); background: var(--vscode-editor-background); padding: 8px 16px; }
h1 { font-size: 1.1em; font-weight: 600; margin: 4px 0 8px; }
.chart { max-width: 1100px; }
svg.ladder { display: block; max-height: 70vh; }
svg.ladder text { fill: var(--vscode-foreground); font-size: 11px; }
svg.ladder .axis { fill: var(--vscode-descriptionForeground); }
svg.ladder .grid { stroke: var(--vscode-editorWidget-border, var(--vscode-panel-border)); stroke-width: 1; opacity: 0.5; }
svg.ladder .allowed { fill: var(--vscode-charts-green); opacity: 0.14; }
svg.ladder .item { fill: var(--vscode-charts-blue); opacity: 0.85; cursor: pointer; }
svg.ladder .item[data-estimated] { fill: var(--vscode-editor-background); stroke: var(--vscode-charts-blue); stroke-width: 2; opacity: 1; }
svg.ladder .median { fill: var(--vscode-foreground); stroke: var(--vscode-editor-background); stroke-width: 1.5; cursor: pointer; }
svg.ladder .step { stroke: var(--vscode-foreground); stroke-width: 2; }
svg.ladder .step.problem { stroke: var(--vscode-errorForeground); stroke-width: 3; stroke-dasharray: 6 3; }
svg.ladder .mark circle { fill: var(--vscode-errorForeground); }
svg.ladder .mark text { fill: var(--vscode-editor-background); font-weight: 700; font-size: 13px; }
svg.ladder .mark, svg.ladder .rung-name { cursor: pointer; }
svg.ladder [tabindex]:focus { outline: 1px solid var(--vscode-focusBorder); }
table.summary { border-collapse: collapse; margin-top: 12px; }
table.summary th, table.summary td { text-align: left; padding: 2px 10px 2px 0; border-bottom: 1px solid var(--vscode-editorWidget-border, transparent); }
table.summary tr[data-line] { cursor: pointer; }
table.summary tr[data-line]:hover { background: var(--vscode-list-hoverBackground); }
td.problem { color: var(--vscode-errorForeground); }
.legend, .empty { color: var(--vscode-descriptionForeground); }
${SET_MARK_CSS}
`;

// The page's only script: clicks and keys post the line to go to; updates swap the body.
const SCRIPT = `
const vscode = acquireVsCodeApi();
const chart = document.getElementById('chart');
const heading = document.getElementById('heading');
function go(el) {
  const target = el && el.closest ? el.closest('[data-line]') : null;
  if (target) vscode.postMessage({ type: 'reveal', line: Number(target.getAttribute('data-line')) });
}
document.addEventListener('click', (e) => go(e.target));
document.addEventListener('keydown', (e) => { if (e.key === 'Enter' || e.key === ' ') { go(e.target); e.preventDefault(); } });
window.addEventListener('message', (e) => {
  const m = e.data;
  if (m && m.type === 'update') { chart.innerHTML = m.body; heading.textContent = m.heading; document.body.setAttribute('data-version', String(m.version)); }
});
`;

export interface PageOptions {
  /** The webview's `cspSource`. */
  cspSource: string;
  /** A fresh random nonce for the page's style and script. */
  nonce: string;
  heading: string;
  body: string;
}

/** The whole ladder page: strict Content-Security-Policy, no remote resources. */
export function renderLadderPage(o: PageOptions): string {
  return renderWebviewPage({ ...o, title: 'Ladder', style: STYLE });
}

/**
 * A Rungs webview page (ladder and progress views): nonce-only styles and script, no remote
 * resources; the page's script posts `reveal` for clicked `[data-line]` elements and swaps the
 * body on `update` messages.
 */
export function renderWebviewPage(o: PageOptions & { title: string; style: string }): string {
  return `${documentHead({ csp: webviewPolicy(o), title: o.title, style: o.style, nonce: o.nonce })}
<h1 id="heading">${escapeHtml(o.heading)}</h1>
<div id="chart" class="chart">${o.body}</div>
<script nonce="${o.nonce}">${SCRIPT}</script>
</body>
</html>`;
}
