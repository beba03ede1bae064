// Client progress from rate records: per client, small multiples per rung of the paced/unassisted
// ratio of each session against the benefit mark, the paced rate, and accuracy over time, with
// the readiness note of each rung. Client codes only, as written in the records. Static SVG;
// scales and paths from d3-scale, d3-shape and d3-array.
import { extent, max } from 'd3-array';
import { scaleLinear, scaleUtc } from 'd3-scale';
import { line, symbol, symbolSquare, symbolTriangle } from 'd3-shape';
import type { ProgressResult, Session, Trend } from '../core/records';
import { escapeHtml } from './html';

export interface ReportProgress {
  /** The benefit mark the ratios are read against (common practice: 1.2). */
  mark: number;
  files: (ProgressResult & { file: string })[];
}

const P = { width: 240, height: 150, top: 12, right: 10, bottom: 26, left: 38 };
const f2 = (n: number | null): string => (n === null ? '–' : String(Number(n.toFixed(2))));
const day = (date: string): Date => new Date(`${date}T00:00:00Z`);
const triangle = symbol(symbolTriangle, 60)() ?? '';
const square = symbol(symbolSquare, 50)() ?? '';

type Panel = { title: string; y: ReturnType<typeof scaleLinear<number, number>>; svg: string[] };

function panel(cls: string, title: string, domain: [number, number], x: ReturnType<typeof scaleUtc<number, number>>): Panel {
  const y = scaleLinear().domain(domain).nice(4).range([P.height - P.bottom, P.top]);
  const svg = [`<svg class="progress ${cls}" viewBox="0 0 ${P.width} ${P.height}" role="img" aria-label="${escapeHtml(title)}">`];
  for (const t of y.ticks(4)) {
    svg.push(`<line class="grid" x1="${P.left}" x2="${P.width - P.right}" y1="${y(t).toFixed(1)}" y2="${y(t).toFixed(1)}"/>`);
    svg.push(`<text class="axis" x="${P.left - 4}" y="${(y(t) + 3).toFixed(1)}" text-anchor="end">${y.tickFormat(4)(t)}</text>`);
  }
  for (const t of x.ticks(3)) {
    svg.push(`<text class="axis" x="${x(t).toFixed(1)}" y="${P.height - 8}" text-anchor="middle">${t.toISOString().slice(5, 10)}</text>`);
  }
  return { title, y, svg };
}

const close = (p: Panel): string => `<figure class="panel">${p.svg.join('')}</svg><figcaption>${escapeHtml(p.title)}</figcaption></figure>`;

