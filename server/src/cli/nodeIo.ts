// The real file system and streams behind CliIO.
import * as fs from 'node:fs';
import { writeFileAtomic } from '../node/atomicWrite';
import { isRegularFile, readBytesBounded, readStdinBounded, readTextBounded, readTextPrefix, realPath } from '../node/boundedRead';
import type { CliFs, CliIO } from './io';

export const nodeFs: CliFs = {
  readFile: (p) => readTextBounded(p),
  writeFile: (p, text) => fs.writeFileSync(p, text),
  isDirectory: (p) => {
    try {
      return fs.statSync(p).isDirectory();
    } catch {
      return false;
    }
  },
  exists: (p) => fs.existsSync(p),
  readdir: (p) => fs.readdirSync(p),
  isFile: isRegularFile,
  realpath: realPath,
  readBytes: (p) => readBytesBounded(p),
  readPrefix: (p) => readTextPrefix(p),
  writeBytes: writeFileAtomic,
};

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
    readStdin: () => readStdinBounded(),
    isTTY: Boolean(process.stdout.isTTY),
    env: process.env,
  };
}
