// `rungs lsp [--stdio]`: the language server on standard input and output, for any LSP editor.
import type { Command } from './main';

export const lspCommand: Command = {
  name: 'lsp',
  summary: 'run the language server (stdio) for LSP editors',
  usage: [
    'Usage: rungs lsp [--stdio]',
    '',
    '  Speaks the Language Server Protocol on standard input and output (the default;',
    '  --stdio is accepted for editors that pass it). Logs go to the editor, never to stdout.',
  ].join('\n'),
  run(io) {
    // Loaded only for this command: in the bundle the server is its own file (dist/server.js),
    // so `rungs score` and `rungs lint` do not pay for parsing the protocol code at start-up.
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    const { startServer } = require('../lsp/server') as typeof import('../lsp/server');
    // A client may name its transport among the arguments (`rungs lsp --node-ipc`).
    startServer(io.argv);
    return null;
  },
};
