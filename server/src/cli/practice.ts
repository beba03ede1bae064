// `rungs practice FILE [--rung NAME|N] [--pace P] [--mode unison|echo] [--audio] [-o page.html]`:
// one self-contained practice page for a session (model audio embedded with --audio).
import { resolve } from 'node:path';
import { CAUTION } from '../core/caution';
import { renderPracticePage } from '../practice/page';
import { ESPEAK, ESPEAK_MISSING, findOnPath } from '../speech/espeak';
import { audioPerItem } from '../speech/makeAudio';
import { parseArgs } from './args';
import { EXIT_OK, EXIT_USAGE, type CliIO } from './io';
import type { Command } from './main';
import { describePlan, PLAN_FLAGS, PLAN_USAGE, readPlanInput } from './planInput';

export const practiceCommand: Command = {
  name: 'practice',
  summary: 'a self-contained practice page for a session (HTML; words lit on the plan)',
  usage: [
    'Usage: rungs practice FILE [--rung NAME|N] [--pace P] [--mode unison|echo] [--audio] [-o page.html]',
    '',
    ...PLAN_USAGE,
    '  --audio        embed model speech made with espeak-ng (apt-get install espeak-ng)',
    '  -o FILE        where to write the page (default: standard output)',
  ].join('\n'),
  run(io: CliIO, argv: string[]): number {
    const args = parseArgs(argv, { ...PLAN_FLAGS, audio: {} });
    let program: string | null = null;
    if (args.flags.has('audio')) {
      program = findOnPath(ESPEAK, io.env ?? process.env);
      if (!program) {
        io.stderr(`rungs practice: ${ESPEAK_MISSING}\n`);
        return EXIT_USAGE;
      }
    }
    const input = readPlanInput(io, args, 'practice');
    if (typeof input === 'number') return input;
    const title = input.analysis.script.header.find((h) => h.key === 'title')?.value.trim() || input.shown;
    const html = renderPracticePage(input.plan, {
      title,
      subtitle: describePlan(input),
      caution: CAUTION,
      audio: program ? audioPerItem({ analysis: input.analysis, pace: input.pace, mode: input.mode, program, voice: 'en-us' }, input.plan) : undefined,
    });
    const out = args.flags.get('output');
    if (typeof out === 'string') {
      io.fs.writeFile(resolve(io.cwd, out), html);
      io.stderr(`rungs practice: wrote ${out} (${input.plan.items.length} items${program ? ', with model audio' : ''})\n`);
    } else io.stdout(html);
    return EXIT_OK;
  },
};
