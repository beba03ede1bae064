// Drives a real VS Code workbench (code-server 4.100.3 in headless Debian Chromium, through
// playwright-core) with the packaged extension installed, on one script, and reports what the
// workbench showed. Every step waits on a selector or an event, never on a fixed sleep. The
// workbench test (workbench.test.ts) gives the expectations and checks the report.
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import { createWriteStream, mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import http from 'node:http';
import net from 'node:net';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Frame, type FrameLocator, type Page } from 'playwright-core';

/** What every workbench run needs: the programs, the .vsix, and where things go. */
export interface WorkbenchSetup {
  codeServer: string;
  chromium: string;
  vsix: string;
  /** Workspace folder, and the script inside it to open. */
  workspace: string;
  file: string;
  /** Scratch folder for user data, logs and the browser profile (a fresh run folder inside). */
  scratch: string;
  /** Where screenshots go. */
  artifacts: string;
}

export interface DriverOptions extends WorkbenchSetup {
  expect: {
    /** Messages that must each be listed in the Problems panel. */
    problems: string[];
    /** A rung header to hover (its text and 0-based line), and texts its hover must show. */
    hoverLine: string;
    hoverLineNumber: number;
    hoverTexts: string[];
    /** The text on the line a quick fix applies to (and its 0-based line), the fix's title, and the line after the fix. */
    fixLine: string;
    fixLineNumber: number;
    fixTitle: string;
    fixedLine: string;
    /** Number of problem marks and of item points the ladder view must draw. */
    marks: number;
    items: number;
    /** A sentence to type at the end of the script: the ladder must then draw one more point. */
    newItem: string;
  };
  log?: (...a: unknown[]) => void;
}

export interface DriverReport {
  installed: string;
  problemRows: string[];
  fixRemovedProblem: boolean;
  hoverText: string;
  fixedLineText: string;
  marks: number;
  markRules: string[];
  items: number;
  itemsAfterEdit: number;
  jumpedToLine: string;
  statusBarText: string;
  /** The report view: its ladder's item points, rung tables' item rows and Save buttons. */
  reportItems: number;
  reportRows: number;
  reportSaveButtons: number;
  screenshots: string[];
  timings: Record<string, number>;
  runDir: string;
}

export const freePort = (): Promise<number> =>
  new Promise((resolve, reject) => {
    const s = net.createServer();
    s.unref();
    s.on('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const a = s.address();
      const port = typeof a === 'object' && a ? a.port : 0;
      s.close(() => resolve(port));
    });
  });

const status = (url: string): Promise<number> =>
  new Promise((resolve) => {
    http
      .get(url, (r) => {
        r.resume();
        resolve(r.statusCode ?? 0);
      })
      .on('error', () => resolve(0));
  });

