// Draws a records file's progress: per client and rung, the paced/unassisted ratio of each session
// against the benefit mark, as SVG plus a table. Pure functions from the server's `rungs/progress`
// payload to markup, unit-tested without an editor; everything from the file is escaped here, and
// the page has the same Content-Security-Policy as the ladder view.
import { escapeHtml, renderWebviewPage, type PageOptions } from './ladderHtml';
import type { ProgressView } from './protocol';

type TrendView = ProgressView['trends'][number];

const fmt = (n: number | null): string => (n === null ? '–' : String(Number(n.toFixed(2))));
const PLOT = { width: 520, height: 180, top: 14, bottom: 28, left: 40, right: 16 };

/** One chart: sessions left to right by date, ratio bottom to top, the mark as a dashed line. */
function trendChart(t: TrendView, mark: number): string {
  const rated = t.points.filter((p) => p.ratio !== null);
  const top = Math.max(mark * 1.5, ...rated.map((p) => p.ratio!)) * 1.05;
  const span = Math.max(7, ...t.points.map((p) => p.day));
  const plotW = PLOT.width - PLOT.left - PLOT.right;
  const plotH = PLOT.height - PLOT.top - PLOT.bottom;
  const x = (day: number) => PLOT.left + (day / span) * plotW;
  const y = (r: number) => PLOT.top + (1 - r / top) * plotH;
  const label = `Ratio per session of ${t.client} on ${t.rung} against the mark ${fmt(mark)}`;
  const out = [`<svg class="trend" viewBox="0 0 ${PLOT.width} ${PLOT.height}" width="100%" preserveAspectRatio="xMinYMin meet" role="img" aria-label="${escapeHtml(label)}">`];
  for (const v of [0]) {
    out.push(`<line class="grid" x1="${PLOT.left}" x2="${PLOT.width - PLOT.right}" y1="${y(v).toFixed(1)}" y2="${y(v).toFixed(1)}"/>`);
    out.push(`<text class="axis" x="${PLOT.left - 6}" y="${(y(v) + 4).toFixed(1)}" text-anchor="end">${v}</text>`);
  }
  out.push(
    `<line class="mark-line" x1="${PLOT.left}" x2="${PLOT.width - PLOT.right}" y1="${y(mark).toFixed(1)}" y2="${y(mark).toFixed(1)}"/>` +
      `<text class="mark-label" x="${PLOT.left - 6}" y="${(y(mark) + 4).toFixed(1)}" text-anchor="end">${fmt(mark)}</text>`,
  );
  if (rated.length > 1) {
    const d = rated.map((p, i) => `${i ? 'L' : 'M'}${x(p.day).toFixed(1)} ${y(p.ratio!).toFixed(1)}`).join(' ');
    out.push(`<path class="trend-line" d="${d}"/>`);
  }
  for (const p of rated) {
    out.push(
      `<circle class="session${p.benefit ? ' at-mark' : ''}" data-line="${p.line}" tabindex="0" role="button" cx="${x(p.day).toFixed(1)}" cy="${y(p.ratio!).toFixed(1)}" r="5">` +
        `<title>${escapeHtml(p.date)}: ratio ${fmt(p.ratio)}${p.benefit ? ', meets the mark' : ', below the mark'} (line ${p.line + 1})</title></circle>`,
    );
  }
  for (const p of t.points) {
    out.push(`<text class="axis" x="${x(p.day).toFixed(1)}" y="${PLOT.height - 8}" text-anchor="middle">${escapeHtml(p.date.slice(5))}</text>`);
  }
  out.push('</svg>');
  return out.join('\n');
}

