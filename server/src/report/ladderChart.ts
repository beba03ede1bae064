// The ladder chart of the report: every item by rung (spread by rank), rung medians joined, the
// allowed step drawn as a hatched band above each median, problem steps dashed and marked with a
// triangle. Static SVG from plain data; scales, ticks and paths come from d3-scale and d3-shape.
// Marks differ by shape as well as colour (circle item, hollow circle estimated item, diamond
// median, triangle problem), so the chart reads in greyscale print.
import { scaleLinear, scalePoint } from 'd3-scale';
import { line, symbol, symbolDiamond, symbolTriangle } from 'd3-shape';
import { escapeHtml } from './html';
import type { ScriptReport } from './model';

const SIZE = { width: 720, height: 300, top: 16, right: 16, bottom: 52, left: 44 };
const fmt = (n: number): string => n.toFixed(1);
const clamp = (d: number): number => Math.max(0, Math.min(100, d));

function truncate(text: string, max: number): string {
  return text.length > max ? `${text.slice(0, max - 1)}…` : text;
}

/** The ladder chart of one script, or a short note when it has no items to draw. */
export function renderLadderChart(s: ScriptReport, idPrefix: string): string {
  const rungs = s.rungs.map((r, index) => ({ r, index })).filter(({ r }) => r.items.length > 0);
  if (!rungs.length) return '<p class="empty">No items to draw.</p>';
  const width = Math.max(SIZE.width, SIZE.left + SIZE.right + rungs.length * 90);
  const x = scalePoint<number>()
    .domain(rungs.map(({ index }) => index))
    .range([SIZE.left, width - SIZE.right])
    .padding(0.5);
  const y = scaleLinear().domain([0, 100]).range([SIZE.height - SIZE.bottom, SIZE.top]);
  const band = x.step();
  const px = (i: number): number => x(i) ?? 0;
  const out: string[] = [];
  const label = `Difficulty ladder of ${s.title ?? s.file}`;
  out.push(`<svg class="ladder" viewBox="0 0 ${width} ${SIZE.height}" role="img" aria-label="${escapeHtml(label)}">`);
  // A hatch for the allowed band: visible without colour.
  const hatch = `${idPrefix}-allowed`;
  out.push(
    `<defs><pattern id="${hatch}" width="6" height="6" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">` +
      '<line x1="0" y1="0" x2="0" y2="6" class="hatch"/></pattern></defs>',
  );
  for (const t of y.ticks(5)) {
    out.push(`<line class="grid" x1="${SIZE.left}" x2="${width - SIZE.right}" y1="${y(t)}" y2="${y(t)}"/>`);
    out.push(`<text class="axis" x="${SIZE.left - 6}" y="${y(t) + 4}" text-anchor="end">${t}</text>`);
  }
  out.push(`<text class="axis" transform="translate(12 ${(SIZE.top + SIZE.height - SIZE.bottom) / 2}) rotate(-90)" text-anchor="middle">difficulty</text>`);

  for (const st of s.steps) {
    const m = s.rungs[st.from].median ?? 0;
    const [lo, hi] = s.direction === 'falling' ? [m - s.maxStep, m] : [m, m + s.maxStep];
    const w = band * 0.8;
    out.push(
      `<rect class="allowed" fill="url(#${hatch})" x="${(px(st.to) - w / 2).toFixed(1)}" y="${y(clamp(hi)).toFixed(1)}" width="${w.toFixed(1)}" height="${Math.max(1, y(clamp(lo)) - y(clamp(hi))).toFixed(1)}">` +
        `<title>Allowed median for ${escapeHtml(s.rungs[st.to].name)}: ${fmt(clamp(lo))}-${fmt(clamp(hi))} (step ${fmt(s.maxStep)})</title></rect>`,
    );
  }

  for (const { r, index } of rungs) {
    const n = r.items.length;
    for (const it of r.items) {
      const spread = n > 1 ? ((it.rank - 1) / (n - 1) - 0.5) * band * 0.5 : 0;
      const est = it.estimated.length > 0;
      out.push(
        `<circle class="item${est ? ' estimated' : ''}" data-line="${it.line}" cx="${(px(index) + spread).toFixed(1)}" cy="${y(clamp(it.difficulty)).toFixed(1)}" r="4">` +
          `<title>${escapeHtml(it.text)}: difficulty ${est ? '≈' : ''}${fmt(it.difficulty)}, rank ${it.rank} of ${n} (line ${it.line})</title></circle>`,
      );
    }
  }

  // Medians joined in order, then each step drawn over it so a problem step stands out.
  const medianPath = line<{ r: (typeof rungs)[number]['r']; index: number }>()
    .x(({ index }) => px(index))
    .y(({ r }) => y(clamp(r.median ?? 0)))(rungs);
  out.push(`<path class="medians" d="${medianPath ?? ''}"/>`);
  const triangle = symbol(symbolTriangle, 170)() ?? '';
  for (const st of s.steps) {
    if (!st.problem) continue;
    const a = s.rungs[st.from];
    const b = s.rungs[st.to];
    const [x1, y1, x2, y2] = [px(st.from), y(clamp(a.median ?? 0)), px(st.to), y(clamp(b.median ?? 0))];
    out.push(`<line class="step problem" x1="${x1}" y1="${y1.toFixed(1)}" x2="${x2}" y2="${y2.toFixed(1)}"/>`);
    const msg = b.problems.find((p) => p.rule === st.problem)?.message ?? `step of ${fmt(st.delta)}`;
    out.push(
      `<g class="step-mark" data-rule="${escapeHtml(st.problem)}" data-line="${b.line}" transform="translate(${((x1 + x2) / 2).toFixed(1)} ${((y1 + y2) / 2).toFixed(1)})">` +
        `<path d="${triangle}"/><text y="4" text-anchor="middle">!</text><title>${escapeHtml(st.problem)}: ${escapeHtml(msg)}</title></g>`,
    );
  }
  const diamond = symbol(symbolDiamond, 110)() ?? '';
  for (const { r, index } of rungs) {
    out.push(
      `<path class="median" data-line="${r.line}" transform="translate(${px(index)} ${y(clamp(r.median ?? 0)).toFixed(1)})" d="${diamond}">` +
        `<title>${escapeHtml(r.name)}: median ${fmt(r.median ?? 0)} (${fmt(r.min ?? 0)}-${fmt(r.max ?? 0)}), ${r.items.length} items</title></path>`,
    );
    const base = SIZE.height - SIZE.bottom;
    out.push(`<text class="rung-name" x="${px(index)}" y="${base + 18}" text-anchor="middle">${escapeHtml(truncate(r.name, 16))}</text>`);
    out.push(`<text class="axis" x="${px(index)}" y="${base + 33}" text-anchor="middle">median ${fmt(r.median ?? 0)}</text>`);
  }
  out.push('</svg>');
  return out.join('\n');
}

/** The key under the chart, in words and the same shapes. */
export function ladderLegend(s: ScriptReport): string {
  const dir = s.direction === 'falling' ? 'falling' : 'rising';
  return (
    '<p class="legend">' +
    '<svg class="key" viewBox="-6 -6 12 12" aria-hidden="true"><circle class="item" r="4"/></svg> item ' +
    '<svg class="key" viewBox="-6 -6 12 12" aria-hidden="true"><circle class="item estimated" r="4"/></svg> item with an estimated pronunciation ' +
    `<svg class="key" viewBox="-7 -7 14 14" aria-hidden="true"><path class="median" d="${symbol(symbolDiamond, 110)() ?? ''}"/></svg> rung median ` +
    `<svg class="key" viewBox="-9 -9 18 18" aria-hidden="true"><g class="step-mark"><path d="${symbol(symbolTriangle, 170)() ?? ''}"/></g></svg> step a ladder rule reports (dashed). ` +
    `Hatched: where the next median may lie (allowed step ${fmt(s.maxStep)} points, direction ${dir}).</p>`
  );
}
