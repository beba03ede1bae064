// The README's rule list is generated from rule metadata and must match it; every rule is one
// file named after its id, 20-100 lines, with a summary and docs.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { rulesMarkdown, ruleDocsUrl, RULE_DOCS_BASE } from '../../server/src/rules/docs';
import { RULES } from '../../server/src/rules/index';

const root = join(__dirname, '..', '..');
const README = join(root, 'README.md');
const START = '<!-- rules:start -->';
const END = '<!-- rules:end -->';
const camel = (id: string) => id.replace(/-([a-z])/g, (_m, c: string) => c.toUpperCase());

describe('rule docs', () => {
  it('README holds the generated rule list between the markers', () => {
    const text = readFileSync(README, 'utf8');
    const a = text.indexOf(START);
    const b = text.indexOf(END);
    expect(a).toBeGreaterThan(0);
    expect(b).toBeGreaterThan(a);
    const want = `${START}\n${rulesMarkdown(RULES)}\n${END}`;
    if (process.env.RUNGS_UPDATE_README === '1') writeFileSync(README, text.slice(0, a) + want + text.slice(b + END.length));
    expect(readFileSync(README, 'utf8').slice(a, a + want.length)).toBe(want);
  });

  it('every rule is documented and has one file named after its id', async () => {
    const ids = RULES.map((r) => r.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const r of RULES) {
      expect(r.id).toMatch(/^[a-z]+(-[a-z]+)*$/);
      expect(r.summary.length).toBeGreaterThan(20);
      expect(r.docs.length).toBeGreaterThan(200);
      const file = join(root, 'server', 'src', 'rules', `${camel(r.id)}.ts`);
      const source = readFileSync(file, 'utf8');
      const lines = source.trimEnd().split('\n').length;
      expect(lines, `${r.id}: ${lines} lines`).toBeGreaterThanOrEqual(20);
      expect(lines, `${r.id}: ${lines} lines`).toBeLessThanOrEqual(100);
      const mod = (await import(file)) as Record<string, unknown>;
      expect(mod[camel(r.id)]).toBe(r);
      expect(source).toContain(`id: '${r.id}'`);
    }
  });

  it('links each rule to its README anchor from one base', () => {
    expect(ruleDocsUrl('step-backwards')).toBe(`${RULE_DOCS_BASE}#rule-step-backwards`);
    const text = readFileSync(README, 'utf8');
    for (const r of RULES) expect(text).toContain(`<a id="rule-${r.id}"></a>`);
  });
});
