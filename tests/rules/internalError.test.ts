// A rule that throws, or reports outside the script, must not break the lint: the registry turns
// it into one registered `internal-error` problem whose docs link resolves, and every other rule
// still reports.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { ruleAnchor, ruleDocsUrl } from '../../server/src/rules/docs';
import { RULES, ruleById } from '../../server/src/rules/index';
import type { Rule } from '../../server/src/rules/types';
import { VERSION } from '../../server/src/version';
import { lintText } from './check';

const TEXT = '@pacse 1 wps\n== One\nYes.\n';
const thinRung = ruleById('thin-rung')!;
const original = thinRung.check;
// thin-rung checks one rung at a time (checkRung); the stand-ins below replace the whole check.
const originalRung = thinRung.checkRung;
afterEach(() => {
  thinRung.check = original;
  thinRung.checkRung = originalRung;
});

describe('internal-error', () => {
  it('is registered, and its docs link points at a README anchor', () => {
    expect(RULES.map((r) => r.id)).toContain('internal-error');
    const readme = readFileSync(join(__dirname, '..', '..', 'README.md'), 'utf8');
    expect(readme).toContain(`<a id="${ruleAnchor('internal-error')}"></a>`);
    expect(ruleDocsUrl('internal-error')).toMatch(/README\.md#rule-internal-error$/);
  });

  it('a throwing rule becomes one problem; the other rules still report', () => {
    const before = lintText(TEXT).map((p) => p.rule);
    expect(before).toContain('thin-rung');
    (thinRung as Rule).check = () => {
      throw new Error('boom');
    };
    thinRung.checkRung = undefined;
    const after = lintText(TEXT);
    expect(after.filter((p) => p.rule === 'internal-error').map((p) => p.message)).toEqual(['rule thin-rung failed on this script: boom']);
    expect(after.map((p) => p.rule).filter((r) => r !== 'internal-error').sort()).toEqual(before.filter((r) => r !== 'thin-rung').sort());
  });

  it('a report outside the script becomes one problem too', () => {
    (thinRung as Rule).check = (_ctx, report) => report({ line: 40, character: 0, endLine: 40, endCharacter: 1, message: 'far away' });
    thinRung.checkRung = undefined;
    const after = lintText(TEXT);
    expect(after.find((p) => p.rule === 'internal-error')?.message).toBe(
      'rule thin-rung failed on this script: reported a position outside the script (line 41, column 1)',
    );
    expect(after.some((p) => p.message === 'far away')).toBe(false);
  });
});

describe('the version string', () => {
  it('is package.json\'s', () => {
    const pkg = JSON.parse(readFileSync(join(__dirname, '..', '..', 'package.json'), 'utf8')) as { version: string };
    expect(VERSION).toBe(pkg.version);
  });
});
