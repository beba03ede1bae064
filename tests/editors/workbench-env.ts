// Where the real-workbench tests find code-server and Chromium, and whether they skip: when either
// is missing they skip with the reason, unless RUNGS_REQUIRE_EDITORS=1 (set by .ci/run).
import { existsSync } from 'node:fs';
import { join } from 'node:path';

export const root = join(__dirname, '..', '..');
export const codeServer = process.env.RUNGS_CODE_SERVER ?? join(root, '.cache', 'code-server', 'node_modules', '.bin', 'code-server');
export const chromiumBin = process.env.RUNGS_CHROMIUM ?? '/usr/bin/chromium';
export const required = process.env.RUNGS_REQUIRE_EDITORS === '1';
export const missing = [
  existsSync(codeServer) ? null : `code-server (${codeServer}; run tests/editors/install-code-server.sh)`,
  existsSync(chromiumBin) ? null : `chromium (${chromiumBin}; apt-get install chromium)`,
].filter((m): m is string => m !== null);
export const skip = missing.length > 0 && !required;
