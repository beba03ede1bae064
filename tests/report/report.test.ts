// `rungs report`: the HTML structure (snapshot with versions and paths stripped), escaping of
// hostile text, the command's options and exit codes, and finding Chromium for --pdf. The page
// itself is checked in a real browser by browser.test.ts.
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../server/src/cli/main';
import { findChromium } from '../../server/src/cli/pdf';
import type { CliIO } from '../../server/src/cli/io';
import { analyze } from '../../server/src/core/analyze';
import { buildScriptReport } from '../../server/src/report/model';
import { renderReport } from '../../server/src/report/page';
import { lint } from '../../server/src/rules/index';
import { MemFs } from '../cli/memfs';
import { words } from '../helpers/data';
import { HOSTILE, HOSTILE_CLIENT, HOSTILE_FILE, HOSTILE_RECORDS, HOSTILE_SCRIPT } from './hostile';

const ROOT = join(__dirname, '..', '..');
const SAMPLES = join(ROOT, 'sample-scripts');

async function run(argv: string[], files: Record<string, string>, env: Record<string, string | undefined> = {}) {
  const fs = new MemFs(files);
  let out = '';
  let err = '';
  const io: CliIO = { argv, cwd: '/clinic', fs, stdout: (t) => (out += t), stderr: (t) => (err += t), env };
  const code = await main(io);
  return { code, out, err, fs };
}

/** Tags with their class and rule attributes, one per line: the page's structure without its text. */
function structure(html: string): string {
  const out: string[] = [];
  for (const m of html.matchAll(/<(\/?)([a-zA-Z][\w-]*)([^>]*)>/g)) {
    if (m[1]) continue;
    const cls = /\sclass="([^"]*)"/.exec(m[3])?.[1];
    const rule = /\sdata-rule="([^"]*)"/.exec(m[3])?.[1];
    out.push(`${m[2]}${cls ? `.${cls.replace(/ /g, '.')}` : ''}${rule ? `[${rule}]` : ''}`);
  }
  // Runs of the same tag (table rows, chart points) collapse to one line with a count.
  const runs: string[] = [];
  for (const t of out) {
    const last = runs[runs.length - 1];
    const m = last ? /^(.*?)(?: ×(\d+))?$/.exec(last)! : null;
    if (m && m[1] === t) runs[runs.length - 1] = `${t} ×${Number(m[2] ?? 1) + 1}`;
    else runs.push(t);
  }
  return runs.join('\n');
}

const stripVersions = (html: string) => html.replace(/Rungs \d+\.\d+\.\d+/g, 'Rungs X.Y.Z').replace(/sha256-[A-Za-z0-9+/=]+/g, 'sha256-HASH');

