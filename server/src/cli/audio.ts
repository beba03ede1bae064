// `rungs audio FILE [--rung NAME|N] [--pace P] [--mode unison|echo] [--voice V] -o DIR`: model
// speech fitted to the timing plan, made locally with eSpeak NG (found on PATH), then measured.
import { mkdirSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { PlanMeasurement } from '../core/audio/onsets';
import { ESPEAK, ESPEAK_MISSING, findOnPath, validVoice } from '../speech/espeak';
import { makeModelAudio } from '../speech/makeAudio';
import { parseArgs } from './args';
import { EXIT_OK, EXIT_USAGE, UsageError, type CliIO } from './io';
import type { Command } from './main';
import { PLAN_FLAGS, PLAN_USAGE, readPlanInput } from './planInput';

/** "2.01 words/s against 2 (+0.5 %); word onsets 12 ms from the plan on average (largest 40 ms); 45 of 45 words found". */
export function describeMeasurement(m: PlanMeasurement): string {
  const diff = ((m.achievedWps / m.targetWps - 1) * 100).toFixed(1);
  return (
    `${m.achievedWps.toFixed(3)} words/s against ${m.targetWps.toFixed(3)} (${Number(diff) >= 0 ? '+' : ''}${diff} %); ` +
    `word onsets ${(m.meanOnsetError * 1000).toFixed(0)} ms from the plan on average (largest ${(m.maxOnsetError * 1000).toFixed(0)} ms); ` +
    `${m.matched} of ${m.words} words found`
  );
}

export const audioCommand: Command = {
  name: 'audio',
  summary: 'model speech at the plan\'s pace (WAV + WebVTT per rung and item; needs espeak-ng)',
  usage: [
    'Usage: rungs audio FILE [--rung NAME|N] [--pace P] [--mode unison|echo] [--voice V] -o DIR',
    '',
    ...PLAN_USAGE,
    '  --voice V      eSpeak NG voice (default en-us)',
    '  -o DIR         folder for the files (made if missing): one WAV and WebVTT per rung and per item',
    '',
    '  Speech is made on this machine by espeak-ng (apt-get install espeak-ng); nothing is sent anywhere.',
  ].join('\n'),
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { ...PLAN_FLAGS, voice: { value: true } });
    const out = args.flags.get('output');
    if (typeof out !== 'string') throw new UsageError('give the output folder with -o DIR');
    const voice = (args.flags.get('voice') as string | undefined) ?? 'en-us';
    if (!validVoice(voice)) throw new UsageError(`--voice "${voice}" is not an eSpeak NG voice name (e.g. en-us, en-gb)`);
    const program = findOnPath(ESPEAK, io.env ?? process.env);
    if (!program) {
      io.stderr(`rungs audio: ${ESPEAK_MISSING}\n`);
      return EXIT_USAGE;
    }
    const input = readPlanInput(io, args, 'audio');
    if (typeof input === 'number') return input;
    const outDir = resolve(io.cwd, out);
    mkdirSync(outDir, { recursive: true });
    const rungs = input.rung === null ? input.plan.rungs.map((r) => r.index) : [input.rung];
    let result: ReturnType<typeof makeModelAudio>;
    try {
      const writeBytes = (path: string, bytes: Uint8Array | string) => writeFileSync(path, bytes);
      result = makeModelAudio({ analysis: input.analysis, rungs, pace: input.pace, mode: input.mode, outDir, program, voice, writeBytes });
    } catch (err) {
      io.stderr(`rungs audio: ${err instanceof Error ? err.message : String(err)}\n`);
      return EXIT_USAGE;
    }
    const rungFiles = result.files.filter((f) => f.kind === 'rung').length;
    io.stdout(`wrote ${result.files.length} WAV files with their WebVTT to ${out} (${rungFiles} rung${rungFiles === 1 ? '' : 's'}, ${result.files.length - rungFiles} items)\n`);
    for (const r of result.rungs) io.stdout(`  ${r.name} at ${r.pace}: ${describeMeasurement(r.measurement)}\n`);
    if (result.rungs.length > 1) io.stdout(`  all: ${describeMeasurement(result.measurement)}\n`);
    return EXIT_OK;
  },
};
