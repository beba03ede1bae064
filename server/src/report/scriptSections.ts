// The sections of one script in the report, each a pure function from plain data to HTML:
// the heading facts, the ladder, per-rung item tables, problems by rung, metric sources.
import { escapeHtml } from './html';
import { ladderLegend, renderLadderChart } from './ladderChart';
import type { ReportProblem, ReportRung, ScriptReport } from './model';
import { METRIC_SOURCES } from './sources';

const n1 = (n: number | null): string => (n === null ? '–' : n.toFixed(1));
const n2 = (n: number): string => (Number.isFinite(n) ? n.toFixed(2) : '–');
const secs = (n: number): string => (n < 10 ? n.toFixed(1) : String(Math.round(n)));
const plural = (n: number, word: string): string => `${n} ${word}${n === 1 ? '' : 's'}`;

export function renderScriptHeading(s: ScriptReport): string {
  const facts: [string, string][] = [
    ['File', s.file],
    ['Paces', s.paces.join(', ') || '–'],
    ['Baseline', s.baseline === null ? 'not stated' : `${s.baseline} words per second`],
    ['Ladder', `${s.direction}, largest step ${s.maxStep} points`],
    ['Items', `${s.rungs.reduce((k, r) => k + r.items.length, 0)} in ${plural(s.rungs.length, 'rung')}`],
  ];
  return (
    `<h2>${escapeHtml(s.title ?? s.file)}</h2>\n<dl class="facts">` +
    facts.map(([k, v]) => `<dt>${k}</dt><dd>${escapeHtml(v)}</dd>`).join('') +
    '</dl>'
  );
}

export function renderLadderSection(s: ScriptReport, idPrefix: string): string {
  return `<section class="ladder-section"><h3>Ladder</h3><figure class="chart">${renderLadderChart(s, idPrefix)}<figcaption>${ladderLegend(s)}</figcaption></figure></section>`;
}

function itemText(it: ReportRung['items'][number]): string {
  const extra: string[] = [];
  if (it.id) extra.push(`<span class="tag">#${escapeHtml(it.id)}</span>`);
  for (const set of it.sets) extra.push(`<span class="tag set">set ${escapeHtml(set)}</span>`);
  if (it.note) extra.push(`<span class="note">${escapeHtml(it.note)}</span>`);
  if (it.estimated.length) extra.push(`<span class="note">≈ estimated: ${it.estimated.map(escapeHtml).join(', ')}</span>`);
  return `${escapeHtml(it.text)}${extra.length ? `<br>${extra.join(' ')}` : ''}`;
}

function rungTable(r: ReportRung): string {
  const head = ['Line', 'Item', 'Words', 'Syll.', 'Phon.', 'WCM', 'Zipf mean', 'Zipf min', 'Low-freq.', 'Difficulty', 'Rank', ...r.paces.map((p) => `s at ${p}`)];
  const rows = r.items.map((it) => {
    const est = it.estimated.length ? '≈' : '';
    const cells = [
      String(it.line), itemText(it), String(it.words), `${est}${it.syllables}`, `${est}${it.phonemes}`, `${est}${it.wcm}`,
      n2(it.zipfMean), n2(it.zipfMin), String(it.lowFrequencyWords), `${est}${n1(it.difficulty)}`, String(it.rank),
      ...it.seconds.map(secs),
    ];
    return `<tr${it.estimated.length ? ' class="estimated"' : ''}>${cells.map((c, i) => `<td${i === 1 ? ' class="text"' : ''}>${c}</td>`).join('')}</tr>`;
  });
  const total = `<tr class="total"><td></td><td>Total (${plural(r.items.length, 'item')})</td><td colspan="9"></td>${r.totalSeconds.map((t) => `<td>${secs(t)}</td>`).join('')}</tr>`;
  const summary = r.items.length
    ? `median ${n1(r.median)}, range ${n1(r.min)}-${n1(r.max)}`
    : 'no items';
  return (
    `<div class="rung"><h4>${escapeHtml(r.name)} <span class="sub">line ${r.line}; ${summary}; paces ${escapeHtml(r.paces.join(', '))}</span></h4>` +
    (r.items.length
      ? `<table class="items"><thead><tr>${head.map((h) => `<th>${escapeHtml(h)}</th>`).join('')}</tr></thead><tbody>${rows.join('')}${total}</tbody></table>`
      : '') +
    '</div>'
  );
}

export function renderItemTables(s: ScriptReport): string {
  return `<section class="items-section"><h3>Items by rung</h3>${s.rungs.map(rungTable).join('\n')}</section>`;
}

function problemList(ps: ReportProblem[]): string {
  return `<ul class="problems">${ps
    .map((p) => `<li class="${p.severity}"><span class="sev">${p.severity}</span> <code>${escapeHtml(p.rule)}</code> line ${p.line}:${p.column}: ${escapeHtml(p.message)}</li>`)
    .join('')}</ul>`;
}

export function renderProblems(s: ScriptReport): string {
  const groups: string[] = [];
  if (s.scriptProblems.length) groups.push(`<h4>Script settings</h4>${problemList(s.scriptProblems)}`);
  for (const r of s.rungs) if (r.problems.length) groups.push(`<h4>${escapeHtml(r.name)}</h4>${problemList(r.problems)}`);
  const count = s.scriptProblems.length + s.rungs.reduce((k, r) => k + r.problems.length, 0);
  return `<section class="problems-section"><h3>Problems (${count})</h3>${groups.length ? groups.join('\n') : '<p>None: every rule passes.</p>'}</section>`;
}

export function renderSources(): string {
  return (
    '<section class="sources"><h3>Metric sources</h3><table class="sources"><thead><tr><th>Measure</th><th>Definition</th><th>Source</th></tr></thead><tbody>' +
    METRIC_SOURCES.map((m) => `<tr><td>${escapeHtml(m.measure)}</td><td>${escapeHtml(m.definition)}</td><td>${escapeHtml(m.source)}</td></tr>`).join('') +
    '</tbody></table></section>'
  );
}
