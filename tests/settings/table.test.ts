// The one table of settings (server/src/core/settings.ts) feeds every consumer: package.json's
// editor settings are generated from it, config files and script headers read a value alike,
// every number has a finite plausible range, and the item cache's key covers every scoring
// setting (changing any one re-scores the items; changing another setting does not).
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { clearConfigCache, resolveScriptContext } from '../../server/src/config/resolve';
import { analyze } from '../../server/src/core/analyze';
import { applySettings } from '../../server/src/core/options';
import { parseScript } from '../../server/src/core/parse';
import { defaultOptions, SETTINGS, settingText, type SettingSpec } from '../../server/src/core/settings';
import { editorConfiguration, normalizeSettings, toConfigObject } from '../../server/src/lsp/settings';
import { MemFs } from '../cli/memfs';
import { words } from '../helpers/data';
import { lintText } from '../rules/check';

const PKG = join(__dirname, '..', '..', 'package.json');

describe('the settings table', () => {
  it("package.json's contributes.configuration is generated from it", () => {
    const pkg = JSON.parse(readFileSync(PKG, 'utf8'));
    const generated = editorConfiguration();
    if (process.env.RUNGS_UPDATE_PACKAGE === '1') {
      pkg.contributes.configuration = generated;
      writeFileSync(PKG, `${JSON.stringify(pkg, null, 2)}\n`);
    }
    // On a difference: `RUNGS_UPDATE_PACKAGE=1 npx vitest run --config tests/vitest.config.ts tests/settings/table.test.ts`.
    expect(pkg.contributes.configuration).toEqual(generated);
  });

  it('every default reads with its own reader, and every number has a finite range', () => {
    expect(() => defaultOptions()).not.toThrow();
    for (const s of SETTINGS.filter((x) => ['number', 'integer', 'rate', 'weights'].includes(x.type))) {
      expect(Number.isFinite(s.range?.min) && Number.isFinite(s.range?.max), s.key).toBe(true);
      // A value beyond the range is refused (common practice: no clinic sets a rate of 1000/s).
      expect(s.apply(String(s.range!.max * 10 + 1), defaultOptions()), s.key).not.toBeNull();
    }
  });

  it('a config file, an editor setting and a script header read each value alike', () => {
    for (const s of SETTINGS.filter((x) => !x.scriptOnly)) {
      clearConfigCache();
      const fs = new MemFs({ '/w/.rungs.json': JSON.stringify({ [s.key]: s.example }), '/w/a.rungs': '' });
      const viaConfig = resolveScriptContext('/w/a.rungs', fs).options;
      // A rate-records key is read from config layers only: a script header reports it and keeps
      // the default, so the header's reading is compared with a config layer applied directly.
      const header = `@${s.key} ${s.example}\nHello.\n`;
      const viaHeader = s.recordsOnly
        ? applySettings(defaultOptions(), parseScript(header).header, 'config').options
        : analyze({ text: header, data: words }).options;
      if (s.recordsOnly) expect(analyze({ text: header, data: words }).options, s.key).toEqual(defaultOptions());
      expect(viaConfig, s.key).toEqual(viaHeader);
      if (!s.editor) continue;
      const editor = normalizeSettings(s.editor.name.split('.').reduceRight<unknown>((v, k) => ({ [k]: v }), s.example));
      expect(editor.warnings, s.key).toEqual([]);
      const fs2 = new MemFs({ '/v/a.rungs': '' });
      const viaEditor = resolveScriptContext('/v/a.rungs', fs2, { editor: { settings: toConfigObject(editor.settings), baseDir: '/v' } }).options;
      expect(viaEditor, s.key).toEqual(viaHeader);
    }
  });
});

/** A written value of a setting other than its default. */
function otherValue(s: SettingSpec): string {
  const base = JSON.stringify(s.scoring!(defaultOptions()));
  for (const v of [...(s.range ? [String((s.range.min + s.range.max) / 4)] : []), s.example, ...(s.values ?? [])]) {
    const o = defaultOptions();
    if (s.apply(v, o) === null && JSON.stringify(s.scoring!(o)) !== base) return v;
  }
  throw new Error(`no other value for @${s.key}`);
}

describe('the item cache key comes from the table', () => {
  const BODY = '== One\nGood morning to you.\nThe kettle is on.\n';
  const cachedAfter = (first: string, second: string) => {
    const a = analyze({ text: `${first}\n${BODY}`, data: words });
    const b = analyze({ text: `${second}\n${BODY}`, data: words, itemCache: a.itemCache, reuse: a.pronouncer });
    const before = [...a.itemCache.entries.values()];
    return [...b.itemCache.entries.values()].map((e) => before.includes(e));
  };
  const scoring = SETTINGS.filter((s) => s.scoring);

  it('the scoring settings are the ones that change item scores', () => {
    expect(scoring.map((s) => s.key)).toEqual(['paces', 'baseline', 'weights', 'reading-norm', 'wcm-h-fricative', 'wcm-syllable-clusters', 'wcm-secondary-stress']);
  });

  for (const s of scoring) {
    it(`changing @${s.key} re-scores every item`, () => {
      expect(cachedAfter('@title Before', `@${s.key} ${otherValue(s)}`)).toEqual([false, false]);
    });
  }

  it('changing a setting that does not score items keeps them', () => {
    expect(cachedAfter('@title Before', '@min-items 5')).toEqual([true, true]);
    expect(cachedAfter('@max-step 10', '@max-step 20')).toEqual([true, true]);
  });
});

it('settingText writes config values as a header would', () => {
  expect([settingText([1, 1.5]), settingText(true), settingText({ length: 1 }), settingText(null)]).toEqual(['1, 1.5', 'yes', 'length 1', null]);
});

describe('@max-phonemes (added by following DEVELOPERS.md "Add a setting")', () => {
  it('reads from the header, and a malformed value is reported at the value', () => {
    const ok = analyze({ text: '@max-phonemes 12\nHello.\n', data: words });
    expect(ok.options.maxPhonemes).toBe(12);
    expect(defaultOptions().maxPhonemes).toBe(0);
    const bad = lintText('@max-phonemes lots\nHello.\n').filter((p) => p.rule === 'bad-value');
    expect(bad.map((p) => [p.line, p.character, p.endCharacter, p.message])).toEqual([[0, 14, 18, '@max-phonemes must be a number, 0 or more, not "lots"']]);
    const half = lintText('@max-phonemes 2.5\nHello.\n').find((p) => p.rule === 'bad-value');
    expect(half?.message).toBe('@max-phonemes must be a whole number, not 2.5');
  });
});