/** Waits for code-server's /healthz, polling its port (the only way to know it is listening). */
export async function waitHealthy(server: ChildProcess, port: number, logFile: string, ms = 60_000): Promise<void> {
  const t0 = Date.now();
  for (;;) {
    if ((await status(`http://127.0.0.1:${port}/healthz`)) === 200) return;
    if (server.exitCode !== null) throw new Error(`code-server exited early; see ${logFile}`);
    if (Date.now() - t0 > ms) throw new Error(`code-server did not answer in ${ms / 1000} s; see ${logFile}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** Runs a command from the Command Palette by its title. */
export async function runCommand(page: Page, title: string): Promise<void> {
  await page.keyboard.press('F1');
  const input = page.locator('.quick-input-widget input.input');
  await input.waitFor({ state: 'visible', timeout: 10_000 });
  await input.fill(`>${title}`);
  await page.locator('.quick-input-list .monaco-list-row', { hasText: title }).first().waitFor({ timeout: 10_000 });
  await page.keyboard.press('Enter');
  await input.waitFor({ state: 'hidden', timeout: 10_000 });
}

/**
 * Opens the hover at the cursor with Show Hover (Ctrl+K Ctrl+I), which does not depend on the
 * mouse landing on the right pixel while the machine is busy, and returns its text once it shows
 * `text` (tries three times; '' when it never does).
 */
export async function showHover(page: Page, text: string): Promise<string> {
  const visibleHover = page.locator('.monaco-hover:not(.hidden) .monaco-hover-content');
  for (let i = 0; i < 3; i++) {
    await page.keyboard.press('Control+K');
    await page.keyboard.press('Control+I');
    try {
      const h = visibleHover.filter({ hasText: text }).first();
      await h.waitFor({ state: 'visible', timeout: 10_000 });
      return (await h.innerText()).replace(/\s+/g, ' ');
    } catch {
      await page.keyboard.press('Escape');
    }
  }
  return '';
}

/** Moves the cursor to a 1-based line with Go to Line, which also scrolls it into view. */
export async function goToLine(page: Page, line: number): Promise<void> {
  await page.keyboard.press('Control+G');
  const input = page.locator('.quick-input-widget input.input');
  await input.waitFor({ state: 'visible', timeout: 10_000 });
  await input.fill(`:${line}`);
  await page.keyboard.press('Enter');
  await input.waitFor({ state: 'hidden', timeout: 10_000 });
}

/** The line of the editor whose text starts with `text`. */
export function editorLine(page: Page, text: string) {
  return page.locator('.editor-instance .monaco-editor .view-line', { hasText: text }).first();
}

/** Filters the Problems panel by `text` and returns the rows shown. */
async function problemRows(page: Page, filter: string, expectRow: string | null): Promise<string[]> {
  const box = page.locator('.markers-panel-action-filter input, .viewpane-filter input').first();
  await box.waitFor({ state: 'visible', timeout: 10_000 });
  await box.fill(filter);
  const rows = page.locator('.markers-panel .monaco-list-row');
  if (expectRow !== null) {
    await rows.filter({ hasText: expectRow }).first().waitFor({ timeout: 30_000 });
  } else {
    await page.locator('.markers-panel .monaco-list-row').first().waitFor({ state: 'detached', timeout: 15_000 });
  }
  // One read of all rows at once: the list re-renders while the filter settles.
  return (await rows.allInnerTexts()).map((t) => t.replace(/\s+/g, ' ').trim());
}

function ladderFrame(page: Page): FrameLocator {
  return page.frameLocator('iframe.webview.ready').frameLocator('iframe#active-frame');
}

/**
 * Runs "Open Report for This Script" and reads the report's webview: the frame whose document
 * holds the report header, found as the webview's frames load (no fixed wait).
 */
async function openReport(
  page: Page,
  run: (page: Page, title: string) => Promise<void>,
): Promise<{ reportItems: number; reportRows: number; reportSaveButtons: number }> {
  const find = async (): Promise<Frame | null> => {
    for (const f of page.frames()) if ((await f.locator('header.report').count().catch(() => 0)) > 0) return f;
    return null;
  };
  await run(page, 'Rungs: Open Report for This Script');
  const deadline = Date.now() + 30_000;
  let frame = await find();
  while (!frame && Date.now() < deadline) {
    await page.waitForEvent('framenavigated', { timeout: Math.max(1, deadline - Date.now()) }).catch(() => undefined);
    frame = await find();
  }
  if (!frame) throw new Error('the report webview did not appear');
  await frame.locator('svg.ladder circle.item').first().waitFor({ timeout: 15_000 });
  return {
    reportItems: await frame.locator('svg.ladder circle.item').count(),
    reportRows: await frame.locator('table.items tbody tr:not(.total)').count(),
    reportSaveButtons: await frame.locator('button#save').count(),
  };
}

export async function runWorkbench(o: DriverOptions): Promise<DriverReport> {
  const log = o.log ?? ((...a: unknown[]) => console.log('[workbench]', ...a));
  const timings: Record<string, number> = {};
  let mark = Date.now();
  const lap = (name: string): void => {
    timings[name] = Date.now() - mark;
    mark = Date.now();
  };
  mkdirSync(o.scratch, { recursive: true });
  mkdirSync(o.artifacts, { recursive: true });
  const run = mkdtempSync(join(o.scratch, 'run-'));
  const udd = join(run, 'user-data');
  const ext = join(run, 'extensions');
  // Keep code-server (config.yaml, logs) and Chromium (crash reports) out of $HOME.
  const env = isolatedEnv(run);
  writeUserSettings(udd);
  const common = ['--config', join(run, 'config.yaml'), '--user-data-dir', udd, '--extensions-dir', ext];
  const installed = execFileSync(o.codeServer, [...common, '--install-extension', o.vsix], { encoding: 'utf8', env })
    .trim()
    .split('\n')
    .pop()!;
  log('install-extension:', installed);
  lap('installExtension');
  const { server, port } = await startCodeServer(o.codeServer, common, o.workspace, env, run);
  let ctx: BrowserContext | undefined;
  const consoleLines: string[] = [];
  const screenshots: string[] = [];
  try {
    lap('serverUp');
    ctx = await launchChromium(o.chromium, run);
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    page.on('console', (m) => consoleLines.push(`${m.type()}: ${m.text()}`));
    page.on('pageerror', (e) => consoleLines.push(`pageerror: ${e.message}`));
    const shot = async (name: string): Promise<void> => {
      const p = join(o.artifacts, `workbench-${name}.png`);
      await page.screenshot({ path: p });
      screenshots.push(p);
    };

    // Open the script straight from the URL: the web workbench's `payload` query.
    const fileUri = `vscode-remote://127.0.0.1:${port}${join(o.workspace, o.file)}`;
    const url = `http://127.0.0.1:${port}/?folder=${encodeURIComponent(o.workspace)}&payload=${encodeURIComponent(JSON.stringify([['openFile', fileUri]]))}`;
    await page.goto(url);
    await page.waitForSelector('.monaco-workbench', { timeout: 60_000 });
    await page.waitForSelector(`.tabs-container .tab[aria-label*="${o.file}"]`, { timeout: 60_000 });
    await editorLine(page, o.expect.fixLine).waitFor({ timeout: 30_000 });
    lap('workbenchAndEditor');

    // 1. Diagnostics: a squiggle, then every expected message in the Problems panel.
    await page.waitForSelector('.editor-instance .monaco-editor .squiggly-error', { timeout: 60_000 });
    await page.keyboard.press('Control+Shift+M');
    await page.locator('.markers-panel').waitFor({ timeout: 15_000 });
    const rows: string[] = [];
    for (const message of o.expect.problems) {
      const found = await problemRows(page, message.slice(0, 40), message);
      rows.push(...found.filter((r) => r.includes(message)));
    }
    await problemRows(page, '', o.expect.problems[0]);
    lap('problems');

    // 2. Hover over a rung header: its numbers.
    await page.locator('.editor-instance .monaco-editor textarea').first().focus();
    await goToLine(page, o.expect.hoverLineNumber + 1);
    // The cursor is on the header (column 1): Show Hover (Ctrl+K Ctrl+I) opens the hover there,
    // which does not depend on the mouse landing on the right pixel while the machine is busy.
    await editorLine(page, o.expect.hoverLine).waitFor({ timeout: 15_000 });
    const hoverText = await showHover(page, o.expect.hoverTexts[0]);
    await shot('hover');
    // Move the pointer off the editor (onto the status bar's cursor position, found by its text).
    await page.locator('.statusbar-item', { hasText: 'Ln ' }).first().hover();
    await page.keyboard.press('Escape');
    lap('hover');

    // 3. The ladder view beside the editor: marks and points, drawn from the server's ladder.
    await runCommand(page, 'Rungs: Show Ladder View');
    const frame = ladderFrame(page);
    await frame.locator('svg.ladder').waitFor({ timeout: 30_000 });
    if (o.expect.marks > 0) await frame.locator('svg.ladder g.mark').nth(o.expect.marks - 1).waitFor({ timeout: 15_000 });
    const marks = await frame.locator('svg.ladder g.mark').count();
    const markRules = await frame
      .locator('svg.ladder g.mark')
      .evaluateAll((els) => els.map((e) => e.getAttribute('data-rule') ?? ''));
    const items = await frame.locator('svg.ladder circle.item').count();
    await shot('ladder');
    lap('ladder');

    // 4. A click on a point moves the editor to its item; the status bar shows that item.
    const point = frame.locator('svg.ladder circle.item').first();
    const line = Number(await point.getAttribute('data-line'));
    const selection = page.locator('.statusbar-item', { hasText: `Ln ${line + 1},` }).first();
    // On a busy machine the first click can land while the webview is still taking focus and be
    // swallowed; click again (up to three times) rather than fail on a lost click.
    for (let attempt = 1; ; attempt++) {
      await point.click();
      try {
        await selection.waitFor({ timeout: attempt < 3 ? 8_000 : 15_000 });
        break;
      } catch (err) {
        if (attempt >= 3) throw err;
      }
    }
    const jumpedToLine = (await selection.innerText()).trim();
    const itemStatus = page.locator('.statusbar-item', { hasText: ' s @ ' }).first();
    await itemStatus.waitFor({ timeout: 15_000 });
    const statusBarText = (await itemStatus.innerText()).trim();
    lap('jumpAndStatus');

    // 5. Quick fix on the planted misspelt key.
    await goToLine(page, o.expect.fixLineNumber + 1);
    // The first token of the line is the misspelt key: a click on it puts the cursor there.
    await editorLine(page, o.expect.fixLine).locator('span span').first().click();
    await page.keyboard.press('Control+.');
    const action = page.locator('.action-widget .monaco-list-row', { hasText: o.expect.fixTitle }).first();
    await action.waitFor({ timeout: 15_000 });
    // The menu's pointer shield takes mouse clicks; choose the fix with the keyboard instead.
    const focused = page.locator('.action-widget .monaco-list-row.focused');
    for (let i = 0; i < 10 && (await focused.getAttribute('aria-label')) !== o.expect.fixTitle; i++) {
      await page.keyboard.press('ArrowDown');
    }
    await page.keyboard.press('Enter');
    await editorLine(page, o.expect.fixedLine).waitFor({ timeout: 15_000 });
    const fixedLineText = (await editorLine(page, o.expect.fixedLine).innerText()).replace(/\u00a0/g, ' ');
    let fixRemovedProblem = false;
    try {
      await problemRows(page, o.expect.problems[0].slice(0, 40), null);
      fixRemovedProblem = true;
    } catch {
      fixRemovedProblem = false;
    }
    await problemRows(page, '', o.expect.problems[1] ?? o.expect.problems[0]).catch(() => []);
    lap('quickFix');

    // 6. The view follows edits: a new item at the end of the script is drawn at once.
    await editorLine(page, o.expect.fixedLine).click();
    await page.keyboard.press('Control+End');
    await page.keyboard.press('Enter');
    await page.keyboard.type(o.expect.newItem);
    await frame.locator('svg.ladder circle.item').nth(items).waitFor({ timeout: 15_000 });
    const itemsAfterEdit = await frame.locator('svg.ladder circle.item').count();
    await page.keyboard.press('Escape');
    await page.locator('.statusbar-item', { hasText: 'Ln ' }).first().hover();
    await shot('overview');
    lap('liveEdit');

    // 7. The printable report of the script (as edited) in a webview of its own, with Save.
    const report = await openReport(page, runCommand);
    await shot('report');
    lap('report');

    return {
      installed, problemRows: rows, fixRemovedProblem, hoverText, fixedLineText, marks, markRules, items,
      itemsAfterEdit, jumpedToLine, statusBarText, ...report, screenshots, timings, runDir: run,
    };
  } finally {
    writeFileSync(join(run, 'browser-console.log'), consoleLines.join('\n'));
    if (ctx) await ctx.close().catch(() => undefined);
    await stopCodeServer(server);
  }
}

/** Environment for code-server and its extension host with config, data and logs kept in `run`. */
export function isolatedEnv(run: string): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, VSCODE_PROXY_URI: '' };
  for (const k of ['CONFIG', 'DATA', 'CACHE', 'STATE']) env[`XDG_${k}_HOME`] = join(run, 'xdg', k.toLowerCase());
  return env;
}

