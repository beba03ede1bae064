// The language-server half of `npm run bench`: spawns `rungs lsp --stdio`, speaks JSON-RPC to it
// as an editor would, and times what a person waits for: opening a script until its diagnostics
// arrive, a random one-line edit until diagnostics for exactly that version arrive, and the read
// requests (hover, inlay hints, code lens, completion). Also the server's resident memory.
import { spawn } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { createProtocolConnection, StreamMessageReader, StreamMessageWriter } from 'vscode-languageserver-protocol/node';
import { scriptEdits } from './generate.mjs';

/** p-th percentile (0-100) by the nearest-rank method. */
export function percentile(xs, p) {
  if (!xs.length) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
}

/** Resident set size of a process in MB (Linux /proc), or NaN elsewhere. */
export function rssMb(pid) {
  try {
    const m = /VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'));
    return m ? Number(m[1]) / 1024 : NaN;
  } catch {
    return NaN;
  }
}

/**
 * CPU time a process has used so far in ms (Linux /proc: user + system clock ticks, at the usual
 * 100 a second), or NaN elsewhere. Less swayed than wall time by other jobs on a busy machine.
 */
export function cpuMs(pid) {
  try {
    const fields = readFileSync(`/proc/${pid}/stat`, 'utf8').replace(/^.*\) /, '').split(' ');
    return (Number(fields[11]) + Number(fields[12])) * 10;
  } catch {
    return NaN;
  }
}

class Client {
  constructor(root) {
    // BENCH_PROFILE=DIR writes a CPU profile of each server to DIR (open it in a profiler).
    const prof = process.env.BENCH_PROFILE ? ['--cpu-prof', `--cpu-prof-dir=${process.env.BENCH_PROFILE}`] : [];
    this.proc = spawn(process.execPath, [...prof, join(root, 'server/bin/rungs.js'), 'lsp', '--stdio'], { stdio: ['pipe', 'pipe', 'inherit'] });
    this.conn = createProtocolConnection(new StreamMessageReader(this.proc.stdout), new StreamMessageWriter(this.proc.stdin));
    this.versions = new Map();
    this.waiters = [];
    this.conn.onNotification('textDocument/publishDiagnostics', (p) => {
      if (p.version !== undefined) this.versions.set(p.uri, p.version);
      this.waiters = this.waiters.filter((w) => !(w.uri === p.uri && p.version === w.version && (w.resolve(), true)));
    });
    this.conn.onNotification('window/logMessage', () => undefined);
    this.conn.onNotification('rungs/didAnalyze', () => undefined);
    this.conn.onRequest('workspace/configuration', (p) => p.items.map(() => null));
    this.conn.onRequest('client/registerCapability', () => null);
    this.conn.listen();
  }
  diagnostics(uri, version) {
    if (this.versions.get(uri) === version) return Promise.resolve();
    return new Promise((resolve) => this.waiters.push({ uri, version, resolve }));
  }
  async initialize(root) {
    await this.conn.sendRequest('initialize', {
      processId: process.pid,
      rootUri: pathToFileURL(root).href,
      capabilities: { textDocument: { publishDiagnostics: { versionSupport: true } } },
    });
    await this.conn.sendNotification('initialized', {});
  }
  async close() {
    await this.conn.sendRequest('shutdown');
    await this.conn.sendNotification('exit');
    await new Promise((r) => (this.proc.exitCode !== null ? r() : this.proc.on('exit', r)));
    this.conn.dispose();
  }
}

async function timed(fn) {
  const t = performance.now();
  await fn();
  return performance.now() - t;
}

/**
 * Opens a generated script of `items` items and measures. `edits` random one-line edits (insert or
 * delete a character inside an item, seeded) each wait for that version's diagnostics before the
 * next, so every figure is the full cost of one keystroke as the editor sees it. Then `reads`
 * rounds of read requests on the last version, and `afterEdits` more edits, each followed by one
 * code lens and one inlay hint request on the new version, and as many again, each followed by
 * a request that needs no work (the round trip's own cost, the baseline for the two).
 */
