// Drives the progress view in a real VS Code workbench (code-server in headless Chromium, as
// cs-driver.ts does for the ladder): opens a rate records file, checks its language, a bad-row
// squiggle, a row hover and the view's points against the mark, then types a new row and waits
// for the view to draw one more point. Every step waits on a selector, never on a fixed sleep.
import { execFileSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext } from 'playwright-core';
import { editorLine, goToLine, showHover, type WorkbenchSetup, isolatedEnv, launchChromium, runCommand, startCodeServer, stopCodeServer, writeUserSettings } from './cs-driver';

export interface ProgressDriverOptions extends WorkbenchSetup {
  /** `file` is the records file to open, relative to the workspace. */
  expect: {
    /** Text of the records file's first line (to know the editor shows it). */
    firstLine: string;
    /** A 0-based row line to hover and a text its hover must show. */
    hoverLineNumber: number;
    hoverText: string;
    /** Points drawn (sessions with a ratio), and the row to type at the end of the file. */
    points: number;
    newRow: string;
  };
}

export interface ProgressDriverReport {
  languageStatus: string;
  /** Distinct text colours of the first data row as the editor draws it (the grammar's columns). */
  rowColours: number;
  squiggles: number;
  hoverText: string;
  trends: number;
  points: number;
  atMark: number;
  markLines: number;
  pointsAfterEdit: number;
  screenshots: string[];
}

export async function runProgressWorkbench(o: ProgressDriverOptions): Promise<ProgressDriverReport> {
  mkdirSync(o.artifacts, { recursive: true });
  const run = mkdtempSync(join(o.scratch, 'run-'));
  const udd = join(run, 'user-data');
  const env = isolatedEnv(run);
  writeUserSettings(udd);
  const common = ['--config', join(run, 'config.yaml'), '--user-data-dir', udd, '--extensions-dir', join(run, 'extensions')];
  execFileSync(o.codeServer, [...common, '--install-extension', o.vsix], { encoding: 'utf8', env });
  const { server, port } = await startCodeServer(o.codeServer, common, o.workspace, env, run);
  let ctx: BrowserContext | undefined;
  const consoleLines: string[] = [];
  const screenshots: string[] = [];
  try {
    ctx = await launchChromium(o.chromium, run);
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    page.on('console', (m) => consoleLines.push(`${m.type()}: ${m.text()}`));
    const shot = async (name: string): Promise<void> => {
      const p = join(o.artifacts, `workbench-${name}.png`);
      await page.screenshot({ path: p });
      screenshots.push(p);
    };
    const fileUri = `vscode-remote://127.0.0.1:${port}${join(o.workspace, o.file)}`;
    await page.goto(`http://127.0.0.1:${port}/?folder=${encodeURIComponent(o.workspace)}&payload=${encodeURIComponent(JSON.stringify([['openFile', fileUri]]))}`);
    await page.waitForSelector('.monaco-workbench', { timeout: 60_000 });
    await editorLine(page, o.expect.firstLine).waitFor({ timeout: 60_000 });

    // The file opens in the records language (status bar language mode), and the bad row is marked.
    const mode = page.locator('.statusbar-item', { hasText: 'Rungs rate records' }).first();
    await mode.waitFor({ timeout: 30_000 });
    const languageStatus = (await mode.innerText()).trim();
    await page.waitForSelector('.editor-instance .monaco-editor .squiggly-error', { timeout: 60_000 });
    const squiggles = await page.locator('.editor-instance .monaco-editor .squiggly-error').count();
    const rowColours = await editorLine(page, o.expect.firstLine)
      .locator('span span')
      .evaluateAll((els) => new Set(els.filter((e) => (e.textContent ?? '').trim() && !/^[,;\t]$/.test(e.textContent ?? '')).map((e) => (globalThis as unknown as { getComputedStyle(x: unknown): { color: string } }).getComputedStyle(e).color)).size);

    // A row's hover: its rate, ratio and the unassisted rate it was compared with.
    await page.locator('.editor-instance .monaco-editor textarea').first().focus();
    await goToLine(page, o.expect.hoverLineNumber + 1);
    const hoverText = await showHover(page, o.expect.hoverText);
    await shot('records-hover');
    await page.keyboard.press('Escape');

    // The progress view: one chart per client and rung, a point per session, the mark line.
    await runCommand(page, 'Rungs: Show Progress View');
    const frame = page.frameLocator('iframe.webview.ready').frameLocator('iframe#active-frame');
    await frame.locator('svg.trend').first().waitFor({ timeout: 30_000 });
    await frame.locator('svg.trend circle.session').nth(o.expect.points - 1).waitFor({ timeout: 15_000 });
    const trends = await frame.locator('svg.trend').count();
    const points = await frame.locator('svg.trend circle.session').count();
    const atMark = await frame.locator('svg.trend circle.session.at-mark').count();
    const markLines = await frame.locator('svg.trend line.mark-line').count();
    await shot('progress');

    // Live on edit: a new paced row at the end of the file is drawn without saving.
    await page.locator('.editor-instance .monaco-editor textarea').first().focus();
    await page.keyboard.press('Control+End');
    await page.keyboard.type(o.expect.newRow);
    await frame.locator('svg.trend circle.session').nth(points).waitFor({ timeout: 20_000 });
    const pointsAfterEdit = await frame.locator('svg.trend circle.session').count();
    await shot('progress-after-edit');
    return { languageStatus, rowColours, squiggles, hoverText, trends, points, atMark, markLines, pointsAfterEdit, screenshots };
  } finally {
    writeFileSync(join(run, 'browser-console.log'), consoleLines.join('\n'));
    if (ctx) await ctx.close().catch(() => undefined);
    await stopCodeServer(server);
  }
}
