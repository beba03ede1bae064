// The whole report document. Standalone it is one self-contained HTML file: inline CSS and SVG,
// nothing fetched, and a Content-Security-Policy that allows the one style sheet (by hash) and no
// script at all. In the editor's webview it takes the webview's nonce rules instead and adds a
// Save button, the page's only script.
import { createHash } from 'node:crypto';
import { documentHead, escapeHtml, webviewPolicy } from './html';
import { renderBalance } from './balanceSection';
import { renderPlan } from './planSection';
import type { ScriptReport } from './model';
import { renderProgress, type ReportProgress } from './progressSection';
import { renderItemTables, renderLadderSection, renderProblems, renderScriptHeading, renderSources } from './scriptSections';
import { REPORT_STYLE } from './style';

export interface ReportInput {
  scripts: ScriptReport[];
  /** Rungs version, shown in the footer. */
  version: string;
  caution: string;
  /** Client progress from rate records, drawn after the scripts; null or absent without records. */
  progress?: ReportProgress | null;
}

export interface WebviewOptions {
  /** The webview's `cspSource`. */
  cspSource: string;
  /** A fresh random nonce for the page's style and script. */
  nonce: string;
}

/** The body of one script's section (heading, ladder, items, problems, sources, caution). */
export function renderScriptSection(s: ScriptReport, index: number, caution: string): string {
  return [
    `<section class="script" id="script-${index + 1}">`,
    renderScriptHeading(s),
    renderLadderSection(s, `s${index + 1}`),
    renderItemTables(s),
    renderPlan(s.plan),
    renderProblems(s),
    renderBalance(s.sets),
    renderSources(),
    `<p class="caution">${escapeHtml(caution)}</p>`,
    '</section>',
  ].join('\n');
}

const SAVE_SCRIPT = `
const vscode = acquireVsCodeApi();
document.getElementById('save').addEventListener('click', () => vscode.postMessage({ type: 'save' }));
`;

export function renderReport(input: ReportInput, webview?: WebviewOptions): string {
  const styleHash = createHash('sha256').update(REPORT_STYLE).digest('base64');
  const csp = webview
    ? webviewPolicy(webview)
    : ["default-src 'none'", `style-src 'sha256-${styleHash}'`, "script-src 'none'", 'img-src data:', "base-uri 'none'", "form-action 'none'"].join('; ');
  const names = input.scripts.map((s) => s.title ?? s.file);
  const title = names.length === 1 ? `Rungs report: ${names[0]}` : `Rungs report: ${names.length} scripts`;
  const hasProgress = Boolean(input.progress?.files.length);
  const entries = input.scripts.map((s, i) => `<li><a href="#script-${i + 1}">${escapeHtml(s.title ?? s.file)}</a></li>`);
  if (hasProgress) entries.push('<li><a href="#records">Client progress</a></li>');
  const contents = entries.length > 1 ? `<nav><ol>${entries.join('')}</ol></nav>` : '';
  return `${documentHead({ csp, title, style: REPORT_STYLE, nonce: webview?.nonce })}
${webview ? '<div class="toolbar"><button id="save" type="button">Save report as HTML…</button></div>\n' : ''}<header class="report"><h1>${escapeHtml(title)}</h1>
<p>Difficulty ladders, item scores, paced durations, problems and matched sets of stimulus scripts${hasProgress ? ', and client progress from rate records' : ''}.</p>${contents}</header>
${input.scripts.map((s, i) => renderScriptSection(s, i, input.caution)).join('\n')}
${renderProgress(input.progress ?? null, input.caution)}
<footer class="report"><p>Made by Rungs ${escapeHtml(input.version)}. Nothing in this file runs or fetches anything.</p></footer>
${webview ? `<script nonce="${webview.nonce}">${SAVE_SCRIPT}</script>\n` : ''}</body>
</html>
`;
}
