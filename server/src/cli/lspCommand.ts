// `rungs lsp [--stdio]`: the language server on standard input and output, for any LSP editor.
import { startServer } from '../lsp/server';
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
  run() {
    startServer();
    return null;
  },
};
