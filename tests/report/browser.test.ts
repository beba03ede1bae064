// The report in a real browser (headless Debian Chromium through playwright-core): the ladder
// charts hold one mark per item, one median per rung with items and a problem mark on exactly the
// steps the step rules report; hostile text shows as text and no script runs; screenshots of
// screen and print media go to tests/artifacts; the PDF of the sample scripts has one run of pages
// per script. Expectations come from `rungs score --format json` and `rungs lint --format json`.
// Skipped with the reason when Chromium is missing, unless RUNGS_REQUIRE_EDITORS=1.
import { execFileSync, spawnSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatLength } from '../../server/src/core/timing';
import { STEP_RULES } from '../../server/src/rules/index';
import { HOSTILE, HOSTILE_CLIENT, HOSTILE_FILE, HOSTILE_RECORDS, HOSTILE_SCRIPT } from './hostile';

const root = join(__dirname, '..', '..');
const cli = join(root, 'server', 'bin', 'rungs.js');
const artifacts = join(root, 'tests', 'artifacts');
const chromiumBin = process.env.RUNGS_CHROMIUM ?? '/usr/bin/chromium';
const required = process.env.RUNGS_REQUIRE_EDITORS === '1';
const skip = !existsSync(chromiumBin) && !required;
if (skip) console.warn(`SKIPPED report browser test: missing chromium (${chromiumBin}; apt-get install chromium)`);

const SAMPLES = readdirSync(join(root, 'sample-scripts')).filter((f) => f.endsWith('.rungs')).sort();
const RECORDS = join('sample-scripts', readdirSync(join(root, 'sample-scripts')).find((f) => f.endsWith('.rates.csv'))!);

interface ScoreJson { file: string; rungs: { name: string; line: number; items: unknown[]; sessionSeconds: Record<string, number> }[] }
interface LintJson { file: string; problems: { line: number; rule: string }[] }
interface SetsJson { file: string; pairs: { a: string; b: string; metrics: Record<string, { equivalent: boolean }> }[] }
interface ProgressJson { benefitMark: number; files: { trends: { client: string; rung: string; sessions: number; ratios: number[]; atMark: number; note: string }[] }[] }

function rungs(args: string[], cwd: string): string {
  return execFileSync(process.execPath, [cli, ...args], { cwd, encoding: 'utf8' });
}

