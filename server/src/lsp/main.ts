// Entry of the bundled language server (dist/server.js): `node dist/server.js --stdio` (or
// --node-ipc, as the VS Code client starts it). `rungs lsp` starts the same server.
import { startServer } from './server';

export { startServer };

if (require.main === module) startServer(process.argv);
