// The editor's paced-delivery commands: the cue track, the model audio and the practice page of
// one rung, written beside the script. The same core plan and renderers as `rungs cues`, `rungs
// audio` and `rungs practice`, so the editor and the command line give the same files.
import { writeFileSync, mkdirSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';
import { CAUTION } from '../core/caution';
import { renderVtt } from '../core/cues';
import { planSession } from '../core/timing';
import { renderPracticePage } from '../practice/page';
import { ESPEAK, ESPEAK_MISSING, findOnPath } from '../speech/espeak';
import { audioPerItem, makeModelAudio, slug } from '../speech/makeAudio';
import { EXPORT_CUES_COMMAND, MAKE_AUDIO_COMMAND, PRACTICE_PAGE_COMMAND, type DeliveryResult } from './contract';
import { uriToPath, type Snapshot } from './documents';

export const DELIVERY_COMMANDS = [EXPORT_CUES_COMMAND, MAKE_AUDIO_COMMAND, PRACTICE_PAGE_COMMAND];

const fail = (message: string): DeliveryResult => ({ ok: false, message });

export function runDelivery(command: string, s: Snapshot, line: number): DeliveryResult {
  const path = uriToPath(s.uri);
  if (!path) return fail('save the script to a file first: the files are written beside it');
  const rung = s.rungAtHeader(line) ?? s.rungContaining(line);
  if (!rung || !rung.items.length) return fail('put the cursor in a rung with items');
  const base = join(dirname(path), `${basename(path).replace(/\.rungs$/i, '')}.rung-${rung.index + 1}-${slug(rung.node.name)}`);
  const plan = planSession(s.analysis, { rung: rung.index });
  const what = `rung ${rung.index + 1} "${rung.node.name}" at ${plan.rungs[0].pace.label}`;
  if (command === EXPORT_CUES_COMMAND) {
    const file = `${base}.vtt`;
    writeFileSync(file, renderVtt(plan, `Rungs cue track: ${basename(path)}, ${what}, unison`));
    return { ok: true, path: file, message: `cue track of ${what} written (${plan.items.length} items)` };
  }
  const program = findOnPath(ESPEAK);
  const speech = { analysis: s.analysis, pace: null, mode: 'unison' as const, voice: 'en-us' };
  if (command === MAKE_AUDIO_COMMAND) {
    if (!program) return fail(ESPEAK_MISSING);
    const dir = `${base}.audio`;
    mkdirSync(dir, { recursive: true });
    const r = makeModelAudio({ ...speech, program, rungs: [rung.index], outDir: dir, writeBytes: (p, b) => writeFileSync(p, b) });
    const pct = ((r.measurement.achievedWps / r.measurement.targetWps - 1) * 100).toFixed(1);
    return { ok: true, path: dir, message: `model audio of ${what}: ${r.files.length} WAV files; measured pace ${pct} % from the target, onsets ${(r.measurement.meanOnsetError * 1000).toFixed(0)} ms from the plan on average` };
  }
  if (command === PRACTICE_PAGE_COMMAND) {
    // With eSpeak NG present the page carries the model audio; without it, the words alone.
    const items = program ? audioPerItem({ ...speech, program }, plan) : undefined;
    const title = s.analysis.script.header.find((h) => h.key === 'title')?.value.trim() || basename(path);
    const file = `${base}.practice.html`;
    writeFileSync(file, renderPracticePage(plan, { title, subtitle: `${what}, unison`, caution: CAUTION, audio: items }));
    return { ok: true, path: file, message: `practice page of ${what} written${items ? ' with model audio' : ''}` };
  }
  return fail(`unknown command ${command}`);
}
