// The progress view of rate records in a real VS Code workbench (code-server + Chromium, see
// cs-progress.ts). Expectations come from the core reading the same sample records and scripts;
// skipped with the reason when code-server or Chromium is missing, unless RUNGS_REQUIRE_EDITORS=1.
import { execFileSync } from 'node:child_process';
import { copyFileSync, existsSync, mkdirSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { scriptFacts, type ProgressResult } from '../../server/src/core/records';
import { readProgress } from '../../server/src/rules/records';
import { runProgressWorkbench, type ProgressDriverReport } from './cs-progress';
import { chromiumBin, codeServer, missing, root, skip } from './workbench-env';

if (skip) console.warn(`SKIPPED progress view workbench test: missing ${missing.join(' and ')}`);

const RECORDS = 'morning-routine.C-0417.rates.csv';
const NEW_ROW = '2026-10-02,C-0417,morning-routine.rungs,Getting ready,paced,30,30,1.5,,,,';

describe.skipIf(skip)('progress view in the VS Code workbench (code-server + Chromium)', () => {
  let expected: ProgressResult;
  let report: ProgressDriverReport;

  beforeAll(async () => {
    if (missing.length) throw new Error(`RUNGS_REQUIRE_EDITORS=1 but missing ${missing.join(' and ')}`);
    if (!existsSync(join(root, 'dist', 'extension.js')) || !existsSync(join(root, 'dist', 'server.js'))) {
      execFileSync('npm', ['run', 'build', '--silent'], { cwd: root, stdio: 'pipe' });
    }
    const scratch = join(root, '.cache', 'workbench-progress');
    rmSync(scratch, { recursive: true, force: true });
    const ws = join(scratch, 'ws');
    mkdirSync(ws, { recursive: true });
    for (const f of readdirSync(join(root, 'sample-scripts'))) copyFileSync(join(root, 'sample-scripts', f), join(ws, f));
    const vsix = join(scratch, 'rungs.vsix');
    execFileSync('npm', ['run', 'vsix', '--silent', '--', '--out', vsix], { cwd: root, stdio: 'pipe' });
    const text = readFileSync(join(ws, RECORDS), 'utf8');
    expected = readProgress({ text, scripts: (p) => (existsSync(join(ws, p)) ? scriptFacts(readFileSync(join(ws, p), 'utf8')) : null), today: '2026-12-02' });
    const firstPaced = expected.records.find((r) => r.condition === 'paced' && r.ratio !== null)!;
    report = await runProgressWorkbench({
      codeServer,
      chromium: chromiumBin,
      vsix,
      workspace: ws,
      file: RECORDS,
      scratch,
      artifacts: join(root, 'tests', 'artifacts'),
      expect: {
        firstLine: text.split('\n')[0].slice(0, 30),
        hoverLineNumber: firstPaced.line,
        hoverText: `Ratio ${String(Number(firstPaced.ratio!.toFixed(2)))}`,
        points: expected.trends.reduce((n, t) => n + t.ratios.length, 0),
        newRow: `\n${NEW_ROW}`,
      },
    });
  }, 300_000);

  it('opens *.rates.csv in the records language and marks the planted bad row', () => {
    expect(report.languageStatus).toContain('Rungs rate records');
    // The grammar colours columns: the header's cells are drawn in more than three colours.
    expect(report.rowColours).toBeGreaterThan(3);
    expect(expected.problems.map((p) => p.rule)).toEqual(['bad-record']);
    expect(report.squiggles).toBeGreaterThanOrEqual(1);
  });

  it("hovers a row with its ratio and the unassisted rate it was compared with", () => {
    const r = expected.records.find((x) => x.condition === 'paced' && x.ratio !== null)!;
    expect(report.hoverText).toContain(`Ratio ${String(Number(r.ratio!.toFixed(2)))} to`);
    expect(report.hoverText).toMatch(/words\/s unassisted \(same day, line \d+\)/);
  });

  it('draws a chart per client and rung with every session against the mark, and follows edits', () => {
    expect(report.trends).toBe(expected.trends.length);
    expect(report.markLines).toBe(expected.trends.length);
    expect(report.points).toBe(expected.trends.reduce((n, t) => n + t.ratios.length, 0));
    expect(report.atMark).toBe(expected.trends.reduce((n, t) => n + t.atMark, 0));
    expect(report.pointsAfterEdit).toBe(report.points + 1);
  });
});
