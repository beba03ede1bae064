// The practice page in a real browser: Debian's Chromium driven by playwright-core (as the
// workbench test does). The page loads from a file with every network request refused, breaks no
// rule of its Content-Security-Policy, lights each word within 50 ms of the plan (timed in the page
// with performance.now), answers keys and taps, and shows hostile item text as text. A screenshot
// is kept in tests/artifacts/. Skips when Chromium is missing, unless RUNGS_REQUIRE_EDITORS=1.
import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CAUTION } from '../../server/src/core/caution';
import { planSession } from '../../server/src/core/timing';
import { renderPracticePage } from '../../server/src/practice/page';
import { analyzeText } from '../helpers/data';

const CHROMIUM = process.env.RUNGS_CHROMIUM ?? '/usr/bin/chromium';
const hasChromium = existsSync(CHROMIUM);
const required = process.env.RUNGS_REQUIRE_EDITORS === '1';
if (!hasChromium && !required) console.warn(`tests/practice/practice.test.ts: skipped, Chromium is not at ${CHROMIUM} (apt-get install chromium)`);

const ARTIFACTS = join(__dirname, '..', 'artifacts');
const HOSTILE = '<img src=x onerror="window.__pwned=1"> & </script><b>bold</b> "quoted"';
const SCRIPT = `@title Practice <check> & "title"\n@paces 2 wps\n== Requests\nPass the bread, please.\nI want some tea.\n${HOSTILE}\n`;

describe.skipIf(!hasChromium && !required)('practice page in Chromium', () => {
  let browser: Browser;
  let page: Page;
  const requests: string[] = [];
  const console: string[] = [];
  const plan = planSession(analyzeText(SCRIPT), { mode: 'echo' });

  beforeAll(async () => {
    if (!hasChromium) throw new Error(`RUNGS_REQUIRE_EDITORS=1 but Chromium is not at ${CHROMIUM}`);
    mkdirSync(ARTIFACTS, { recursive: true });
    const file = join(ARTIFACTS, 'practice.html');
    writeFileSync(file, renderPracticePage(plan, { title: 'Practice <check> & "title"', subtitle: 'rung 1 at 2 wps, echo', caution: CAUTION }));
    browser = await chromium.launch({
      executablePath: CHROMIUM,
      headless: true,
      args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    const ctx = await browser.newContext({ viewport: { width: 1280, height: 800 }, hasTouch: true, offline: true });
    // Anything but the page itself (and data: audio) would be a request off the page: refuse and note it.
    await ctx.route('**/*', (route) => {
      const url = route.request().url();
      if (url.startsWith('file:') || url.startsWith('data:')) return route.continue();
      requests.push(url);
      return route.abort();
    });
    page = await ctx.newPage();
    page.on('console', (m) => console.push(`${m.type()}: ${m.text()}`));
    page.on('pageerror', (e) => console.push(`pageerror: ${e.message}`));
    await page.goto(pathToFileURL(file).href);
  });

  afterAll(async () => {
    await browser?.close();
  });

  it('loads offline with no request, no script error and no policy violation', async () => {
    expect(await page.textContent('#count')).toBe('Item 1 of 3 · 0 done');
    expect(await page.textContent('#item')).toBe('Pass the bread, please.');
    expect(await page.title()).toBe('Practice <check> & "title"');
    expect(requests).toEqual([]);
    expect(console).toEqual([]);
  });

  it('lights every word within 50 ms of the plan, then gives the response window', async () => {
    await page.keyboard.press('Space');
    await page.waitForFunction(() => (globalThis as unknown as { rungsPractice: { log: unknown[] } }).rungsPractice.log.length >= 1);
    await page.screenshot({ path: join(ARTIFACTS, 'practice.png') });
    await page.waitForSelector('#turn:has-text("Your turn")');
    await page.waitForFunction(() => (globalThis as unknown as { rungsPractice: { finished: number } }).rungsPractice.finished === 1);
    const log = await page.evaluate(() => (globalThis as unknown as { rungsPractice: { log: { item: number; word: number; planned: number; actual: number }[] } }).rungsPractice.log);
    const item = plan.items[0];
    // The plan: 4 words at 2 wps, syllable slots (Pass 1, the 1, bread 1, please 1): 0, 500, 1000, 1500 ms (computed).
    expect(log.map((l) => l.planned)).toEqual(item.words.map((w) => Math.round((w.onset - item.start) * 1000)));
    expect(log.map((l) => l.planned)).toEqual([0, 500, 1000, 1500]);
    for (const l of log) expect(Math.abs(l.actual - l.planned), `word ${l.word}`).toBeLessThanOrEqual(50);
    expect(await page.textContent('#count')).toBe('Item 1 of 3 · 1 done');
  });

  it('keys move between items and taps work the buttons', async () => {
    await page.keyboard.press('ArrowRight');
    expect(await page.textContent('#count')).toBe('Item 2 of 3 · 1 done');
    await page.keyboard.press('ArrowLeft');
    expect(await page.textContent('#count')).toBe('Item 1 of 3 · 1 done');
    await page.tap('#next');
    await page.tap('#next');
    expect(await page.textContent('#count')).toBe('Item 3 of 3 · 1 done');
    await page.keyboard.press('v');
    expect(await page.getAttribute('#pacer', 'class')).toBe('off');
    await page.keyboard.press('r');
    expect(await page.textContent('#play')).toBe('■ Stop');
    await page.keyboard.press('Space');
    expect(await page.textContent('#play')).toBe('▶ Start');
  });

  it('shows hostile item text as text', async () => {
    expect(await page.textContent('#item')).toBe(HOSTILE);
    expect(await page.locator('#item img, #item b, img').count()).toBe(0);
    expect(await page.evaluate(() => (globalThis as unknown as { __pwned?: number }).__pwned)).toBeUndefined();
    expect(console).toEqual([]);
  });
});
