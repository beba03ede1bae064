// The server's connection and process: the transport named in the arguments (stdio otherwise),
// console output redirected into the protocol's log (stdout carries the protocol), uncaught errors
// logged, and the word tables loaded (every word estimated, with a logged error, when they cannot be).
import {
  createConnection,
  ProposedFeatures,
  StreamMessageWriter,
  type Connection,
  type MessageReader,
} from 'vscode-languageserver/node';
import type { WordData } from '../core/types';
import { loadWordTable } from '../data/wordTable';
import { transportNamed } from '../node/nodeFs';
import { messageEncoder } from './diagnostics';

export function openConnection(argv: readonly string[]): Connection {
  // Over standard input and output (named or by default) the writer sends published diagnostics
  // as JSON it has written before (lsp/diagnostics.ts). Standard input is handed over as a stream,
  // so the server still exits when it closes.
  const stdio = argv.includes('--stdio') || !transportNamed(argv);
  const connection = stdio
    ? createConnection(
        ProposedFeatures.all,
        // The library reads a stream as well as a reader (and only then exits on its end); its
        // types name the two forms apart.
        process.stdin as unknown as MessageReader,
        new StreamMessageWriter(process.stdout, { charset: 'utf-8', contentTypeEncoder: messageEncoder }),
      )
    : createConnection(ProposedFeatures.all);
  // Anything that still calls console.* must not write into the protocol stream.
  console.log = (...a: unknown[]) => connection.console.log(a.map(String).join(' '));
  console.info = (...a: unknown[]) => connection.console.info(a.map(String).join(' '));
  console.warn = (...a: unknown[]) => connection.console.warn(a.map(String).join(' '));
  console.error = (...a: unknown[]) => connection.console.error(a.map(String).join(' '));
  // The library patches these too when it opens standard I/O itself; here it is handed the streams.
  console.debug = console.log;
  console.trace = console.error;
  process.on('uncaughtException', (e) => connection.console.error(`uncaught: ${e.stack ?? e.message}`));
  process.on('unhandledRejection', (e) => connection.console.error(`unhandled rejection: ${String(e)}`));
  return connection;
}

export function loadWordData(connection: Connection): WordData {
  try {
    return loadWordTable();
  } catch (err) {
    setImmediate(() =>
      connection.console.error(`word tables not loaded (${err instanceof Error ? err.message : String(err)}); every word is estimated`),
    );
    return { pronunciations: () => undefined, count: () => 0 };
  }
}

/** A message for the log from anything thrown. */
export const describeError = (err: unknown): string => (err instanceof Error ? err.stack ?? err.message : String(err));
