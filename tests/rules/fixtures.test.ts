// Every fixture in tests/fixtures/rules: the rules named by its marker comments (`//  vvvv rule-id`,
// see check.ts) fire on exactly the spans marked on the lines below them, and nothing else fires;
// the whole results are snapshotted (messages included).
import { describe, expect, it } from 'vitest';
import { check, fixtureNames, readFixture } from './check';

describe('rule fixtures', () => {
  const names = fixtureNames();
  it('has fixtures', () => expect(names.length).toBeGreaterThan(10));
  it('a marker one column off fails', () => {
    const text = readFixture('step-too-big.rungs');
    const shifted = text.replace(/^\/\/v/m, '// v');
    expect(shifted).not.toBe(text);
    const { expected, actual } = check(shifted);
    expect(actual).not.toEqual(expected);
    const shorter = text.replace(/^(\/\/v+)v /m, '$1 ');
    expect(check(shorter).actual).not.toEqual(check(shorter).expected);
  });
  for (const name of names) {
    it(name, () => {
      const { expected, actual, problems } = check(readFixture(name));
      expect(actual).toEqual(expected);
      expect(problems).toMatchSnapshot();
    });
  }
});
