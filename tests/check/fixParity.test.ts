// The editor's fix-all and `rungs lint --fix` must make exactly the same change: both take their
// edits from rules/fixes.ts. Checked on a script with several batch fixes (and quick-fix-only
// ones beside them), and on hand-made fixes whose edits touch each other.
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { describe, expect, it } from 'vitest';
import type { CodeActionParams } from 'vscode-languageserver-protocol';
import { TextDocument } from 'vscode-languageserver-textdocument';
import { main } from '../../server/src/cli/main';
import type { Problem } from '../../server/src/core/types';
import { codeActions, FIX_ALL_KIND } from '../../server/src/lsp/codeActions';
import { AnalysisStore } from '../../server/src/lsp/documents';
import { applyFixes, batchEdits, batchFixes } from '../../server/src/rules/fixes';
import { words } from '../helpers/data';
import { applyTextEdits, editsFor } from '../helpers/lspClient';
import { MemFs } from '../cli/memfs';
import { SEVERAL_FIXES } from '../rules/check';

// An empty temporary folder: no config file above the script changes what is checked.
const dir = mkdtempSync(join(tmpdir(), 'rungs-fix-'));
const uri = pathToFileURL(join(dir, 'several.rungs')).href;
const store = new AnalysisStore(words, { log: () => undefined, error: () => undefined, analyzed: () => undefined });
const fixAllParams: CodeActionParams = {
  textDocument: { uri },
  range: { start: { line: 0, character: 0 }, end: { line: 0, character: 0 } },
  context: { diagnostics: [], only: [FIX_ALL_KIND] },
};

let version = 0;
function editorFixAll(text: string, problems?: Problem[]): string {
  const snap = store.get(TextDocument.create(uri, 'rungs', ++version, text));
  const actions = codeActions(problems ? { ...snap, problems } : snap, fixAllParams).filter((a) => a.kind === FIX_ALL_KIND);
  return actions.length ? applyTextEdits(text, editsFor(actions[0].edit!, uri)) : text;
}

async function cliFix(text: string): Promise<string> {
  const fs = new MemFs({ 'several.rungs': text });
  const code = await main({ argv: ['lint', '--fix', '--format', 'json', 'several.rungs'], cwd: '/clinic', fs, stdout: () => undefined, stderr: () => undefined });
  expect(code).not.toBe(2);
  return fs.files.get('/clinic/several.rungs')!;
}

describe('fix-all and --fix make the same change', () => {
  // unknown-key, bad-directive and unsorted-rung fixes (one pass applies them all), beside a
  // duplicate item and an estimated word whose fixes are quick fixes only.
  const TEXT = SEVERAL_FIXES;

  it('on a script with three batch fixes', async () => {
    const editor = editorFixAll(TEXT);
    expect(editor).not.toBe(TEXT);
    // The three fixes really were applied (hand-checked: key renamed, directive id corrected).
    expect(editor.split('\n')[3]).toBe('@paces 1, 1.5 wps');
    expect(editor.split('\n')[1]).toBe('// rungs: allow-file item-outlier');
    expect(await cliFix(TEXT)).toBe(editor);
  });

  it('with CRLF line endings', async () => {
    const crlf = TEXT.replace(/\n/g, '\r\n');
    expect(await cliFix(crlf)).toBe(editorFixAll(crlf));
  });

  it('on fixes whose edits touch: both take the same ones, in the same order', () => {
    const text = 'abcdefgh\n';
    const at = (character: number, endCharacter: number) => ({ line: 0, character, endLine: 0, endCharacter });
    const fix = (title: string, character: number, endCharacter: number, newText: string): Problem => ({
      ...at(character, endCharacter),
      rule: 'unknown-key',
      severity: 'error',
      message: title,
      fix: { title, edits: [{ ...at(character, endCharacter), newText }] },
    });
    const problems = [
      fix('replace abc', 0, 3, 'X'),
      fix('insert at d', 3, 3, 'Y'),
      fix('replace def', 3, 6, 'Z'),
      fix('replace gh', 6, 8, 'W'),
      fix('a second insert at d', 3, 3, 'V'),
    ];
    // computed: abc -> X, then Y inserted before the replaced def (Z), then gh -> W; the second
    // insertion at the same point is left for a later pass (its order would be a guess).
    const cli = applyFixes(text, batchFixes(problems));
    expect(cli).toEqual({ text: 'XYZW\n', applied: 4, skipped: 1 });
    expect(editorFixAll(text, problems)).toBe(cli.text);
    expect(batchEdits(text, problems).map((e) => e.newText)).toEqual(['X', 'Y', 'Z', 'W']);
  });
});