/** The charts and the table, without the page around them (the webview swaps this on updates). */
export function renderProgressBody(v: ProgressView | null): string {
  if (!v) return '<p class="empty">Open a rate records file (*.rates.csv) to see its progress.</p>';
  const out: string[] = [];
  const problems = v.problems ? ` · <span class="problem">${v.problems} bad row${v.problems === 1 ? '' : 's'} (see Problems)</span>` : '';
  out.push(`<p class="summary">${v.recordsRead} of ${v.rows} rows read${problems}. Filled points meet the mark of ${fmt(v.benefitMark)} (dashed line).</p>`);
  if (!v.trends.length) {
    out.push('<p class="empty">No paced sessions yet: add paced rows that name a script and rung.</p>');
    return out.join('\n');
  }
  for (const t of v.trends) {
    const slope = t.slopePerWeek === null ? '' : ` · ${t.slopePerWeek >= 0 ? '+' : ''}${fmt(t.slopePerWeek)} per week`;
    out.push(`<section class="trend${t.ready ? ' ready' : ''}"><h2>${escapeHtml(t.client)} · ${escapeHtml(t.rung)} <span class="script">${escapeHtml(t.script)}</span></h2>`);
    out.push(trendChart(t, v.benefitMark));
    out.push(`<p class="note">${escapeHtml(t.note)}${slope}</p></section>`);
  }
  out.push('<table class="sessions"><thead><tr><th>Client</th><th>Rung</th><th>Date</th><th>Ratio</th><th>Mark</th></tr></thead><tbody>');
  for (const t of v.trends) {
    for (const p of t.points) {
      out.push(
        `<tr data-line="${p.line}" tabindex="0"><td>${escapeHtml(t.client)}</td><td>${escapeHtml(t.rung)}</td><td>${escapeHtml(p.date)}</td>` +
          `<td>${fmt(p.ratio)}</td><td>${p.benefit === null ? 'no unassisted rate' : p.benefit ? 'meets' : 'below'}</td></tr>`,
      );
    }
  }
  out.push('</tbody></table>');
  out.push('<p class="legend">Scores support clinical judgement; the treating clinician decides. Click a point or a row to go to its line.</p>');
  return out.join('\n');
}

const STYLE = `
body { font-family: var(--vscode-font-family); font-size: var(--vscode-font-size); color: var(--vscode-foreground); background: var(--vscode-editor-background); padding: 8px 16px; }
h1 { font-size: 1.1em; font-weight: 600; margin: 4px 0 8px; }
h2 { font-size: 1em; font-weight: 600; margin: 14px 0 4px; }
h2 .script, .legend, .empty, .summary, .note { color: var(--vscode-descriptionForeground); font-weight: normal; }
section.trend { max-width: 640px; }
section.ready .note { color: var(--vscode-charts-green); }
svg.trend text { fill: var(--vscode-descriptionForeground); font-size: 11px; }
svg.trend .grid { stroke: var(--vscode-editorWidget-border, var(--vscode-panel-border)); opacity: 0.5; }
svg.trend .mark-line { stroke: var(--vscode-charts-green); stroke-width: 1.5; stroke-dasharray: 6 4; }
svg.trend .mark-label { fill: var(--vscode-charts-green); }
svg.trend .trend-line { fill: none; stroke: var(--vscode-charts-blue); stroke-width: 2; }
svg.trend .session { fill: var(--vscode-editor-background); stroke: var(--vscode-charts-blue); stroke-width: 2; cursor: pointer; }
svg.trend .session.at-mark { fill: var(--vscode-charts-blue); }
svg.trend [tabindex]:focus { outline: 1px solid var(--vscode-focusBorder); }
table.sessions { border-collapse: collapse; margin-top: 12px; }
table.sessions th, table.sessions td { text-align: left; padding: 2px 10px 2px 0; border-bottom: 1px solid var(--vscode-editorWidget-border, transparent); }
table.sessions tr[data-line] { cursor: pointer; }
table.sessions tr[data-line]:hover { background: var(--vscode-list-hoverBackground); }
.problem { color: var(--vscode-errorForeground); }
`;

/** The whole webview page, with the ladder view's Content-Security-Policy and page script. */
export function renderProgressPage(o: PageOptions): string {
  return renderWebviewPage({ ...o, title: 'Progress', style: STYLE });
}
