// The config resolver: files found by walking up, nearer over farther, `root: true` stops the
// walk, header over config over editor settings over defaults, and bad config reported with
// file, line and column.
import { describe, expect, it } from 'vitest';
import { clearConfigCache, parseConfigText, resolveScriptContext, type ConfigLayer, type ScriptContext } from '../../server/src/config/resolve';
import { renderFindings } from '../../server/src/rules/index';
import { analyze } from '../../server/src/core/analyze';
import { MemFs } from '../cli/memfs';
import { words } from '../helpers/data';

const at = (p: { file: string; problem: { line: number; character: number; rule: string; message: string } }) =>
  `${p.file}:${p.problem.line + 1}:${p.problem.character + 1} ${p.problem.rule} ${p.problem.message}`;

/** The resolver's findings as the rules word them (what `rungs lint` and the editor show). */
const rendered = (ctx: ScriptContext) => ctx.findings.map(({ file, finding }) => ({ file, problem: renderFindings([finding])[0] }));

describe('resolveScriptContext', () => {
  it('merges config files from the script folder up, the nearer winning', () => {
    clearConfigCache();
    const fs = new MemFs({
      '/lib/.rungs.yaml': 'max-step: 20\nmin-items: 5\nrules:\n  thin-rung: error\n  item-outlier: off\n',
      '/lib/clinic/.rungs.json': '{ "max-step": 9, "rules": { "thin-rung": "info" }, "ladder": { "metric": "syllables" } }',
      '/lib/clinic/a.rungs': 'Hello.\n',
    });
    const ctx = resolveScriptContext('/lib/clinic/a.rungs', fs);
    expect(rendered(ctx)).toEqual([]);
    expect(ctx.configFiles).toEqual(['/lib/.rungs.yaml', '/lib/clinic/.rungs.json']);
    expect(ctx.options.maxStep).toBe(9);
    expect(ctx.options.minItems).toBe(5);
    expect(ctx.lint).toEqual({ severities: { 'thin-rung': 'info', 'item-outlier': 'off' }, ladder: { metric: 'syllables' } });
  });

  it('stops at root: true and takes the first file name per folder', () => {
    clearConfigCache();
    const fs = new MemFs({
      '/lib/.rungs.json': '{ "min-items": 7 }',
      '/lib/team/.rungs.json': '{ "root": true, "max-step": 11 }',
      '/lib/team/.rungs.yaml': 'max-step: 99\n',
      '/lib/team/x/a.rungs': 'Hello.\n',
    });
    const ctx = resolveScriptContext('/lib/team/x/a.rungs', fs);
    expect(ctx.configFiles).toEqual(['/lib/team/.rungs.json']);
    expect(ctx.options.maxStep).toBe(11);
    expect(ctx.options.minItems).toBe(3);
  });

  it('layers defaults < editor settings < config files < script header', () => {
    clearConfigCache();
    const fs = new MemFs({ '/w/.rungs.yml': 'min-items: 4\n', '/w/a.rungs': '@max-words 6\nHello.\n' });
    const ctx = resolveScriptContext('/w/a.rungs', fs, {
      editor: { settings: { 'min-items': 2, 'max-words': 3, 'max-syllables': 9, paces: [1, 2] }, baseDir: '/w' },
    });
    expect(ctx.options.minItems).toBe(4);
    expect(ctx.options.maxWords).toBe(3);
    expect(ctx.options.maxSyllables).toBe(9);
    expect(ctx.options.paces.map((p) => p.label)).toEqual(['1 wps', '2 wps']);
    const a = analyze({ text: fs.readFile('/w/a.rungs'), data: words, options: ctx.options });
    expect(a.options.maxWords).toBe(6);
    expect(a.options.minItems).toBe(4);
  });

  it('reads lexicon files relative to the config file, and reports a missing one', () => {
    clearConfigCache();
    const fs = new MemFs({
      '/w/.rungs.json': '{\n  "lexicon": ["names.lexicon", "gone.lexicon"]\n}',
      '/w/names.lexicon': '// clinic names\nTeodric = T EY1 OW0 D R IH0 K\nOkafor = OW0 K AA1 F NX\n',
      '/w/a.rungs': 'Teodric is here.\n',
    });
    const ctx = resolveScriptContext('/w/a.rungs', fs);
    expect(ctx.lexicon.map((o) => o.word)).toEqual(['teodric']);
    expect(rendered(ctx).map(at)).toEqual([
      '/w/names.lexicon:3:22 unknown-phone "NX" is not a CMU ARPAbet phone: use one of the 39 phones, e.g. AE1, K, NG',
      '/w/.rungs.json:2:14 bad-config lexicon file "gone.lexicon" does not exist (looked for /w/gone.lexicon)',
    ]);
  });

  it('reports bad config with positions, checks values like header values and suggests keys', () => {
    clearConfigCache();
    const fs = new MemFs({
      '/w/.rungs.yaml': 'max-stp: 12\npaces: 90 wpm\nrules:\n  step-backward: error\n  thin-rung: loud\nladder:\n  metric: length\ntitle: nope\n',
      '/w/a.rungs': 'Hello.\n',
    });
    const ctx = resolveScriptContext('/w/a.rungs', fs);
    expect(rendered(ctx).map(at)).toEqual([
      '/w/.rungs.yaml:1:1 unknown-key unknown key "max-stp"; did you mean "max-step"?',
      '/w/.rungs.yaml:4:3 bad-config unknown rule "step-backward"; did you mean "step-backwards"?',
      '/w/.rungs.yaml:5:14 bad-config the severity of "thin-rung" is one of error, warning, info, hint, off, not "loud"',
      '/w/.rungs.yaml:7:11 bad-config ladder metric is one of difficulty, words, syllables, phonemes, wcm, rarity, not "length"',
      '/w/.rungs.yaml:8:1 bad-value "title" belongs in a script, not in a config file',
      '/w/.rungs.yaml:2:8 bad-value pace 90 is not a plausible speech rate (above 20 per second)',
    ]);
    const fix = rendered(ctx)[0].problem.fix!;
    expect(fix.edits).toEqual([{ line: 0, character: 0, endLine: 0, endCharacter: 7, newText: 'max-step' }]);
    expect(ctx.options.paces.map((p) => p.label)).toEqual(['1 wps', '1.5 wps', '2 wps']);
  });

  const shown = (l: ConfigLayer) =>
    renderFindings(l.findings).map((p) => `${p.line + 1}:${p.character + 1} ${p.rule} ${p.message}`);
  const values = (l: { settings: { key: string; value: string }[] }) => l.settings.map((s) => `${s.key}=${s.value}`);

  it('reports an unclosed YAML bracket where it opens, and the rest of the file still applies', () => {
    // The parser gives up at the end of the file (3:1); the "[" of line 2, column 8 is never closed.
    const layer = parseConfigText('max-step: 12\nrules: [unclosed\n', '/w/.rungs.yaml');
    expect(shown(layer)).toEqual([
      '2:8 bad-config cannot read the config file: Flow sequence in block collection must be sufficiently indented and end with a ]',
    ]);
    expect(values(layer)).toEqual(['max-step=12']);
    expect(layer.rules).toEqual({});
  });

  it('leaves out only the top-level YAML entry a syntax error falls in', () => {
    const layer = parseConfigText('max-step: 12\nrules:\n  thin-rung: off\n bad: indent\nmin-items: 4\n', '/w/.rungs.yaml');
    expect(shown(layer)).toEqual(['4:1 bad-config cannot read the config file: All mapping items must start at the same column']);
    expect(values(layer)).toEqual(['max-step=12', 'min-items=4']);
    expect(layer.rules).toEqual({ 'thin-rung': 'off' });
  });

  it('reports a trailing comma in .rungs.json at its line and column, and ignores the file', () => {
    const layer = parseConfigText('{\n  "max-step": 9,\n}\n', '/w/.rungs.json');
    expect(shown(layer)).toEqual([
      '3:1 bad-config cannot read the config file: Expected double-quoted property name (JSON allows no comma after the last entry)',
    ]);
    expect(values(layer)).toEqual([]);
    // The same text is a valid YAML flow mapping: only a .json file is held to JSON.
    expect(values(parseConfigText('{\n  "max-step": 9,\n}\n', '/w/.rungs.yaml'))).toEqual(['max-step=9']);
  });

  it('locates JSON errors that JSON.parse names without a position, and comments', () => {
    // "Unexpected token ']'" carries no offset; the "]" is at column 17.
    expect(shown(parseConfigText('{"paces": [1, 2,], "max-step": 4}', '/w/.rungs.json'))).toEqual([
      "1:17 bad-config cannot read the config file: Unexpected token ']' (JSON allows no comma after the last entry)",
    ]);
    expect(shown(parseConfigText('{\n  // note\n  "max-step": 9\n}', '/w/.rungs.json'))).toEqual([
      "2:3 bad-config cannot read the config file: Expected property name or '}' (JSON allows no comments; use .rungs.yaml for comments)",
    ]);
    const ok = parseConfigText('\uFEFF{"max-step": 3}', '/w/.rungs.json');
    expect([shown(ok), values(ok)]).toEqual([[], ['max-step=3']]);
    expect(shown(parseConfigText('\n', '/w/.rungs.json'))).toEqual([]);
  });

  it('parses a changed file again but reuses an unchanged one', () => {
    clearConfigCache();
    const fs = new MemFs({ '/w/.rungs.json': '{"max-step": 5}', '/w/a.rungs': 'Hello.\n' });
    expect(resolveScriptContext('/w/a.rungs', fs).options.maxStep).toBe(5);
    fs.files.set('/w/.rungs.json', '{"max-step": 6}');
    expect(resolveScriptContext('/w/a.rungs', fs).options.maxStep).toBe(6);
  });
});