/** Pages of a PDF: its page objects (`/Type /Page`, not the `/Pages` tree). */
const pdfPages = (pdf: Buffer): number => (pdf.toString('latin1').match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length;

describe.skipIf(skip)('the report in Chromium', () => {
  let browser: Browser;
  let page: Page;
  let dir: string;
  let scored: ScoreJson[];
  let linted: LintJson[];
  let sets: SetsJson[];
  let progress: ProgressJson;
  const errors: string[] = [];

  beforeAll(async () => {
    if (!existsSync(chromiumBin)) throw new Error(`RUNGS_REQUIRE_EDITORS=1 but chromium is missing (${chromiumBin})`);
    dir = mkdtempSync(join(tmpdir(), 'rungs-report-'));
    rungs(['report', 'sample-scripts', '--records', RECORDS, '-o', join(dir, 'report.html'), '--pdf', join(dir, 'report.pdf')], root);
    sets = JSON.parse(rungs(['sets', '--format', 'json', 'sample-scripts'], root));
    // The sample records plant one bad row, so `rungs progress` exits 1 (README).
    progress = JSON.parse(spawnSync(process.execPath, [cli, 'progress', '--format', 'json', RECORDS], { cwd: root, encoding: 'utf8' }).stdout);
    scored = JSON.parse(rungs(['score', '--format', 'json', 'sample-scripts'], root));
    linted = JSON.parse(
      spawnSync(process.execPath, [cli, 'lint', '--format', 'json', 'sample-scripts'], { cwd: root, encoding: 'utf8' }).stdout,
    );
    browser = await chromium.launch({ executablePath: chromiumBin, args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking'] });
    page = await browser.newPage({ viewport: { width: 1100, height: 900 } });
    page.on('pageerror', (e) => errors.push(String(e)));
    await page.goto(`file://${join(dir, 'report.html')}`);
  });

  afterAll(async () => {
    await browser?.close();
    if (dir) rmSync(dir, { recursive: true, force: true });
  });

  it('draws one mark per item and one median per rung with items, in every script', async () => {
    expect(await page.locator('section.script').count()).toBe(SAMPLES.length);
    for (const [i, s] of scored.entries()) {
      const section = page.locator(`section#script-${i + 1}`);
      expect(await section.locator('dd').first().textContent()).toBe(s.file);
      const items = s.rungs.reduce((n, r) => n + r.items.length, 0);
      expect(await section.locator('svg.ladder circle.item').count()).toBe(items);
      expect(await section.locator('svg.ladder circle.item.estimated').count()).toBeLessThanOrEqual(items);
      expect(await section.locator('svg.ladder path.median').count()).toBe(s.rungs.filter((r) => r.items.length).length);
      expect(await section.locator('table.items tbody tr:not(.total)').count()).toBe(items);
    }
  });

  it('marks exactly the steps the step rules report, on the later rung', async () => {
    let marked = 0;
    for (const [i, s] of scored.entries()) {
      const problems = linted.find((l) => l.file === s.file)!.problems;
      const headers = new Set(s.rungs.map((r) => r.line));
      // Step rules report on the header of the later rung of the step (README, rule docs).
      const expected = [...new Set(problems.filter((p) => STEP_RULES.includes(p.rule) && headers.has(p.line)).map((p) => p.line))].sort();
      const marks = await page.locator(`section#script-${i + 1} svg.ladder g.step-mark`).evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-line'))));
      expect(marks.sort()).toEqual(expected);
      expect(await page.locator(`section#script-${i + 1} svg.ladder line.step.problem`).count()).toBe(expected.length);
      marked += marks.length;
    }
    // The draft sample plants ladder problems (its header comment): some steps must be marked.
    expect(marked).toBeGreaterThan(0);
  });

  it('lists every problem of `rungs lint`, grouped by rung', async () => {
    for (const [i, s] of scored.entries()) {
      const problems = linted.find((l) => l.file === s.file)!.problems;
      expect(await page.locator(`section#script-${i + 1} ul.problems li`).count()).toBe(problems.length);
    }
  });

  it('shows the session plan of every rung: its length with gaps at each pace, as `rungs score` gives it', async () => {
    for (const [i, s] of scored.entries()) {
      const rows = page.locator(`section#script-${i + 1} section.plan tbody tr:not(.total)`);
      expect(await rows.count()).toBe(s.rungs.length);
      for (const [k, r] of s.rungs.entries()) {
        const cell = (await rows.nth(k).locator('td').nth(1).textContent()) ?? '';
        for (const [pace, seconds] of Object.entries(r.sessionSeconds)) expect(cell).toContain(`${formatLength(seconds)} at ${pace}`);
      }
    }
  });

  it('shows the balance table of each labelled script with the verdicts of `rungs sets`', async () => {
    let tables = 0;
    for (const [i, s] of scored.entries()) {
      const expected = sets.find((x) => x.file === s.file)?.pairs ?? [];
      const section = page.locator(`section#script-${i + 1}`);
      const metrics = expected.flatMap((p) => Object.values(p.metrics));
      expect(await section.locator('table.balance tbody tr').count()).toBe(metrics.length);
      expect(await section.locator('table.balance tbody tr.equivalent').count()).toBe(metrics.filter((m) => m.equivalent).length);
      tables += await section.locator('table.balance').count();
    }
    // kitchen-sets.rungs labels its items trained and untrained.
    expect(tables).toBeGreaterThan(0);
  });

  it('draws one point per session of each client and rung, ratios against the mark, with the readiness note', async () => {
    const trends = progress.files.flatMap((f) => f.trends);
    expect(trends.length).toBeGreaterThan(0);
    expect(await page.locator('section.records div.trend').count()).toBe(trends.length);
    for (const t of trends) {
      const box = page.locator(`section.records div.trend[data-client="${t.client}"][data-rung="${t.rung}"]`);
      expect(await box.locator('svg.rate circle.session').count()).toBe(t.sessions);
      expect(await box.locator('svg.ratio path.ratio').count()).toBe(t.ratios.length);
      expect(await box.locator('svg.ratio path.ratio.at-mark').count()).toBe(t.atMark);
      expect(await box.locator('svg.ratio line.mark-line').count()).toBe(1);
      expect(await box.locator('p.readiness').textContent()).toContain(t.note);
    }
  });

  it('runs no script and logs no error', async () => {
    expect(errors).toEqual([]);
    expect(await page.evaluate('document.scripts.length')).toBe(0);
  });

  it('saves screenshots of screen and print media', async () => {
    mkdirSync(artifacts, { recursive: true });
    await page.emulateMedia({ media: 'screen' });
    await page.screenshot({ path: join(artifacts, 'report-screen.png'), fullPage: true });
    await page.locator('section#script-1 figure.chart').screenshot({ path: join(artifacts, 'report-ladder.png') });
    await page.emulateMedia({ media: 'print' });
    await page.screenshot({ path: join(artifacts, 'report-print.png'), fullPage: true });
    await page.emulateMedia({ media: 'screen' });
    // The README's picture is this screenshot; RUNGS_UPDATE_README=1 copies it into docs/.
    if (process.env.RUNGS_UPDATE_README === '1') copyFileSync(join(artifacts, 'report-ladder.png'), join(root, 'client', 'images', 'report-ladder.png'));
    for (const f of ['report-screen.png', 'report-print.png', 'report-ladder.png']) {
      expect(readFileSync(join(artifacts, f)).subarray(1, 4).toString()).toBe('PNG');
    }
  });

  it('fits the printable width of A4 and Letter: no table or chart is cut at the side', async () => {
    // ISO 216: A4 is 210 mm wide; ANSI: Letter is 8.5 in (215.9 mm). The report's print margins are
    // 12 mm left and right (style.ts); CSS pixels are 96 per inch (CSS Values 4).
    const px = (mm: number) => Math.floor((mm / 25.4) * 96);
    for (const [paper, mm] of [['A4', 210], ['Letter', 215.9]] as const) {
      const p = await browser.newPage({ viewport: { width: px(mm - 24), height: 1000 } });
      await p.goto(`file://${join(dir, 'report.html')}`);
      await p.emulateMedia({ media: 'print' });
      const [scrollWidth, clientWidth] = (await p.evaluate('[document.documentElement.scrollWidth, document.documentElement.clientWidth]')) as number[];
      expect(scrollWidth, paper).toBeLessThanOrEqual(clientWidth);
      await p.close();
    }
  });

  it('prints each script on its own pages, on A4 and on Letter', async () => {
    // Every script and the progress section start on a new page, so the whole report has exactly as
    // many pages as each part printed alone from the same page (the others removed), added up.
    for (const format of ['A4', 'Letter'] as const) {
      let sum = 0;
      // Each script, then the client progress (it too starts on a new page), printed alone.
      const parts = [...SAMPLES.map((_, k) => `script-${k + 1}`), 'records'];
      for (const keep of parts) {
        const p = await browser.newPage();
        await p.goto(`file://${join(dir, 'report.html')}`);
        // Page code as a string: the tests are type-checked without the DOM library.
        await p.evaluate(`for (const s of document.querySelectorAll('section.script, section.records')) if (s.id !== '${keep}') s.remove();
          if ('${keep}' !== 'script-1') document.querySelector('header.report').remove();`);
        const n = pdfPages(await p.pdf({ format, printBackground: true }));
        await p.close();
        expect(n).toBeGreaterThanOrEqual(1);
        sum += n;
      }
      const p = await browser.newPage();
      await p.goto(`file://${join(dir, 'report.html')}`);
      const whole = pdfPages(await p.pdf({ format, printBackground: true }));
      await p.close();
      expect(whole).toBe(sum);
      // The file `rungs report --pdf` wrote (A4 by default) is the same document.
      if (format === 'A4') expect(pdfPages(readFileSync(join(dir, 'report.pdf')))).toBe(sum);
      console.log(`report of the ${SAMPLES.length} sample scripts and the sample records: ${whole} ${format} pages`);
    }
  });

  it('shows hostile text as text and runs none of it, under a policy that forbids scripts', async () => {
    const hdir = join(dir, 'hostile');
    mkdirSync(hdir);
    writeFileSync(join(hdir, HOSTILE_FILE), HOSTILE_SCRIPT);
    writeFileSync(join(hdir, 'c.rates.csv'), HOSTILE_RECORDS);
    rungs(['report', HOSTILE_FILE, '--records', 'c.rates.csv', '-o', 'r.html'], hdir);
    const html = readFileSync(join(hdir, 'r.html'), 'utf8');
    const p = await browser.newPage();
    const blocked: string[] = [];
    p.on('console', (m) => blocked.push(m.text()));
    await p.goto(`file://${join(hdir, 'r.html')}`);
    expect(await p.evaluate('window.pwned')).toBeUndefined();
    expect(await p.evaluate("document.querySelectorAll('img, script, b').length")).toBe(0);
    const text = (await p.locator('body').textContent()) ?? '';
    for (const s of [HOSTILE.script, HOSTILE.img, HOSTILE.quotes, HOSTILE.amp, HOSTILE_FILE, `Client ${HOSTILE_CLIENT}`]) expect(text).toContain(s);
    expect(await p.locator('section.records circle.session').count()).toBe(2);
    expect(blocked.filter((m) => /Content Security Policy/i.test(m))).toEqual([]);
    // The policy itself: the same page with a real script added runs nothing and reports the block.
    const withScript = html.replace('</body>', '<script>window.pwned = 2</script></body>');
    writeFileSync(join(hdir, 'control.html'), withScript);
    await p.goto(`file://${join(hdir, 'control.html')}`);
    expect(await p.evaluate('window.pwned')).toBeUndefined();
    expect(blocked.some((m) => /Content Security Policy/i.test(m))).toBe(true);
    await p.close();
  });
});
