// Balance tables of a script's labelled item sets (`@set`): for each pair of labels, every metric
// with means, SDs, Hedges' g, Welch and Mann-Whitney p-values and the equivalence verdict (TOST),
// from the matched-sets module (core/sets.ts). The verdict is equivalence shown, never the mere
// absence of a significant difference.
import { SET_METRICS, type SetComparison, type SetPair } from '../core/sets';
import { escapeHtml } from './html';

const num = (n: number | null, d: number): string => (n === null || !Number.isFinite(n) ? '–' : n.toFixed(d));
const p3 = (p: number | null): string => (p === null || !Number.isFinite(p) ? '–' : p < 0.001 ? '<.001' : p.toFixed(3).replace(/^0/, ''));

function pairTable(pair: SetPair): string {
  const where = pair.rungName === null ? 'whole script' : `rung ${escapeHtml(pair.rungName)}`;
  const rows = SET_METRICS.filter((m) => pair.metrics[m.id]).map((m) => {
    const c = pair.metrics[m.id];
    const verdict = c.equivalent ? '<span class="ok">✓ equivalent</span>' : '<span class="bad">✗ not shown equivalent</span>';
    return (
      `<tr class="${c.equivalent ? 'equivalent' : 'not-equivalent'}"><td>${escapeHtml(m.name)}</td>` +
      `<td>${num(c.meanA, m.digits)} (${num(c.sdA, m.digits)})</td><td>${num(c.meanB, m.digits)} (${num(c.sdB, m.digits)})</td>` +
      `<td>${num(c.g, 2)} [${num(c.gLow, 2)}, ${num(c.gHigh, 2)}]</td><td>${p3(c.welchP)}</td><td>${p3(c.mwuP)}</td>` +
      `<td>${p3(c.tostPLower === null || c.tostPUpper === null ? null : Math.max(c.tostPLower, c.tostPUpper))}</td><td>${verdict}</td></tr>`
    );
  });
  const all = Object.values(pair.metrics).every((c) => c.equivalent);
  return (
    `<div class="set-pair"><h4>${escapeHtml(pair.a)} vs ${escapeHtml(pair.b)} <span class="sub">${where}; n = ${pair.linesA.length} and ${pair.linesB.length}; ${all ? 'equivalent on every metric' : 'not shown equivalent on every metric'}</span></h4>` +
    `<table class="balance"><thead><tr><th>Metric</th><th>${escapeHtml(pair.a)} mean (SD)</th><th>${escapeHtml(pair.b)} mean (SD)</th>` +
    "<th>Hedges' g [95 % CI]</th><th>Welch p</th><th>Mann-Whitney p</th><th>TOST p</th><th>Verdict</th></tr></thead>" +
    `<tbody>${rows.join('')}</tbody></table></div>`
  );
}

/** The balance section, or '' when the script has fewer than two set labels. */
export function renderBalance(c: SetComparison | null): string {
  if (!c || c.labels.length < 2) return '';
  const small = c.small.map(
    (s) => `<li>set ${escapeHtml(s.label)}${s.rungName === null ? '' : ` in rung ${escapeHtml(s.rungName)}`}: ${s.n} item${s.n === 1 ? '' : 's'}, fewer than ${c.minItems}, not compared</li>`,
  );
  return (
    `<section class="balance-section"><h3>Matched sets</h3><p>Labels ${c.labels.map(escapeHtml).join(', ')}, compared ${c.scope === 'rung' ? 'rung by rung' : 'over the whole script'}. ` +
    `A metric is equivalent when both one-sided tests (TOST on Welch's t) reject a difference of ±${c.bound} SD at .05.</p>` +
    c.pairs.map(pairTable).join('\n') +
    (small.length ? `<ul class="small-sets">${small.join('')}</ul>` : '') +
    '</section>'
  );
}
