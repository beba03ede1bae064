// Each rule id is owned by its rule file: no rule id is written as a string outside
// server/src/rules/, every finding kind of the core and the config reader has exactly one rule
// that words it, and every rule's check does work (none is metadata only).
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { describe, expect, it } from 'vitest';
import { OWNER, RULES } from '../../server/src/rules/index';

const SRC = join(__dirname, '..', '..', 'server', 'src');

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? files(p) : p.endsWith('.ts') ? [p] : [];
  });
}

describe('rule ids and findings', () => {
  it('no rule id appears as a string literal outside server/src/rules/', () => {
    const found: string[] = [];
    for (const f of files(SRC)) {
      const rel = relative(SRC, f).split('\\').join('/');
      if (rel.startsWith('rules/')) continue;
      const text = readFileSync(f, 'utf8');
      for (const r of RULES) if (new RegExp(`['"\`]${r.id}['"\`]`).test(text)) found.push(`${rel}: ${r.id}`);
    }
    expect(found).toEqual([]);
  });

  it('every finding kind has exactly one rule that words it', () => {
    // Every kind owned is checked by the compiler (rules/index.ts); here: owned once, and each
    // owner words it through its own describe.
    const claims = RULES.flatMap((r) => (r.kinds ?? []).map((k) => `${k} ${r.id}`));
    expect(new Set(claims.map((c) => c.split(' ')[0])).size).toBe(claims.length);
    for (const [kind, rule] of OWNER) expect(rule.kinds, kind).toContain(kind);
    expect(OWNER.size).toBe(claims.length);
  });

  it('no rule is metadata only: every check has a body', () => {
    const empty = RULES.filter((r) => /^check\(\)\s*\{\s*\}$/.test(r.check.toString().trim())).map((r) => r.id);
    expect(empty).toEqual([]);
  });
});
