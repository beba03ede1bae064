// The report's one style sheet: paper-like on screen, and for print sized to A4 and US Letter
// alike (no fixed page size; margins fit both), a page break before every script after the
// first, tables and charts never cut. Marks differ by shape and fill, not colour alone.
export const REPORT_STYLE = `
:root { color-scheme: light; }
body { font: 14px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", sans-serif; color: #111; background: #fff; margin: 0 auto; padding: 16px 24px; max-width: 1100px; }
header.report h1 { font-size: 1.6em; margin: 0 0 4px; }
header.report p, footer.report { color: #444; }
h2 { font-size: 1.35em; margin: 0 0 6px; border-bottom: 2px solid #111; padding-bottom: 2px; }
h3 { font-size: 1.1em; margin: 18px 0 6px; }
h4 { font-size: 1em; margin: 12px 0 4px; }
h4 .sub { font-weight: normal; color: #444; font-size: 0.9em; }
section.script { margin: 28px 0; }
dl.facts { display: grid; grid-template-columns: max-content 1fr; gap: 2px 14px; margin: 6px 0; }
dl.facts dt { font-weight: 600; }
dl.facts dd { margin: 0; }
figure.chart { margin: 0; }
svg.ladder, svg.progress { width: 100%; height: auto; max-width: 100%; display: block; }
svg text { font-size: 11px; fill: #111; }
svg .axis { fill: #444; }
svg .grid { stroke: #bbb; stroke-width: 0.6; }
svg .hatch { stroke: #2e7d32; stroke-width: 2; opacity: 0.45; }
svg .allowed { stroke: #2e7d32; stroke-width: 0.6; }
svg .item { fill: #1f5fa8; stroke: #0b2f57; stroke-width: 1; }
svg .item.estimated { fill: #fff; stroke: #1f5fa8; stroke-width: 1.8; }
svg .median { fill: #111; stroke: #fff; stroke-width: 1.2; }
svg .medians { fill: none; stroke: #111; stroke-width: 2; }
svg .step.problem { stroke: #b3261e; stroke-width: 3; stroke-dasharray: 6 3; }
svg .step-mark path { fill: #b3261e; stroke: #fff; stroke-width: 1; }
svg .step-mark text { fill: #fff; font-weight: 700; font-size: 11px; }
svg.key { width: 14px; height: 14px; vertical-align: -2px; }
.legend { color: #333; font-size: 0.9em; }
table { border-collapse: collapse; margin: 4px 0 10px; font-size: 0.9em; }
th, td { border-bottom: 1px solid #ccc; padding: 2px 5px; text-align: right; vertical-align: top; }
table.items { width: 100%; }
table.items td { white-space: nowrap; }
table.items td.text { white-space: normal; min-width: 16em; width: 40%; }
table.items th { font-size: 0.9em; }
th { background: #eee; }
th:nth-child(2), td.text, table.sources td, table.sources th, table.plain td, table.plain th { text-align: left; }
tr.total td { font-weight: 600; border-top: 1.5px solid #111; }
tr.estimated td { font-style: italic; }
.tag, .note { font-size: 0.85em; color: #444; }
.tag { border: 1px solid #999; border-radius: 3px; padding: 0 3px; }
ul.problems { margin: 2px 0 8px; padding-left: 20px; }
ul.problems .sev { font-weight: 600; text-transform: uppercase; font-size: 0.8em; }
ul.problems li.error .sev::before { content: "■ "; }
ul.problems li.warning .sev::before { content: "▲ "; }
ul.problems li.info .sev::before, ul.problems li.hint .sev::before { content: "● "; }
.caution { border: 1.5px solid #111; padding: 6px 10px; margin-top: 14px; }
.empty { color: #444; }
.sub { font-weight: normal; color: #444; font-size: 0.9em; }
table.balance td:first-child { text-align: left; }
table.balance .bad { font-weight: 600; }
.panels { display: flex; flex-wrap: wrap; gap: 8px 16px; }
figure.panel { margin: 0; width: 240px; }
figure.panel figcaption { font-size: 0.8em; color: #333; }
svg.progress .mark-line { stroke: #111; stroke-width: 1.2; stroke-dasharray: 5 3; }
svg.progress .trend-line { fill: none; stroke: #555; stroke-width: 1.2; }
svg.progress .ratio { fill: #fff; stroke: #1f5fa8; stroke-width: 1.5; }
svg.progress .ratio.at-mark { fill: #1f5fa8; }
svg.progress .session { fill: #111; }
svg.progress .accuracy { fill: #fff; stroke: #111; stroke-width: 1.3; }
.readiness.ready { font-weight: 600; }
.toolbar { position: sticky; top: 0; background: #fff; padding: 6px 0; border-bottom: 1px solid #ccc; }
@media print {
  @page { margin: 14mm 12mm; }
  body { max-width: none; padding: 0; font-size: 10pt; }
  .toolbar { display: none; }
  section.script { margin: 0; }
  section.script + section.script, section.records { break-before: page; }
  table, figure, .rung, dl.facts, .caution, svg { break-inside: avoid; }
  thead { display: table-header-group; }
  tr { break-inside: avoid; }
  h2, h3, h4 { break-after: avoid; }
  svg.ladder { max-height: 95mm; }
  .trend, .set-pair { break-inside: avoid; }
  table { font-size: 0.85em; }
  table.items td.text { min-width: 10em; }
  th, td { padding: 1px 3px; }
}
`;