function trendPanels(t: Trend, mark: number, x: ReturnType<typeof scaleUtc<number, number>>): string {
  const px = (s: Session) => x(day(s.date)).toFixed(1);
  const out: string[] = [];
  // Ratio against the mark: filled triangles meet it, hollow ones do not.
  const rated = t.sessions.filter((s) => s.ratio !== null);
  const ratio = panel('ratio', `Paced / unassisted rate (mark ${f2(mark)})`, [0, Math.max(mark * 1.5, max(rated, (s) => s.ratio!) ?? 0)], x);
  const my = ratio.y(mark).toFixed(1);
  ratio.svg.push(`<line class="mark-line" x1="${P.left}" x2="${P.width - P.right}" y1="${my}" y2="${my}"/>`);
  ratio.svg.push(`<path class="trend-line" d="${line<Session>().x((s) => x(day(s.date))).y((s) => ratio.y(s.ratio!))(rated) ?? ''}"/>`);
  for (const s of rated) {
    ratio.svg.push(
      `<path class="ratio${s.benefit ? ' at-mark' : ''}" transform="translate(${px(s)} ${ratio.y(s.ratio!).toFixed(1)})" d="${triangle}"><title>${escapeHtml(s.date)}: ratio ${f2(s.ratio)}${s.benefit ? ', meets the mark' : ', below the mark'}</title></path>`,
    );
  }
  out.push(close(ratio));
  // The paced rate of every session: one point per session.
  const rate = panel('rate', 'Paced rate (words per second)', [0, max(t.sessions, (s) => s.wps) ?? 1], x);
  rate.svg.push(`<path class="trend-line" d="${line<Session>().x((s) => x(day(s.date))).y((s) => rate.y(s.wps))(t.sessions) ?? ''}"/>`);
  for (const s of t.sessions) {
    rate.svg.push(
      `<circle class="session" cx="${px(s)}" cy="${rate.y(s.wps).toFixed(1)}" r="3.5"><title>${escapeHtml(s.date)}: ${f2(s.wps)} words per second (${s.words} words in ${f2(s.seconds)} s)</title></circle>`,
    );
  }
  out.push(close(rate));
  const scored = t.sessions.filter((s) => s.accuracy !== null);
  if (scored.length) {
    const acc = panel('accuracy', 'Accuracy (correct / words)', [0, 1], x);
    acc.svg.push(`<path class="trend-line" d="${line<Session>().x((s) => x(day(s.date))).y((s) => acc.y(s.accuracy!))(scored) ?? ''}"/>`);
    for (const s of scored) {
      acc.svg.push(`<path class="accuracy" transform="translate(${px(s)} ${acc.y(s.accuracy!).toFixed(1)})" d="${square}"><title>${escapeHtml(s.date)}: accuracy ${f2(s.accuracy)}</title></path>`);
    }
    out.push(close(acc));
  }
  return out.join('');
}

/** The records section (after the scripts), or '' without records. */
export function renderProgress(p: ReportProgress | null, caution: string): string {
  if (!p || !p.files.length) return '';
  const out = ['<section class="records" id="records"><h2>Client progress</h2>'];
  out.push(
    `<p>From rate records: rate = words / seconds; benefit = paced rate / the same client's unassisted rate; a ratio of ${f2(p.mark)} or more marks a meaningful gain (common practice). Filled triangles meet the mark (dashed line), hollow ones do not.</p>`,
  );
  for (const f of p.files) {
    out.push(`<p class="records-file">Records: ${escapeHtml(f.file)}: ${f.records.length} of ${f.rows} rows used${f.problems.length ? `, ${f.problems.length} problem${f.problems.length === 1 ? '' : 's'} (run rungs progress)` : ''}.</p>`);
    const clients = [...new Set(f.trends.map((t) => t.client))];
    for (const client of clients) {
      const trends = f.trends.filter((t) => t.client === client);
      // One time axis per client, so its panels line up.
      const [lo, hi] = extent(trends.flatMap((t) => t.sessions.map((s) => day(s.date))));
      const x = scaleUtc().domain([lo ?? new Date(0), hi && lo && hi > lo ? hi : new Date((lo ?? new Date(0)).getTime() + 7 * 864e5)]).range([P.left + 6, P.width - P.right - 6]);
      out.push(`<div class="client"><h3>Client ${escapeHtml(client)}</h3>`);
      for (const t of trends) {
        out.push(
          `<div class="trend" data-client="${escapeHtml(t.client)}" data-rung="${escapeHtml(t.rung)}"><h4>${escapeHtml(t.rung)} <span class="sub">${escapeHtml(t.script)}; ${t.sessions.length} session${t.sessions.length === 1 ? '' : 's'}${t.slopePerWeek === null ? '' : `; ratio ${t.slopePerWeek >= 0 ? '+' : ''}${f2(t.slopePerWeek)} per week`}</span></h4>` +
            `<div class="panels">${trendPanels(t, p.mark, x)}</div><p class="readiness${t.ready ? ' ready' : ''}">${t.ready ? '✓ ' : ''}${escapeHtml(t.note)}</p></div>`,
        );
      }
      out.push('</div>');
    }
  }
  out.push(`<p class="caution">${escapeHtml(caution)}</p></section>`);
  return out.join('\n');
}
