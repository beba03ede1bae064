// The progress view's markup, without an editor: text from the records file is escaped, points sit
// above or below the mark line as their ratio says, and the page keeps the strict CSP.
import { describe, expect, it } from 'vitest';
import { renderProgressBody, renderProgressPage } from '../../client/src/progressHtml';
import type { ProgressView } from '../../server/src/lsp/contract';

const view: ProgressView = {
  benefitMark: 1.2,
  rows: 3,
  recordsRead: 3,
  problems: 1,
  trends: [
    {
      client: 'C-<0417>',
      script: 'a.rungs',
      rung: 'Short & "sweet"',
      note: 'meets the mark in the last 2 sessions; consider the next rung',
      ready: true,
      slopePerWeek: 0.2,
      points: [
        { date: '2026-03-02', day: 0, ratio: 1.0, benefit: false, line: 2 },
        { date: '2026-03-09', day: 7, ratio: 1.4, benefit: true, line: 3 },
      ],
    },
  ],
};

describe('progress view markup', () => {
  const body = renderProgressBody(view);

  it('escapes everything that came from the file', () => {
    expect(body).toContain('C-&lt;0417&gt;');
    expect(body).toContain('Short &amp; &quot;sweet&quot;');
    expect(body).not.toContain('<0417>');
  });

  it('draws one point per session, filled when it meets the mark, on the right side of the mark line', () => {
    expect(body.match(/<circle class="session/g)).toHaveLength(2);
    expect(body.match(/class="session at-mark"/g)).toHaveLength(1);
    const y = (cls: RegExp) => Number(cls.exec(body)![1]);
    const mark = y(/class="mark-line"[^>]*y1="([\d.]+)"/);
    // SVG y grows downwards: a ratio above the mark is drawn higher (smaller y).
    expect(y(/class="session at-mark"[^>]*cy="([\d.]+)"/)).toBeLessThan(mark);
    expect(y(/class="session"[^>]*cy="([\d.]+)"/)).toBeGreaterThan(mark);
    expect(body).toContain('1 bad row (see Problems)');
    expect(body).toContain('+0.2 per week');
  });

  it('says what to do when there is nothing to draw', () => {
    expect(renderProgressBody(null)).toContain('Open a rate records file');
    expect(renderProgressBody({ ...view, trends: [] })).toContain('No paced sessions yet');
  });

  it('wraps the body in a page with a nonce-only CSP', () => {
    const page = renderProgressPage({ cspSource: 'vscode-resource:', nonce: 'abc', heading: 'Progress: <x>', body });
    expect(page).toContain("default-src 'none'; style-src 'nonce-abc'; script-src 'nonce-abc'");
    expect(page).toContain('Progress: &lt;x&gt;');
  });
});
