// A real third-party client: Debian's Neovim, headless, attaches `rungs lsp --stdio` to a copy
// of the demo script, reads the diagnostics and a hover, applies a quick fix, and this test
// checks what it saw. Skips when `nvim` is missing, unless RUNGS_REQUIRE_EDITORS=1 (as .ci/run sets).
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { analyze } from '../../server/src/core/analyze';
import { lint, RULES } from '../../server/src/rules/index';
import { words } from '../helpers/data';
import { BIN, ROOT } from '../helpers/lspClient';

const hasNvim = spawnSync('nvim', ['--version'], { encoding: 'utf8' }).status === 0;
const required = process.env.RUNGS_REQUIRE_EDITORS === '1';
if (!hasNvim && !required) console.warn('tests/editors/nvim.test.ts: skipped, `nvim` is not installed (apt-get install neovim)');

describe.skipIf(!hasNvim && !required)('Neovim 0.7 as an LSP client', () => {
  it('shows the planted problems, a hover with the right numbers, and applies a quick fix', () => {
    if (!hasNvim) throw new Error('RUNGS_REQUIRE_EDITORS=1 but `nvim` is not installed (apt-get install neovim)');
    const rig = join(ROOT, '.cache/nvim');
    const ws = join(rig, 'ws');
    mkdirSync(ws, { recursive: true });
    const script = join(ws, 'family-visits-draft.rungs');
    copyFileSync(join(ROOT, 'sample-scripts/family-visits-draft.rungs'), script);
    const text = readFileSync(script, 'utf8');
    const lines = text.split('\n');
    const hoverLine = lines.findIndex((l) => l.includes('cup of coffee'));
    const fixLine = lines.findIndex((l) => l.startsWith('@pacse'));
    const out = join(rig, 'result.txt');
    const env = {
      ...process.env,
      XDG_CACHE_HOME: join(rig, 'xdg/cache'),
      XDG_STATE_HOME: join(rig, 'xdg/state'),
      XDG_DATA_HOME: join(rig, 'xdg/data'),
      XDG_CONFIG_HOME: join(rig, 'xdg/config'),
      OUT: out,
      RUNGS_BIN: BIN,
      HOVER_LINE: String(hoverLine),
      HOVER_COL: String(lines[hoverLine].indexOf('coffee') + 2),
      FIX_LINE: String(fixLine),
    };
    const r = spawnSync('nvim', ['--headless', '-u', 'NONE', '-i', 'NONE', '-n', '-c', `luafile ${join(ROOT, 'tests/editors/nvim-client.lua')}`, script], {
      env,
      encoding: 'utf8',
      timeout: 60_000,
      cwd: ws,
    });
    const result = readFileSync(out, 'utf8');
    expect(result, `nvim exit ${r.status}: ${r.stderr}`).toContain('RESULT\tPASS');
    const records = result.split('\n').map((l) => l.split('\t'));

    // Diagnostics: the core's unknown-key with its suggestion, and every ladder rule the same
    // analysis finds in-process, on the same lines.
    const diags = records.filter((x) => x[0] === 'DIAG').map((x) => ({ line: Number(x[1]), code: x[4], message: x[5] }));
    expect(diags).toContainEqual({ line: fixLine, code: 'unknown-key', message: 'unknown setting "@pacse"; did you mean "@paces"?' });
    const ladderRules = new Set(RULES.filter((x) => x.category === 'ladder').map((x) => x.id));
    const expected = lint(analyze({ text, data: words }), text).filter((p) => ladderRules.has(p.rule));
    for (const p of expected) expect(diags).toContainEqual(expect.objectContaining({ line: p.line, code: p.rule }));

    // Hover on "coffee": CMU phones looked up in the word table; WCM by hand from the Stoel-Gammon 2010
    // table (velar K 1, fricative F 1; vowel-final, two syllables, initial stress, no cluster) = 2;
    // Zipf and Lg10WF from the SUBTLEX count with the published formulas (van Heuven et al. 2014).
    const hover = result.slice(result.indexOf('HOVER-BEGIN\n') + 12, result.indexOf('HOVER-END'));
    const phones = words.pronunciations('coffee')![0];
    expect(phones).toBe('K AA1 F IY0');
    const count = words.count('coffee');
    const zipf = Math.log10((count + 1) / (51 + 0.074286)) + 3;
    expect(hover).toContain(`\`${phones}\` · /ˈkɑfi/`);
    expect(hover).toContain(`| 2 | 4 | 2 | ${zipf.toFixed(2)} | ${Math.log10(count + 1).toFixed(2)} | ${count} |`);
    expect(hover).toContain('2. `K AO1 F IY0`');

    // The quick fix changed only the misspelt key; every other line is byte-identical.
    const after = records.filter((x) => x[0] === 'LINE').map((x) => x.slice(2).join('\t'));
    expect(after.length).toBe(lines.length - (lines[lines.length - 1] === '' ? 1 : 0));
    after.forEach((l, i) => expect(l).toBe(i === fixLine ? lines[i].replace('@pacse', '@paces') : lines[i]));
  });
});
