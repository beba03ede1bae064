// Runs the extension-host suite (tests/extension/suite/index.cjs, the one @vscode/test-electron
// runs in desktop VS Code) inside code-server's extension host instead: the web workbench takes
// `extensionDevelopmentPath` and `extensionTestsPath` in its URL payload, and the extension
// host's console reaches the browser console, where the suite's result lines are read.
import { mkdirSync, mkdtempSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import type { BrowserContext } from 'playwright-core';
import { isolatedEnv, launchChromium, startCodeServer, stopCodeServer, writeUserSettings } from './cs-driver';

export interface SuiteReport {
  lines: string[];
  passed: number;
  failed: number;
}

export async function runExtensionSuite(o: {
  codeServer: string;
  chromium: string;
  /** The extension folder (the repository root, with dist/ built). */
  extension: string;
  suite: string;
  workspace: string;
  scratch: string;
  timeoutMs?: number;
}): Promise<SuiteReport> {
  mkdirSync(o.scratch, { recursive: true });
  const run = mkdtempSync(join(o.scratch, 'suite-'));
  const udd = join(run, 'user-data');
  const env = { ...isolatedEnv(run), RUNGS_TEST_WORKSPACE: o.workspace };
  writeUserSettings(udd);
  const common = ['--config', join(run, 'config.yaml'), '--user-data-dir', udd, '--extensions-dir', join(run, 'extensions')];
  const { server, port } = await startCodeServer(o.codeServer, common, o.workspace, env, run);
  let ctx: BrowserContext | undefined;
  const consoleLines: string[] = [];
  try {
    ctx = await launchChromium(o.chromium, run);
    const page = ctx.pages()[0] ?? (await ctx.newPage());
    const lines: string[] = [];
    const result = new Promise<SuiteReport>((resolve) => {
      page.on('console', (m) => {
        const text = m.text();
        consoleLines.push(text);
        const line = /\b(ok|FAIL) {1,3}.*$/.exec(text)?.[0];
        if (line) lines.push(line.replace(/\s+/g, ' '));
        const end = /(\d+) passed, (\d+) failed/.exec(text);
        if (end) resolve({ lines, passed: Number(end[1]), failed: Number(end[2]) });
      });
    });
    const remote = (p: string): string => `vscode-remote://127.0.0.1:${port}${p}`;
    const payload = [['extensionDevelopmentPath', remote(o.extension)], ['extensionTestsPath', remote(o.suite)]];
    await page.goto(`http://127.0.0.1:${port}/?folder=${encodeURIComponent(o.workspace)}&payload=${encodeURIComponent(JSON.stringify(payload))}`);
    const ms = o.timeoutMs ?? 120_000;
    let timer: ReturnType<typeof setTimeout> | undefined;
    const timeout = new Promise<never>((_, reject) => {
      timer = setTimeout(() => reject(new Error(`the extension-host suite did not finish in ${ms / 1000} s; passed so far: ${lines.join(' | ')}`)), ms);
    });
    try {
      return await Promise.race([result, timeout]);
    } finally {
      clearTimeout(timer);
    }
  } finally {
    writeFileSync(join(run, 'browser-console.log'), consoleLines.join('\n'));
    if (ctx) await ctx.close().catch(() => undefined);
    await stopCodeServer(server);
  }
}
