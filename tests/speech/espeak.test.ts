// Real model speech: runs Debian's espeak-ng on a few items, reads the WAV files back with
// wavefile, and checks the measured pace and word onsets against the plan (the goals:
// within 3 % of the pace, onsets within 50 ms on average). Skips when espeak-ng is missing, unless
// RUNGS_REQUIRE_EDITORS=1 (as .ci/run sets).
import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { WebVTTParser } from 'webvtt-parser';
import { afterAll, describe, expect, it } from 'vitest';
import type { CliIO } from '../../server/src/cli/io';
import { main } from '../../server/src/cli/main';
import { nodeFs } from '../../server/src/cli/nodeIo';
import { detectSegments, measureAgainstPlan } from '../../server/src/core/audio/onsets';
import { makePace } from '../../server/src/core/pace';
import { planSession } from '../../server/src/core/timing';
import { decodeWav, ESPEAK, ESPEAK_MISSING, findOnPath } from '../../server/src/speech/espeak';
import { analyzeText } from '../helpers/data';

const program = findOnPath(ESPEAK);
const required = process.env.RUNGS_REQUIRE_EDITORS === '1';
if (!program && !required) console.warn('tests/speech/espeak.test.ts: skipped, espeak-ng is not installed (apt-get install espeak-ng)');

const dir = mkdtempSync(join(tmpdir(), 'rungs-audio-test-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const SCRIPT = '@title Audio check\n@paces 1, 2 wps\n== Requests\nPass the bread, please.\nI want some tea.\nSee you soon. | #soon\n';

async function run(argv: string[], env: Record<string, string | undefined> = process.env) {
  let out = '';
  let err = '';
  const code = await main({ argv, cwd: dir, fs: nodeFs, stdout: (t) => (out += t), stderr: (t) => (err += t), env });
  return { code, out, err };
}

describe('rungs audio without espeak-ng', () => {
  it('says exactly what to install and exits 2', async () => {
    nodeFs.writeFile(join(dir, 'a.rungs'), SCRIPT);
    const r = await run(['audio', 'a.rungs', '-o', 'none'], { PATH: '' });
    expect(r.code).toBe(2);
    expect(r.err).toBe(`rungs audio: ${ESPEAK_MISSING}\n`);
    expect(ESPEAK_MISSING).toContain('apt-get install espeak-ng');
  });
});

describe.skipIf(!program && !required)('rungs practice --audio with the real espeak-ng', () => {
  it('embeds one WAV per item as data: audio, allowed by the page policy', async () => {
    if (!program) throw new Error('RUNGS_REQUIRE_EDITORS=1 but espeak-ng is not installed (apt-get install espeak-ng)');
    nodeFs.writeFile(join(dir, 'p.rungs'), SCRIPT);
    const r = await run(['practice', 'p.rungs', '--rung', 'Requests', '--pace', '2', '--audio', '-o', 'p.html']);
    expect(r.code, r.err).toBe(0);
    const html = readFileSync(join(dir, 'p.html'), 'utf8');
    expect(html.match(/data:audio\/wav;base64,UklGR/g)).toHaveLength(3); // "RIFF" in base64
    expect(html).toContain('media-src data:');
  });
});

describe('rungs practice --audio without espeak-ng', () => {
  it('says exactly what to install and exits 2', async () => {
    nodeFs.writeFile(join(dir, 'p.rungs'), SCRIPT);
    const r = await run(['practice', 'p.rungs', '--audio'], { PATH: '' });
    expect(r.code).toBe(2);
    expect(r.err).toBe(`rungs practice: ${ESPEAK_MISSING}\n`);
  });
});

describe.skipIf(!program && !required)('rungs audio with the real espeak-ng', () => {
  for (const pace of ['1', '2']) {
    it(`follows the plan at ${pace} wps: pace within 3 %, onsets within 50 ms`, async () => {
      if (!program) throw new Error('RUNGS_REQUIRE_EDITORS=1 but espeak-ng is not installed (apt-get install espeak-ng)');
      nodeFs.writeFile(join(dir, 's.rungs'), SCRIPT);
      const out = join(dir, `out-${pace}`);
      const r = await run(['audio', 's.rungs', '--rung', '1', '--pace', pace, '-o', out]);
      expect(r.code, r.err).toBe(0);
      const names = readdirSync(out).sort();
      // One WAV + WebVTT for the rung and for each of its 3 items.
      expect(names.filter((n) => n.endsWith('.wav'))).toHaveLength(4);
      expect(names.filter((n) => n.endsWith('.vtt'))).toHaveLength(4);
      expect(names).toContain('rung-1-requests-03-soon.wav');
      // Measure the rung file here, independently of the command's own report.
      const plan = planSession(analyzeText(SCRIPT), { rung: 0, pace: makePace(Number(pace), 'wps') });
      const { samples, sampleRate } = decodeWav(readFileSync(join(out, 'rung-1-requests.wav')));
      expect(sampleRate).toBe(22050); // espeak-ng writes 22.05 kHz mono (measured here)
      expect(samples.length / sampleRate).toBeCloseTo(plan.seconds + 0.5, 2);
      const m = measureAgainstPlan(plan, detectSegments(samples, sampleRate));
      expect(m.matched).toBe(m.words);
      expect(Math.abs(m.achievedWps / Number(pace) - 1)).toBeLessThanOrEqual(0.03);
      expect(m.meanOnsetError).toBeLessThanOrEqual(0.05);
      // The WebVTT beside the audio passes the W3C parser and starts each cue on the plan.
      const vtt = new WebVTTParser().parse(readFileSync(join(out, 'rung-1-requests.vtt'), 'utf8'), 'metadata');
      expect(vtt.errors).toEqual([]);
      expect(vtt.cues.map((c) => c.startTime)).toEqual(plan.items.map((i) => Number(i.start.toFixed(3))));
      expect(r.out).toMatch(/^wrote 4 WAV files with their WebVTT/);
    });
  }
});
