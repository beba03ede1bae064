// Item 4 of the hardening issue: patterns that re-scanned a run of spaces from each of its
// positions (time quadratic in the run) and a config check comparing every key with every other.
// Each input below took minutes or more before the fix; the test timeout is the guard (no timing
// assertion), and the results are checked as well.
import { describe, expect, it } from 'vitest';
import { parseScript } from '../../server/src/core/parse';
import { applySettings, defaultOptions } from '../../server/src/core/options';
import { parseConfigText } from '../../server/src/config/parseConfig';
import { formatScript as formatText } from '../../server/src/lsp/formatScript';
import { renderFindings } from '../../server/src/rules/index';
import { analyzeText } from '../helpers/data';

const S = ' '.repeat(100_000);
const T = { timeout: 20_000 };

const LINES = [
  `Hi there. | @set a${S}x@y`,
  `Hi there. | @set${S}`,
  `Hi there. |${S}#id${S}note`,
  `@baseline 1${S}x`,
  `@reading-norm 3${S}x`,
  `@weights length${S}x`,
  `@title a${S}b`,
  `@set-bound 1${S}x`,
  `@paces 1${S},${S}2 wps`,
  `@say word${S}=${S}W ER1 D`,
  `== A${S}b${S}@pace 1${S}x`,
  `== A${S}b${S}=`,
];

describe('long runs of spaces', () => {
  it.each(LINES.map((l, i) => [i, l]))('parses, analyses and formats line %i', (_i, line) => {
    const text = `== R\n${line}\nSee you.\n`;
    const a = analyzeText(text);
    for (const p of renderFindings(a.findings)) expect(p.endCharacter).toBeLessThanOrEqual(text.split('\n')[p.line].length + 1);
    const f = formatText(text);
    expect(formatText(f)).toBe(f);
  }, T.timeout);

  it('keeps what the patterns read', () => {
    const s = parseScript(`== Warm up${S}@pace 1.5${S}==${S}\nHi there. | @set a b${S}#x1${S}note\n@title  Week 3${S}\n`);
    expect(s.rungs[0].name).toBe('Warm up');
    expect(s.rungs[0].settings.map((x) => [x.key, x.value])).toEqual([['pace', '1.5']]);
    expect(s.rungs[0].items[0].sets).toEqual(['a', 'b']);
    expect(s.rungs[0].items[0].id).toBe('x1');
    expect(s.rungs[0].items[0].note).toBe('note');
    expect(s.header.map((x) => [x.key, x.value])).toEqual([['title', 'Week 3']]);
    const o = applySettings(defaultOptions(), [{ key: 'weights', value: `length${S}= 0.4, complexity: 0.4, rarity 0.2`, line: 0, keyStart: 0, keyEnd: 1, valueStart: 1, valueEnd: 2 }], 'script');
    expect(o.findings).toEqual([]);
    expect(o.options.weights).toEqual({ length: 0.4, complexity: 0.4, rarity: 0.2 });
    expect(formatText(`== A${S}@pace${S}1${S}==\n@paces 1 ,2${S},3 wps\n@say  x${S}=${S}K S\n`)).toBe('== A @pace 1 ==\n@paces 1, 2, 3 wps\n@say x = K S\n');
  });
});

describe('config files with many keys', () => {
  it('reads 20,000 keys and still reports a repeated key where it is', () => {
    const keys = Array.from({ length: 20_000 }, (_, i) => `"k${i}": ${i}`);
    const json = `{${keys.join(',\n')},\n"max-step": 10,\n"max-step": 12}`;
    const layer = parseConfigText(json, '/p/.rungs.json');
    const dup = renderFindings(layer.findings).filter((p) => /unique/.test(p.message));
    expect(dup.map((p) => [p.line, p.character])).toEqual([[20_001, 0]]);
    expect(renderFindings(layer.findings).filter((p) => p.rule === 'unknown-key').length).toBe(20_000);
    const yaml = Array.from({ length: 20_000 }, (_, i) => `k${i}: ${i}`).join('\n');
    expect(parseConfigText(yaml, '/p/.rungs.yaml').findings.length).toBe(20_000);
  }, 40_000);
});
