// Every fixture in tests/fixtures/rules: the rules named by its `// expect:` comments fire on the
// lines below them, and nothing else fires; the whole results are snapshotted (messages included).
import { describe, expect, it } from 'vitest';
import { check, fixtureNames, readFixture } from './check';

describe('rule fixtures', () => {
  const names = fixtureNames();
  it('has fixtures', () => expect(names.length).toBeGreaterThan(10));
  for (const name of names) {
    it(name, () => {
      const { expected, actual, problems } = check(readFixture(name));
      expect(actual).toEqual(expected);
      expect(problems).toMatchSnapshot();
    });
  }
});
