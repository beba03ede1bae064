// `rungs cues FILE [--rung NAME|N] [--pace P] [--mode unison|echo] [--format vtt|srt|csv] [-o OUT]`:
// the word-timed cue track of a session plan.
import { resolve } from 'node:path';
import { renderSrt, renderVtt, renderWordCsv } from '../core/cues';
import { parseArgs } from './args';
import { EXIT_OK, type CliIO } from './io';
import type { Command } from './main';
import { describePlan, PLAN_FLAGS, PLAN_USAGE, readPlanInput } from './planInput';

export const cuesCommand: Command = {
  name: 'cues',
  summary: 'word-timed cue track of a session (WebVTT, SRT or CSV)',
  usage: [
    'Usage: rungs cues FILE [--rung NAME|N] [--pace P] [--mode unison|echo] [--format vtt|srt|csv] [-o OUT]',
    '',
    ...PLAN_USAGE,
    '  --format F     vtt (default: WebVTT, a timestamp before each word), srt, or csv (every word\'s start and end)',
    '  -o OUT         write to a file instead of standard output',
  ].join('\n'),
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { ...PLAN_FLAGS, format: { value: true, choices: ['vtt', 'srt', 'csv'], alias: 'f' } });
    const input = readPlanInput(io, args, 'cues');
    if (typeof input === 'number') return input;
    const format = (args.flags.get('format') as string | undefined) ?? 'vtt';
    const text =
      format === 'srt' ? renderSrt(input.plan) : format === 'csv' ? renderWordCsv(input.plan) : renderVtt(input.plan, `Rungs cue track: ${describePlan(input)}`);
    const out = args.flags.get('output');
    if (typeof out === 'string') {
      io.fs.writeFile(resolve(io.cwd, out), text);
      io.stderr(`rungs cues: wrote ${out} (${input.plan.items.length} items, ${input.plan.seconds.toFixed(1)} s)\n`);
    } else io.stdout(text);
    return EXIT_OK;
  },
};
