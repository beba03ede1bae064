// Property: the rules' one-decimal rounding skips formatting only where formatting would change
// nothing: oneDecimal(x) is Number(x.toFixed(1)) for every number (the reference is the
// ECMAScript toFixed rounding itself), including counts, composite difficulties k / 10 and
// arbitrary doubles.
import { fc, test } from '@fast-check/vitest';
import { expect } from 'vitest';
import { oneDecimal } from '../../server/src/rules/shared';

const tenths = fc.integer({ min: -100_000, max: 100_000 }).map((k) => k / 10);
const rounded = fc.double({ min: -1000, max: 1000, noNaN: true }).map((v) => Math.round(v * 10) / 10);

test.prop([fc.oneof(fc.double(), fc.integer(), tenths, rounded)], { numRuns: 5000 })('oneDecimal is Number(x.toFixed(1))', (x) => {
  expect(Object.is(oneDecimal(x), Number(x.toFixed(1)))).toBe(true);
});
