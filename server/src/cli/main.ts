// `rungs <command> ...`: dispatches to one command and returns the exit code
// (0 clean, 1 problems at error level, 2 usage error or unreadable input). A command that keeps
// running on its own (the language server) returns null.
import { EXIT_USAGE, UsageError, type CliIO } from './io';
import { lintCommand } from './lint';
import { scoreCommand } from './score';
import { setsCommand } from './sets';
import { lspCommand } from './lspCommand';
import { progressCommand } from './progress';
import { cuesCommand } from './cues';
import { audioCommand } from './audio';
import { practiceCommand } from './practice';
import { VERSION } from '../version';
import { pronounceCommand } from './pronounce';
import { reportCommand } from './report';

export interface Command {
  name: string;
  summary: string;
  usage: string;
  run(io: CliIO, args: string[]): number | null | Promise<number | null>;
}

export { VERSION } from '../version';

export const COMMANDS: Command[] = [scoreCommand, lintCommand, setsCommand, progressCommand, cuesCommand, audioCommand, practiceCommand, pronounceCommand, reportCommand, lspCommand];

function help(): string {
  const lines = ['Usage: rungs <command> [options]', '', 'Commands:'];
  for (const c of COMMANDS) lines.push(`  ${c.name.padEnd(10)} ${c.summary}`);
  lines.push('', 'Run `rungs <command> --help` for a command\'s options.');
  return `${lines.join('\n')}\n`;
}

export async function main(io: CliIO): Promise<number | null> {
  const [name, ...rest] = io.argv;
  if (!name || name === '--help' || name === '-h' || name === 'help') {
    io.stdout(help());
    return name ? 0 : EXIT_USAGE;
  }
  if (name === '--version' || name === '-v') {
    io.stdout(`${VERSION}\n`);
    return 0;
  }
  const command = COMMANDS.find((c) => c.name === name);
  if (!command) {
    io.stderr(`rungs: unknown command "${name}"\n${help()}`);
    return EXIT_USAGE;
  }
  if (rest.includes('--help') || rest.includes('-h')) {
    io.stdout(`${command.usage}\n`);
    return 0;
  }
  try {
    return await command.run(io, rest);
  } catch (err) {
    if (err instanceof UsageError) {
      io.stderr(`rungs ${name}: ${err.message}\n${command.usage}\n`);
      return EXIT_USAGE;
    }
    throw err;
  }
}
