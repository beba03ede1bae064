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
  const code = await main({ argv: ['lint', '--format', 'sarif', '.'], cwd: '/clinic', fs: new MemFs(files), stdout: (t) => (out += t), stderr: () => {}, env: {} });
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
    expect(run.results.length).toBe(24);
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
    // Info-level rules become SARIF notes: the pace below the baseline (line 9) and five unsorted rungs.
    expect(run.results.filter((r: { level: string }) => r.level === 'note').map((r: { ruleId: string }) => r.ruleId)).toEqual(['pace-below-baseline', ...Array(5).fill('unsorted-rung')]);
  });
});

// The SARIF 2.1.0 JSON schema as published on SchemaStore (sarif-2.1.0-rtm.5.json, the schema the
// SARIF 2.1.0 standard's logs reference), shipped in the npm package @microsoft/jest-sarif@1.0.0-beta.0
// (lib/schemas/). It is draft-04, so it is read with ajv-draft-04 plus ajv-formats.
import Ajv04 from 'ajv-draft-04';
import addFormats from 'ajv-formats';

describe('SARIF output against the SARIF 2.1.0 JSON schema', () => {
  const schemaPath = join(__dirname, '..', '..', 'node_modules', '@microsoft', 'jest-sarif', 'lib', 'schemas', 'sarif-2.1.0-rtm.5.json');
  const schema = JSON.parse(readFileSync(schemaPath, 'utf8'));
  // One pattern in the published schema (language tags) is not a valid Unicode-mode regular expression.
  const ajv = new Ajv04({ allErrors: true, strict: false, unicodeRegExp: false });
  addFormats(ajv);
  const validate = ajv.compile(schema);

  it('the schema is the SARIF 2.1.0 one and rejects a broken log', () => {
    expect(schema.title).toContain('SARIF) Version 2.1.0');
    expect(validate({ version: '2.1.0', runs: [{ tool: { driver: {} } }] })).toBe(false);
    expect(validate({ version: '2.0.0', runs: [] })).toBe(false);
  });

  it('validates the demo script\'s log, fixes and related locations included', async () => {
    const { log } = await sarif({ 'scripts/family visits.rungs': demo });
    const ok = validate(log);
    expect(validate.errors ?? []).toEqual([]);
    expect(ok).toBe(true);
  });

  it('validates a clean run too', async () => {
    const { code, log } = await sarif({ 'a.rungs': '== One\nThank you.\nGood morning.\nSee you soon.\n' });
    expect(code).toBe(0);
    expect(validate(log)).toBe(true);
  });
});
