// After an edit inside one rung, lint hands on the same problem objects for everything that says
// what it said before (server/src/rules/index.ts: script-wide rules by what they say, rung-local
// rules by rung place), so the language server converts and writes only what changed. The
// problems must still be exactly those of a fresh analysis of the edited text.
import { describe, expect, it } from 'vitest';
import { analyze } from '../../server/src/core/analyze';
import { analyzeSegments } from '../../server/src/core/segments';
import { lint } from '../../server/src/rules/index';
import { lazyFix } from '../../server/src/rules/sayings';
import { words } from '../helpers/data';
import { benchScript } from '../lsp/bigScript';

describe('problems kept across an edit', () => {
  it('are the same objects where they say the same, and equal a fresh analysis', async () => {
    const text = await benchScript(2000);
    const state = analyzeSegments({ text, data: words }, undefined);
    const before = lint(state.output, text, undefined, undefined, true);
    // Type a letter into an item of the third rung (a word the dictionary lacks, so new problems come too).
    const lines = text.split('\n');
    const at = lines.findIndex((l, i) => i > lines.indexOf('== Level 3') && /^[A-Z]/.test(l));
    lines[at] = lines[at].replace(' ', ' zq');
    const edited = lines.join('\n');
    const after = lint(analyzeSegments({ text: edited, data: words }, state).output, edited, undefined, undefined, true);
    expect(JSON.stringify(after)).toBe(JSON.stringify(lint(analyze({ text: edited, data: words }), edited)));

    const earlier = new Map(before.map((p) => [JSON.stringify(p), p]));
    // Problems whose fix is worked out only when asked (an unsorted rung's) are never kept (below).
    const comparable = after.filter((p) => !lazyFix(p));
    const kept = comparable.filter((p) => earlier.get(JSON.stringify(p)) === p).length;
    const sayingTheSame = comparable.filter((p) => earlier.has(JSON.stringify(p))).length;
    // Every problem that says what an earlier one said is that earlier object, ladder rules' included.
    expect(kept).toBe(sayingTheSame);
    expect(after.some((p) => p.rule === 'rungs-overlap' || p.rule === 'step-backwards' || p.rule === 'uneven-steps')).toBe(true);
    expect(sayingTheSame).toBeGreaterThan(after.length - 10);
    // And the edit's own news is new: the typed word is reported.
    expect(after.some((p) => p.line === at && p.rule === 'estimated-word' && !earlier.has(JSON.stringify(p)))).toBe(true);
  });
});

describe('a fix worked out only when asked', () => {
  it('is told apart from a fix written out, so lint never writes it out to compare', () => {
    // An unsorted rung's fix sorts the rung when its edits are read (rules/unsortedRung.ts);
    // lint's keeping of problems skips what lazyFix marks, rather than sorting on every check.
    const text = '== One\nThe orthodontist recommended periodontal treatment.\nHi.\nHi.\n';
    const problems = lint(analyze({ text, data: words }), text);
    const unsorted = problems.find((p) => p.rule === 'unsorted-rung')!;
    const repeat = problems.find((p) => p.rule === 'duplicate-item')!;
    expect(lazyFix(unsorted)).toBe(true);
    expect(lazyFix(repeat)).toBe(false);
    expect(repeat.fix!.edits).toHaveLength(1);
    expect(unsorted.fix!.edits).toHaveLength(1);
  });
});

describe('a one-off check', () => {
  it('hands on no earlier problem objects', () => {
    // The CLI checks each script once: comparing with earlier problems would only cost it.
    const text = '== One\nGood morning.\nGood morning.\n== Two\nHi.\n';
    const a = lint(analyze({ text, data: words }), text);
    const b = lint(analyze({ text, data: words }), text);
    expect(JSON.stringify(b)).toBe(JSON.stringify(a));
    expect(b.some((p, i) => p === a[i])).toBe(false);
  });
});

