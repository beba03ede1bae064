// The real file system and streams behind CliIO.
import * as fs from 'node:fs';
import type { CliFs, CliIO } from './io';

export const nodeFs: CliFs = {
  readFile: (p) => fs.readFileSync(p, 'utf8'),
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
};

export function nodeIo(argv: string[]): CliIO {
  return {
    argv,
    cwd: process.cwd(),
    fs: nodeFs,
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    readStdin: () => fs.readFileSync(0, 'utf8'),
    isTTY: Boolean(process.stdout.isTTY),
    env: process.env,
  };
}
