import assert from "node:assert/strict";
import fc from "fast-check";
import { closedBounds, countOutside, inRange } from "../../mod.ts";

Deno.test("closedBounds: an exclusive bound moves to the adjacent double inside", () => {
  // IEEE 754 binary64: the double after 1 is 1 + 2⁻⁵², the one before 1 is 1 − 2⁻⁵³, the smallest
  // positive double is 2⁻¹⁰⁷⁴ (ECMAScript Number.MIN_VALUE)
  assert.deepEqual(closedBounds({ min: 1, max: 2, minExclusive: true }), {
    lower: 1 + 2 ** -52,
    upper: 2,
  });
  assert.deepEqual(closedBounds({ min: 0, max: 1, maxExclusive: true }), {
    lower: 0,
    upper: 1 - 2 ** -53,
  });
  assert.deepEqual(closedBounds({ min: 0, max: 0.5, minExclusive: true }).lower, 2 ** -1074);
  assert.deepEqual(closedBounds({ min: -1, max: 0, maxExclusive: true }).upper, -(2 ** -1074));
  assert.deepEqual(closedBounds({ min: -2, max: -1, minExclusive: true }).lower, -2 + 2 ** -52);
  // infinite bounds stay as they are
  assert.deepEqual(
    closedBounds({ min: -Infinity, max: Infinity, minExclusive: true, maxExclusive: true }),
    { lower: -Infinity, upper: Infinity },
  );
});

Deno.test("countOutside: the count of values that inRange refuses, with and without rows to skip", () => {
  const bound = fc.double({ min: -1e3, max: 1e3, noNaN: true });
  const value = fc.oneof(
    fc.double({ min: -2e3, max: 2e3 }),
    fc.constantFrom(NaN, Infinity, -Infinity, 0, -0),
  );
  fc.assert(
    fc.property(
      bound,
      bound,
      fc.boolean(),
      fc.boolean(),
      fc.array(value, { maxLength: 50 }),
      fc.array(fc.boolean(), { maxLength: 50 }),
      (a, b, minExclusive, maxExclusive, values, skips) => {
        const range = { min: Math.min(a, b), max: Math.max(a, b), minExclusive, maxExclusive };
        const col = Float64Array.from(values);
        // the bounds themselves, their neighbours and values inside, so the edges are hit
        const probe = Float64Array.of(...col, range.min, range.max, (range.min + range.max) / 2);
        const skip = Uint8Array.from(probe, (_, i) => (skips[i] ? 1 : 0));
        // reference: inRange value by value (its own tests: the JSDoc example and the validator's)
        const expected = [...probe].filter((v) => !inRange(v, range)).length;
        const expectedKept = [...probe].filter((v, i) => !skip[i] && !inRange(v, range)).length;
        assert.equal(countOutside(probe, range), expected);
        assert.equal(countOutside(probe, range, skip), expectedKept);
      },
    ),
    { seed: 20261202, numRuns: 2000 },
  );
});
