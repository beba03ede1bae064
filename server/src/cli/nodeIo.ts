// The real file system (node/nodeFs.ts, shared with the language server) and streams behind CliIO.
import { nodeFs, readStdin } from '../node/nodeFs';
import type { CliIO } from './io';

export { nodeFs };

/**
 * Writes to standard output, which a reader may close early (`rungs lint | head -c 200`). The
 * write error arrives after the command has returned its exit code, so EPIPE just ends the output
 * quietly and the process exits with that code; any other write error is reported once, exit 2.
 * The listener is added on the first write only, so a command that owns stdout itself (the
 * language server) keeps its own handling.
 */
function stdoutWriter(): (text: string) => void {
  let listening = false;
  let closed = false;
  return (text) => {
    if (closed) return;
    if (!listening) {
      listening = true;
      process.stdout.on('error', (err: NodeJS.ErrnoException) => {
        closed = true;
        if (err.code === 'EPIPE') return;
        process.stderr.write(`rungs: cannot write to standard output (${err.code ?? err.message})\n`);
        process.exitCode = 2;
      });
    }
    process.stdout.write(text);
  };
}

export function nodeIo(argv: string[]): CliIO {
  return {
    argv,
    cwd: process.cwd(),
    fs: nodeFs,
    stdout: stdoutWriter(),
    stderr: (t) => process.stderr.write(t),
    readStdin,
    isTTY: Boolean(process.stdout.isTTY),
    env: process.env,
  };
}