export async function measureLsp(root, dir, text, { edits = 40, reads = 60, afterEdits = 20, seed = 7 } = {}) {
  const c = new Client(root);
  await c.initialize(root);
  const uri = pathToFileURL(join(dir, `lsp-${text.length}.rungs`)).href;
  let version = 1;
  const openMs = await timed(async () => {
    await c.conn.sendNotification('textDocument/didOpen', { textDocument: { uri, languageId: 'rungs', version, text } });
    await c.diagnostics(uri, version);
  });
  const rssAfterOpen = rssMb(c.proc.pid);
  const { items, pickLine, edit: nextEdit } = scriptEdits(text, seed);
  const editMs = [];
  const cpuBefore = cpuMs(c.proc.pid);
  // One random one-line edit, sent, until that version's diagnostics arrive.
  const edit = async (i) => {
    const change = nextEdit(i);
    version++;
    const v = version;
    await c.conn.sendNotification('textDocument/didChange', { textDocument: { uri, version: v }, contentChanges: [change] });
    await c.diagnostics(uri, v);
  };
  for (let i = 0; i < edits; i++) editMs.push(await timed(() => edit(i)));
  const editCpuMs = (cpuMs(c.proc.pid) - cpuBefore) / Math.max(1, edits);
  const td = { uri };
  const hoverMs = [];
  const inlayMs = [];
  const lensMs = [];
  const completionMs = [];
  for (let i = 0; i < reads; i++) {
    const line = pickLine();
    hoverMs.push(await timed(() => c.conn.sendRequest('textDocument/hover', { textDocument: td, position: { line, character: 3 } })));
    // A screenful of hints around the line, as an editor asks for the visible range.
    const range = { start: { line: Math.max(0, line - 25), character: 0 }, end: { line: line + 25, character: 0 } };
    inlayMs.push(await timed(() => c.conn.sendRequest('textDocument/inlayHint', { textDocument: td, range })));
    lensMs.push(await timed(() => c.conn.sendRequest('textDocument/codeLens', { textDocument: td })));
    completionMs.push(await timed(() => c.conn.sendRequest('textDocument/completion', { textDocument: td, position: { line: 2, character: 1 } })));
  }
  const rss = rssMb(c.proc.pid);
  // What an editor asks for after each keystroke, once per new version: the code lens and the
  // visible range's inlay hints (the reads above repeat requests on one version, which the
  // server answers from what it worked out for that version).
  const lensAfterEditMs = [];
  const inlayAfterEditMs = [];
  for (let i = 0; i < afterEdits; i++) {
    await edit(edits + i);
    lensAfterEditMs.push(await timed(() => c.conn.sendRequest('textDocument/codeLens', { textDocument: td })));
    const line = pickLine();
    const range = { start: { line: Math.max(0, line - 25), character: 0 }, end: { line: line + 25, character: 0 } };
    inlayAfterEditMs.push(await timed(() => c.conn.sendRequest('textDocument/inlayHint', { textDocument: td, range })));
  }
  // The baseline for those two: the same edits, each followed by a request the server answers
  // with no work at all (code lens of a document that is not open). What it takes is the round
  // trip itself right after a publish: both processes' event loops, message coding and collectors.
  const emptyAfterEditMs = [];
  const notOpen = { uri: `${uri}.not-open` };
  for (let i = 0; i < afterEdits; i++) {
    await edit(edits + afterEdits + i);
    emptyAfterEditMs.push(await timed(() => c.conn.sendRequest('textDocument/codeLens', { textDocument: notOpen })));
  }
  await c.close();
  const stat = (xs) => ({ p50: percentile(xs, 50), p95: percentile(xs, 95) });
  return {
    items,
    openMs,
    edit: { ...stat(editMs), cpuMs: editCpuMs, times: editMs },
    hover: stat(hoverMs),
    inlay: stat(inlayMs),
    codeLens: stat(lensMs),
    completion: stat(completionMs),
    afterEdit: { codeLens: stat(lensAfterEditMs), inlay: stat(inlayAfterEditMs), empty: stat(emptyAfterEditMs) },
    rssMb: Math.max(rss, rssAfterOpen),
  };
}
