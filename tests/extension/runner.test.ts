// The extension-host runner (npm run test:extension) must say plainly when it cannot run, rather
// than pass silently. This checks that report with a VS Code path that does not exist; the suite
// itself runs only through `npm run test:extension`, where a VS Code build can be had.
import { spawnSync } from 'node:child_process';
import { join } from 'node:path';
import { expect, it } from 'vitest';

const root = join(__dirname, '..', '..');

it('reports a skip clearly when no VS Code build is available', () => {
  const r = spawnSync(process.execPath, [join(root, 'tests', 'extension', 'run.mjs')], {
    cwd: root,
    encoding: 'utf8',
    env: { ...process.env, RUNGS_VSCODE_PATH: join(root, '.cache', 'no-such-vscode') },
  });
  expect(r.status).toBe(0);
  expect(r.stdout).toMatch(/^SKIPPED: no VS Code build available \(RUNGS_VSCODE_PATH=.* does not exist\)/);
});
