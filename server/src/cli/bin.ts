// Entry of the bundled CLI (dist/rungs.js); server/bin/rungs.js calls run().
import { main } from './main';
import { nodeIo } from './nodeIo';

export function run(): void {
  const argv = process.argv.slice(2);
  // The language server keeps the process alive itself and must own stdout.
  Promise.resolve(main(nodeIo(argv))).then(
    (code) => {
      if (code !== null) process.exitCode = code;
    },
    (err: unknown) => {
      process.stderr.write(`rungs: internal error: ${err instanceof Error ? err.stack ?? err.message : String(err)}\n`);
      process.exitCode = 2;
    },
  );
}
