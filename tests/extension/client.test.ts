// Unit tests of the extension's pure parts: the ladder view's markup (escaping, marks, CSP), the
// status bar text, and which rung the cursor is in. The extension-host suite (suite/) and the
// workbench test cover the parts that need an editor.
import { describe, expect, it } from 'vitest';
import { escapeHtml, problemForStep, renderLadderBody, renderLadderPage } from '../../client/src/ladderHtml';
import { describeItem, rungLineAt } from '../../client/src/present';
import type { Ladder } from '../../client/src/protocol';

const EVIL = '<img src=x onerror="alert(1)">&\'';

function ladder(): Ladder {
  return {
    title: EVIL,
    direction: 'rising',
    maxStep: 12,
    rungs: [
      { name: 'Hello', line: 10, median: 13.85, min: 12.2, max: 17.7, paces: ['1 wps'], items: [
        { line: 11, text: 'Hello.', difficulty: 17.7, rank: 3 },
        { line: 12, text: 'Come in.', difficulty: 12.2, rank: 1 },
        { line: 13, text: 'Sit down.', difficulty: 15.5, rank: 2 },
      ] },
      { name: EVIL, line: 16, median: 40.1, min: 35.9, max: 44.9, paces: ['1 wps'], items: [
        { line: 17, text: EVIL, difficulty: 40.1, rank: 1 },
      ] },
      { name: 'Back to short', line: 20, median: 21.7, min: 7.8, max: 24, paces: ['1 wps'], items: [
        { line: 21, text: 'Tea?', difficulty: 7.8, rank: 1 },
        { line: 22, text: 'Yes, please.', difficulty: 24, rank: 2 },
      ] },
    ],
    steps: [
      { from: 0, to: 1, delta: 26.3, problem: 'step-too-big' },
      { from: 1, to: 2, delta: -18.4, problem: 'step-backwards' },
    ],
    problems: [
      { rule: 'step-too-big', severity: 'warning', line: 16, message: `rung 2 ${EVIL} is 26.3 above` },
      { rule: 'step-backwards', severity: 'warning', line: 20, message: 'rung 3 "Back to short" steps back' },
    ],
  };
}

const count = (html: string, re: RegExp): number => (html.match(re) ?? []).length;

describe('ladder view markup', () => {
  it('escapes every string that came from the script', () => {
    const html = renderLadderBody(ladder());
    expect(html).not.toContain('<img');
    expect(html).not.toContain('onerror="');
    expect(html).toContain('&lt;img src=x onerror=&quot;alert(1)&quot;&gt;&amp;&#39;');
    expect(escapeHtml(`a<b>"c"&'d'`)).toBe('a&lt;b&gt;&quot;c&quot;&amp;&#39;d&#39;');
  });

  it('draws one point per item, one median per rung and one mark per problem step', () => {
    const html = renderLadderBody(ladder());
    expect(count(html, /<circle class="item"/g)).toBe(6);
    expect(count(html, /<path class="median"/g)).toBe(3);
    expect(count(html, /<g class="mark"/g)).toBe(2);
    expect(count(html, /<line class="step problem"/g)).toBe(2);
    expect(count(html, /<rect class="allowed"/g)).toBe(2);
    expect(html).toContain('data-rule="step-backwards" data-line="20"');
  });

  it('marks no step that breaks no rule', () => {
    const l = ladder();
    l.steps = l.steps.map((s) => ({ ...s, problem: null }));
    const html = renderLadderBody(l);
    expect(count(html, /<g class="mark"/g)).toBe(0);
    expect(count(html, /class="step problem"/g)).toBe(0);
  });

  it('says so when there is nothing to draw', () => {
    expect(renderLadderBody(null)).toContain('No items');
    expect(renderLadderBody({ ...ladder(), rungs: [], steps: [] })).toContain('No items');
  });

  it('finds the problem a mark explains on the upper rung', () => {
    const l = ladder();
    expect(problemForStep(l, l.steps[1])?.line).toBe(20);
  });

  it('wraps the body in a page with a strict Content-Security-Policy and theme colours', () => {
    const page = renderLadderPage({ cspSource: 'vscode-webview://x', nonce: 'N0nce', heading: EVIL, body: '<p>b</p>' });
    const csp = /content="([^"]+)"/.exec(page)![1];
    expect(csp).toContain("default-src 'none'");
    expect(csp).toContain("script-src 'nonce-N0nce'");
    expect(csp).toContain("style-src 'nonce-N0nce'");
    expect(csp).not.toMatch(/unsafe|https?:/);
    expect(page).not.toMatch(/(src|href)="https?:/);
    expect(count(page, /<script nonce="N0nce">/g)).toBe(1);
    expect(count(page, /<script/g)).toBe(1);
    expect(page).toContain('var(--vscode-errorForeground)');
    expect(page).not.toMatch(/#[0-9a-f]{6}\b/i);
    expect(page).toContain('<h1 id="heading">&lt;img');
  });
});

describe('status bar text', () => {
  it('shows difficulty and seconds at the rung pace', () => {
    const d = describeItem({ line: 3, difficulty: 42.06, rank: 2, rungName: 'Breakfast', pace: '1.5 wps', seconds: 2.6667 });
    expect(d.text).toBe('$(graph-line) 42.1 · 2.7 s @ 1.5 wps');
    expect(d.tooltip).toContain('rank 2 in "Breakfast"');
    expect(describeItem({ line: 0, difficulty: 80, rank: 1, rungName: 'R', pace: '1 wps', seconds: 12.4 }).text).toBe(
      '$(graph-line) 80 · 12 s @ 1 wps',
    );
  });
});

describe('the rung under the cursor', () => {
  it('is the last rung starting at or above the line', () => {
    const l = ladder();
    expect(rungLineAt(l, 5)).toBeNull();
    expect(rungLineAt(l, 10)).toBe(10);
    expect(rungLineAt(l, 15)).toBe(10);
    expect(rungLineAt(l, 22)).toBe(20);
    expect(rungLineAt(null, 3)).toBeNull();
  });
});