describe('rungs report: the HTML', () => {
  it('has the documented structure for the sample scripts (snapshot, versions and paths stripped)', async () => {
    const files: Record<string, string> = {};
    for (const f of readdirSync(SAMPLES)) files[`scripts/${f}`] = readFileSync(join(SAMPLES, f), 'utf8');
    const records = readdirSync(SAMPLES).find((f) => f.endsWith('.rates.csv'))!;
    const r = await run(['report', 'scripts', '--records', `scripts/${records}`, '-o', 'out/report.html'], files);
    expect(r.code).toBe(0);
    expect(r.out).toBe('/clinic/out/report.html\n');
    const html = r.fs.files.get('/clinic/out/report.html')!;
    expect(html).not.toContain('/clinic');
    expect(structure(stripVersions(html))).toMatchSnapshot();
  });

  it('is self-contained: no script, no remote resource, a policy that forbids scripts', () => {
    const text = readFileSync(join(SAMPLES, 'morning-routine.rungs'), 'utf8');
    const a = analyze({ text, data: words });
    const html = renderReport({ scripts: [buildScriptReport('m.rungs', a, lint(a, text))], version: '0', caution: 'C' });
    expect(html).not.toMatch(/<script|<link|<iframe|<img|\bsrc=|href="(?!#)/i);
    const csp = /http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(html)![1];
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain("script-src 'none'");
  });

  it('in the editor: the ladder view\'s nonce policy, a Save button and the page\'s one script', () => {
    const text = readFileSync(join(SAMPLES, 'morning-routine.rungs'), 'utf8');
    const a = analyze({ text, data: words });
    const input = { scripts: [buildScriptReport('m.rungs', a, lint(a, text))], version: '0', caution: 'C' };
    const html = renderReport(input, { cspSource: 'vscode-resource:', nonce: 'N0nce' });
    const csp = /http-equiv="Content-Security-Policy" content="([^"]+)"/.exec(html)![1];
    expect(csp).toBe("default-src 'none'; style-src 'nonce-N0nce'; script-src 'nonce-N0nce'; img-src vscode-resource: data:; font-src vscode-resource:");
    expect(html.match(/<script[^>]*>/g)).toEqual(['<script nonce="N0nce">']);
    expect(html).toContain('<button id="save" type="button">');
    // The body is the same report as the file the button saves.
    const section = (h: string) => h.slice(h.indexOf('<section'), h.lastIndexOf('</section>'));
    expect(section(html)).toBe(section(renderReport(input)));
  });

  it('plans each rung as its items back to back with a gap between them', () => {
    const text = readFileSync(join(SAMPLES, 'morning-routine.rungs'), 'utf8');
    const a = analyze({ text, data: words });
    const plan = buildScriptReport('m.rungs', a, lint(a, text)).plan;
    const [unison] = plan.modes;
    expect(plan.gap).toBe(2);
    a.rungs.forEach((r, i) => {
      r.paces.forEach((p, k) => {
        // computed: the projected durations of the items plus (items - 1) gaps of 2 s (no phrase
        // pauses by default), e.g. Greetings at 1 wps: 11 s + 4 × 2 s = 19 s.
        expect(unison.rungs[i].paces[k]).toEqual({ pace: p.label, seconds: expect.closeTo(r.totalSeconds[k] + (r.items.length - 1) * 2, 6) });
      });
    });
    expect(unison.rungs[0].paces[0].seconds).toBeCloseTo(19, 6);
  });

  it('escapes hostile text in titles, rung names, items, notes, set labels, client codes and file names', async () => {
    const r = await run(['report', HOSTILE_FILE, '--records', 'c.rates.csv', '-o', 'r.html'], { [HOSTILE_FILE]: HOSTILE_SCRIPT, 'c.rates.csv': HOSTILE_RECORDS });
    expect(r.code).toBe(0);
    const html = r.fs.files.get('/clinic/r.html')!;
    // The only tags and attributes are the report's own: none comes from the text.
    const tags = new Set<string>();
    const attrs = new Set<string>();
    for (const m of html.matchAll(/<([a-zA-Z][\w-]*)((?:\s+[\w:-]+(?:="[^"]*")?)*)\s*\/?>/g)) {
      tags.add(m[1].toLowerCase());
      for (const a of m[2].matchAll(/\s+([\w:-]+)(?:="[^"]*")?/g)) attrs.add(a[1].toLowerCase());
    }
    expect([...tags].filter((t) => ['img', 'script', 'b', 'iframe', 'object'].includes(t))).toEqual([]);
    expect([...attrs].filter((a) => a.startsWith('on') || a === 'src')).toEqual([]);
    expect(html.match(/<img|<script/gi)).toBeNull();
    expect(html).toContain('&lt;/script&gt;&lt;script&gt;window.pwned=1&lt;/script&gt;');
    expect(html).toContain('&lt;img src=x onerror=&quot;window.pwned=1&quot;&gt;');
    expect(html).toContain('Tom &amp; Jerry &amp;amp; &amp;lt;b&amp;gt;');
    expect(html).toContain('&amp;&#39;&lt;img src=x onerror=window.pwned=1&gt;&quot;.rungs');
    expect(html).toContain(HOSTILE.quotes.replace(/"/g, '&quot;').replace(/'/g, '&#39;'));
    // The set labels reach the balance table and the client code the progress section.
    expect(html).toContain('Labels &lt;b&gt;&amp;&quot;x&quot;, &lt;/script&gt;&lt;script&gt;');
    expect(html).toContain(`Client ${HOSTILE_CLIENT.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;')}`);
  });
});

describe('rungs report: the command', () => {
  it('needs a script, and says so', async () => {
    const r = await run(['report'], {});
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/give at least one script/);
  });

  it('reports a missing file with exit 2 and still writes the others', async () => {
    const r = await run(['report', 'a.rungs', 'gone.rungs'], { 'a.rungs': 'Hello there.\n' });
    expect(r.code).toBe(2);
    expect(r.err).toContain('gone.rungs: no such file or folder');
    expect(r.fs.files.has('/clinic/report.html')).toBe(true);
  });

  it('draws client progress from --records (repeatable) and reports a missing records file', async () => {
    const files = { 'a.rungs': '== One\nHello there.\n', 'c.rates.csv': HOSTILE_RECORDS.replace(/"[^"]*\.rungs"/g, 'a.rungs') };
    const ok = await run(['report', 'a.rungs', '--records', 'c.rates.csv', '--records', 'c.rates.csv'], files);
    expect(ok.code).toBe(0);
    const html = ok.fs.files.get('/clinic/report.html')!;
    expect(html.match(/<section class="records"/g)).toHaveLength(1);
    expect(html.match(/Records: c\.rates\.csv/g)).toHaveLength(1);
    const missing = await run(['report', 'a.rungs', '--records', 'gone.rates.csv'], files);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('gone.rates.csv: no such file or folder');
  });

  it('names what to install when --pdf finds no Chromium, exit 2, before writing anything', async () => {
    const r = await run(['report', 'a.rungs', '--pdf', 'r.pdf'], { 'a.rungs': 'Hello there.\n' }, { PATH: '/nowhere' });
    expect(r.code).toBe(2);
    expect(r.err).toContain('apt-get install chromium');
    expect(r.fs.writes).toEqual([]);
  });

  it('finds Chromium on PATH, or exactly where RUNGS_CHROMIUM says', () => {
    const fs = new MemFs({ '/opt/b/chromium': '', '/usr/bin/google-chrome': '' }, '/');
    expect(findChromium({ PATH: '/usr/local/bin:/opt/b:/usr/bin' }, fs)).toBe('/opt/b/chromium');
    expect(findChromium({ PATH: '/usr/bin' }, fs)).toBe('/usr/bin/google-chrome');
    expect(findChromium({ PATH: '/usr/bin', RUNGS_CHROMIUM: '/missing/chrome' }, fs)).toBeNull();
    expect(findChromium({}, fs)).toBeNull();
  });
});
