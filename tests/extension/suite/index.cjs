// The extension-host suite: runs inside VS Code (started by tests/extension/run.mjs), with the
// sample scripts as the workspace. No test framework: each test is an async function, failures
// are collected, and run() rejects if any failed, which makes @vscode/test-electron exit non-zero.
const assert = require('node:assert/strict');
const path = require('node:path');
const vscode = require('vscode');

const EXTENSION_ID = 'rungs-project.rungs';
const ws = process.env.RUNGS_TEST_WORKSPACE;
const file = (name) => vscode.Uri.file(path.join(ws, name));

/** Resolves when `check()` is truthy, re-checking on every event of `events`; rejects after `ms`. */
function until(check, events, ms, what) {
  return new Promise((resolve, reject) => {
    const subs = [];
    const done = (err, v) => {
      clearTimeout(timer);
      subs.forEach((s) => s.dispose());
      err ? reject(err) : resolve(v);
    };
    const test = async () => {
      try {
        const v = await check();
        if (v) done(null, v);
      } catch (e) {
        done(e);
      }
    };
    const timer = setTimeout(() => done(new Error(`timed out after ${ms} ms waiting for ${what}`)), ms);
    for (const e of events) subs.push(e(test));
    void test();
  });
}

let api;
const tests = [
  ['opening a script activates the extension and starts the server', async () => {
    const doc = await vscode.workspace.openTextDocument(file('family-visits-draft.rungs'));
    assert.equal(doc.languageId, 'rungs');
    await vscode.window.showTextDocument(doc);
    const ext = vscode.extensions.getExtension(EXTENSION_ID);
    assert.ok(ext, `${EXTENSION_ID} is installed`);
    api = await ext.activate();
    assert.ok(ext.isActive);
    assert.ok(api.getClient()?.isRunning(), 'the language client is running');
  }],
  ['the server publishes the planted unknown-key problem', async () => {
    const uri = file('family-visits-draft.rungs');
    const d = await until(
      () => vscode.languages.getDiagnostics(uri).find((x) => String(x.code?.value ?? x.code) === 'unknown-key'),
      [vscode.languages.onDidChangeDiagnostics], 30_000, 'unknown-key diagnostics');
    assert.match(d.message, /did you mean "@paces"/);
  }],
  ['every command is registered', async () => {
    const all = await vscode.commands.getCommands(true);
    for (const c of ['rungs.showLadder', 'rungs.sortCurrentRung', 'rungs.checkWorkspace', 'rungs.restartServer']) {
      assert.ok(all.includes(c), c);
    }
  }],
  ['the ladder view opens beside the editor', async () => {
    await vscode.commands.executeCommand('rungs.showLadder');
    await until(
      () => vscode.window.tabGroups.all.some((g) => g.tabs.some((t) => t.input instanceof vscode.TabInputWebview && /rungs\.ladder/.test(t.input.viewType))),
      [vscode.window.tabGroups.onDidChangeTabs], 15_000, 'the ladder tab');
  }],
  ['scoring the workspace reports problems of scripts that are not open', async () => {
    const n = await vscode.commands.executeCommand('rungs.checkWorkspace');
    const files = await vscode.workspace.findFiles('**/*.rungs');
    assert.equal(n, files.length);
    for (const f of files) {
      const open = vscode.window.visibleTextEditors.some((e) => e.document.uri.toString() === f.toString());
      if (!open && f.path.endsWith('family-visits-draft.rungs')) assert.ok(vscode.languages.getDiagnostics(f).length > 0);
    }
  }],
  ['a setting change reaches the server without a reload', async () => {
    const doc = await vscode.workspace.openTextDocument({ language: 'rungs', content: '== A\nHi.\nYes.\n\n== B\nThe cat sat on the mat in the hall today.\n' });
    const client = api.getClient();
    const ladder = () => client.sendRequest('rungs/ladder', { uri: doc.uri.toString() });
    assert.equal((await until(ladder, [], 15_000, 'a ladder')).maxStep, 15);
    const config = vscode.workspace.getConfiguration('rungs');
    await config.update('maxStep', 31, vscode.ConfigurationTarget.Workspace);
    try {
      assert.equal(vscode.workspace.getConfiguration('rungs').get('maxStep'), 31);
      // Re-ask on every analysis the server reports until the new value shows.
      let last;
      await until(async () => ((last = await ladder()).maxStep === 31), [vscode.workspace.onDidChangeConfiguration,
        (f) => client.onNotification('rungs/didAnalyze', f)], 15_000, 'maxStep 31 in the ladder');
    } finally {
      await config.update('maxStep', undefined, vscode.ConfigurationTarget.Workspace);
    }
  }],
  ['the server restarts', async () => {
    await vscode.commands.executeCommand('rungs.restartServer');
    assert.ok(api.getClient()?.isRunning());
  }],
];

async function run() {
  const failed = [];
  for (const [name, fn] of tests) {
    const t0 = Date.now();
    try {
      await fn();
      console.log(`  ok   ${name} (${Date.now() - t0} ms)`);
    } catch (e) {
      failed.push(name);
      console.log(`  FAIL ${name}: ${e && e.stack ? e.stack : e}`);
    }
  }
  console.log(`${tests.length - failed.length} passed, ${failed.length} failed`);
  if (failed.length) throw new Error(`${failed.length} extension-host test(s) failed`);
}

module.exports = { run };