/** User settings that silence the welcome page, trust prompts, telemetry, updates and git. */
export function writeUserSettings(udd: string): void {
  mkdirSync(join(udd, 'User'), { recursive: true });
  writeFileSync(
    join(udd, 'User', 'settings.json'),
    JSON.stringify(
      {
        'workbench.startupEditor': 'none',
        'security.workspace.trust.enabled': false,
        'telemetry.telemetryLevel': 'off',
        'update.mode': 'none',
        'extensions.autoCheckUpdates': false,
        'extensions.autoUpdate': false,
        'extensions.ignoreRecommendations': true,
        'workbench.enableExperiments': false,
        'workbench.tips.enabled': false,
        'chat.commandCenter.enabled': false,
        'editor.hover.delay': 100,
        'editor.minimap.enabled': false,
        'window.restoreWindows': 'none',
        'workbench.colorTheme': 'Default Dark Modern',
        // The scratch workspace sits inside the project's git work tree; keep git quiet about it.
        'git.enabled': false,
        'git.openRepositoryInParentFolders': 'never',
      },
      null,
      2,
    ),
  );
}

/** Starts code-server on a free loopback port, auth none, and waits until it answers. */
export async function startCodeServer(
  bin: string,
  common: string[],
  workspace: string,
  env: NodeJS.ProcessEnv,
  run: string,
): Promise<{ server: ChildProcess; port: number; logFile: string }> {
  const port = await freePort();
  const logFile = join(run, 'code-server.log');
  const server = spawn(
    bin,
    [...common, '--bind-addr', `127.0.0.1:${port}`, '--auth', 'none', '--disable-telemetry', '--disable-update-check',
      '--disable-workspace-trust', '--disable-getting-started-override', '--ignore-last-opened', workspace],
    { stdio: ['ignore', 'pipe', 'pipe'], env },
  );
  const srvLog = createWriteStream(logFile);
  server.stdout!.pipe(srvLog);
  server.stderr!.pipe(srvLog);
  try {
    await waitHealthy(server, port, logFile);
  } catch (e) {
    server.kill('SIGKILL');
    throw e;
  }
  return { server, port, logFile };
}

/** Headless Debian Chromium with the flags this closed network needs. */
export function launchChromium(bin: string, run: string): Promise<BrowserContext> {
  return chromium.launchPersistentContext(join(run, 'chrome'), {
    executablePath: bin,
    headless: true,
    viewport: { width: 1440, height: 900 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

/** Stops code-server: SIGTERM, then SIGKILL after 5 s. */
export async function stopCodeServer(server: ChildProcess): Promise<void> {
  if (server.exitCode !== null) return;
  server.kill('SIGTERM');
  await new Promise<void>((resolve) => {
    const k = setTimeout(() => {
      server.kill('SIGKILL');
      resolve();
    }, 5000);
    server.on('exit', () => {
      clearTimeout(k);
      resolve();
    });
  });
}
