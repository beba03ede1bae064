// The editor's paced-delivery commands over the protocol: `rungs lsp --stdio` spawned, a script
// opened, and each command asked for a rung; the files must be those the CLI makes.
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { WebVTTParser } from 'webvtt-parser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ESPEAK, findOnPath } from '../../server/src/speech/espeak';
import { fileUri, LspTestClient } from '../helpers/lspClient';

const dir = mkdtempSync(join(tmpdir(), 'rungs-delivery-'));
const TEXT = '@title Delivery\n@paces 2 wps\n== Greetings\nHi there.\nThank you.\n== Requests\nPass the bread, please.\n';
const uri = fileUri(join(dir, 'walt.rungs'));
writeFileSync(join(dir, 'walt.rungs'), TEXT);
let c: LspTestClient;

interface Result { ok: boolean; path?: string; message: string }
const exec = (command: string, args: unknown[]) => c.request<Result>('workspace/executeCommand', { command, arguments: args });

beforeAll(async () => {
  c = new LspTestClient();
  await c.initialize(dir);
  await c.open(uri, TEXT);
  await c.diagnosticsFor(uri, 1);
});
afterAll(async () => {
  await c?.close();
});

describe('paced-delivery commands', () => {
  it('exports the cue track of the rung under the cursor beside the script', async () => {
    const r = await exec('rungs.server.exportCues', [uri, 4]);
    expect(r).toMatchObject({ ok: true, message: 'cue track of rung 1 "Greetings" at 2 wps written (2 items)' });
    expect(r.path).toBe(join(dir, 'walt.rung-1-greetings.vtt'));
    const vtt = new WebVTTParser().parse(readFileSync(r.path!, 'utf8'), 'metadata');
    expect(vtt.errors).toEqual([]);
    // 2 words at 2 wps = 1 s, a 2 s gap, then 1 s (computed).
    expect(vtt.cues.map((q) => [q.startTime, q.endTime])).toEqual([[0, 1], [3, 4]]);
  });

  it('writes the practice page; says why when there is no rung', async () => {
    const r = await exec('rungs.server.practicePage', [uri, 5]);
    expect(r.ok).toBe(true);
    expect(readFileSync(r.path!, 'utf8')).toContain('Content-Security-Policy');
    expect(await exec('rungs.server.exportCues', ['file:///nowhere.rungs', 1])).toMatchObject({ ok: false });
  });

  it.skipIf(!findOnPath(ESPEAK))('makes the model audio of a rung (espeak-ng present)', async () => {
    const r = await exec('rungs.server.makeAudio', [uri, 5]);
    expect(r.ok, r.message).toBe(true);
    expect(existsSync(r.path!)).toBe(true);
    expect(readdirSync(r.path!).filter((n) => n.endsWith('.wav'))).toHaveLength(2);
    expect(r.message).toMatch(/^model audio of rung 2 "Requests" at 2 wps: 2 WAV files; measured pace -?\d+\.\d % from the target/);
  });
});
