// SARIF 2.1.0 output: every rule once under tool.driver.rules with its docs link, every result
// pointing at its rule by id and index, regions 1-based with exclusive end columns.
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../server/src/cli/main';
import { RULES } from '../../server/src/rules/index';
import { ruleDocsUrl } from '../../server/src/rules/docs';
import { MemFs } from './memfs';

const demo = readFileSync(join(__dirname, '..', '..', 'sample-scripts', 'family-visits-draft.rungs'), 'utf8');

async function sarif(files: Record<string, string>): Promise<{ code: number | null; log: any }> {
  let out = '';
  const code = await main({ argv: ['lint', '--format', 'sarif', '.'], cwd: '/work', fs: new MemFs(files), stdout: (t) => (out += t), stderr: () => {}, env: {} });
  return { code, log: JSON.parse(out) };
}

describe('SARIF output', () => {
  it('lists each rule once, with helpUri, and points every result at its rule', async () => {
    const { code, log } = await sarif({ 'scripts/family visits.rungs': demo });
    expect(code).toBe(1);
    expect(log.version).toBe('2.1.0');
    const run = log.runs[0];
    const rules = run.tool.driver.rules;
    expect(rules.map((r: { id: string }) => r.id)).toEqual(RULES.map((r) => r.id));
    for (const r of rules) expect(r.helpUri).toBe(ruleDocsUrl(r.id));
    expect(run.results.length).toBe(23);
    for (const res of run.results) {
      expect(rules[res.ruleIndex].id).toBe(res.ruleId);
      expect(res.locations[0].physicalLocation.artifactLocation.uri).toBe('scripts/family%20visits.rungs');
    }
    const back = run.results.find((r: { ruleId: string }) => r.ruleId === 'step-backwards');
    expect(back.level).toBe('warning');
    expect(back.locations[0].physicalLocation.region).toEqual({ startLine: 37, startColumn: 1, endLine: 37, endColumn: 17 });
    expect(back.relatedLocations[0].message.text).toBe('rung 3 "Longer greetings": median 36.7');
    const key = run.results.find((r: { ruleId: string }) => r.ruleId === 'unknown-key');
    expect(key.fixes[0].artifactChanges[0].replacements).toEqual([
      { deletedRegion: { startLine: 8, startColumn: 1, endLine: 8, endColumn: 7 }, insertedContent: { text: '@paces' } },
    ]);
    expect(run.results.filter((r: { level: string }) => r.level === 'note').map((r: { ruleId: string }) => r.ruleId)).toEqual(Array(5).fill('unsorted-rung'));
  });
});
