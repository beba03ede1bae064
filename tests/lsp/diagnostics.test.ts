// Publishing converts each problem once and writes each diagnostic's JSON once
// (server/src/lsp/diagnostics.ts). The bytes sent must be what the protocol library would send:
// JSON.stringify of the message (ECMA-404 JSON, UTF-8), byte for byte.
import { fc, it as fcIt } from '@fast-check/vitest';
import { describe, expect, it } from 'vitest';
import type { Problem } from '../../server/src/core/types';
import { toLspDiagnostic } from '../../server/src/lsp/convert';
import { diagnosticsOf, messageBytes } from '../../server/src/lsp/diagnostics';

const problem = (message: string, line = 2): Problem => ({
  line,
  character: 0,
  endLine: line,
  endCharacter: 4,
  rule: 'duplicate-item',
  severity: 'warning',
  message,
  unnecessary: true,
  related: [{ line: 0, character: 0, endLine: 0, endCharacter: 4, message: 'first written here' }],
});

describe('published diagnostics', () => {
  it('are converted once per problem and URI', () => {
    const p = problem('"Come in…" repeats line 1 ± 2 × ≈');
    const [a] = diagnosticsOf([p], 'file:///w/a.rungs');
    expect(diagnosticsOf([p], 'file:///w/a.rungs')[0]).toBe(a);
    expect(a).toEqual(toLspDiagnostic(p, 'file:///w/a.rungs'));
    // Related places point into the document, so another URI is another diagnostic.
    const [b] = diagnosticsOf([p], 'file:///w/b.rungs');
    expect(b).not.toBe(a);
    expect(b.relatedInformation![0].location.uri).toBe('file:///w/b.rungs');
  });

  it('are written byte for byte as JSON.stringify writes the message, written parts reused or not', () => {
    const ds = diagnosticsOf([problem('naïve “quotes” \u2028 and \\ "escapes"', 1), problem('second', 3)], 'file:///w/a.rungs');
    for (const params of [
      { uri: 'file:///w/a.rungs', version: 7, diagnostics: ds },
      { uri: 'file:///w/a.rungs', diagnostics: ds },
      { uri: 'file:///w/a.rungs', version: 8, diagnostics: [] },
    ]) {
      const msg = { jsonrpc: '2.0', method: 'textDocument/publishDiagnostics', params };
      const expected = Buffer.from(JSON.stringify(msg), 'utf-8');
      expect(messageBytes(msg as never).equals(expected)).toBe(true);
      expect(messageBytes(msg as never).equals(expected)).toBe(true);
    }
    const other = { jsonrpc: '2.0', id: 3, result: { contents: 'é' } };
    expect(messageBytes(other as never).equals(Buffer.from(JSON.stringify(other), 'utf-8'))).toBe(true);
  });

  // One publish after another reuses what earlier publishes converted and wrote: whatever the
  // lists, each publish must still be exactly its own conversion and JSON.
  const POOL = Array.from({ length: 12 }, (_, i) => problem(i % 3 ? `problem ${i} “é” \u2028` : `p${i}`, i));
  const list = fc.array(fc.nat({ max: POOL.length - 1 }), { maxLength: 14 }).map((ks) => ks.map((k) => POOL[k]));
  fcIt.prop([fc.array(fc.tuple(list, fc.constantFrom('file:///w/a.rungs', 'file:///w/b.rungs')), { minLength: 1, maxLength: 12 })], { numRuns: 300 })(
    'each of a run of publishes is its own conversion and JSON, byte for byte',
    (publishes) => {
      let version = 0;
      for (const [problems, uri] of publishes) {
        const ds = diagnosticsOf(problems, uri);
        expect(ds).toEqual(problems.map((p) => toLspDiagnostic(p, uri)));
        const msg = { jsonrpc: '2.0', method: 'textDocument/publishDiagnostics', params: { uri, version: ++version, diagnostics: ds } };
        expect(messageBytes(msg as never).toString('utf-8')).toBe(JSON.stringify(msg));
      }
    },
  );
});

