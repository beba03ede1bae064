// Option parsing (node:util parseArgs, strict) keeps the project's messages and exit code 2.
import { describe, expect, it } from 'vitest';
import { parseArgs } from '../../server/src/cli/args';
import { main } from '../../server/src/cli/main';
import { MemFs } from './memfs';

const SPECS = { format: { value: true, choices: ['text', 'json'], alias: 'f' }, quiet: { alias: 'q' } };
const message = (argv: string[]) => {
  try {
    parseArgs(argv, SPECS);
    return 'no error';
  } catch (e) {
    return (e as Error).message;
  }
};

describe('parseArgs', () => {
  it('reads long, short and = forms, "-" and what follows "--" as positionals', () => {
    const r = parseArgs(['-f', 'json', '-', '--quiet', '--', '-x'], SPECS);
    expect([...r.flags]).toEqual([['format', 'json'], ['quiet', true]]);
    expect(r.positionals).toEqual(['-', '-x']);
    expect([...parseArgs(['--format=text'], SPECS).flags]).toEqual([['format', 'text']]);
  });

  it('says what is wrong in the project\'s words', () => {
    expect(message(['--bogus'])).toBe('unknown option "--bogus"');
    expect(message(['-z'])).toBe('unknown option "-z"');
    expect(message(['--format'])).toBe('option --format needs a value');
    expect(message(['-f'])).toBe('option --format needs a value');
    expect(message(['--quiet=yes'])).toBe('option --quiet takes no value');
    expect(message(['--format', 'xml'])).toBe('--format must be one of text, json, not "xml"');
  });

  it('a usage error exits 2 with the message and the usage', async () => {
    let err = '';
    const code = await main({ argv: ['lint', '--bogus', 'a.rungs'], cwd: '/w', fs: new MemFs({}, '/w'), stdout: () => undefined, stderr: (t) => (err += t) });
    expect(code).toBe(2);
    expect(err).toContain('rungs lint: unknown option "--bogus"');
    expect(err).toContain('Usage: rungs lint');
  });
});
