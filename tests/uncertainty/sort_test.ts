import assert from "node:assert/strict";
import fc from "fast-check";
import { sortFloat64 } from "../../calc/uncertainty/sort.ts";

// Reference: the JavaScript engine's Float64Array.prototype.sort (ECMAScript §23.2.3.29: numeric
// order, −0 before +0), a general-purpose library routine.

Deno.test("radix sort of float64 equals the built-in typed-array sort (property, long arrays)", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ noNaN: true }), { minLength: 2048, maxLength: 6000 }),
      (values) => {
        const expected = Float64Array.from(values).sort();
        const actual = sortFloat64(Float64Array.from(values));
        assert.deepEqual(actual, expected);
      },
    ),
    { numRuns: 40 },
  );
});

Deno.test("radix sort: signed zeros, subnormals, infinities and ties in the built-in order", () => {
  const special = [
    0,
    -0,
    5e-324,
    -5e-324,
    Infinity,
    -Infinity,
    1,
    -1,
    1,
    2 ** 53,
    -Number.MAX_VALUE,
  ];
  const values = Float64Array.from({ length: 4096 }, (_, i) => special[i % special.length]!);
  const actual = sortFloat64(values.slice());
  assert.deepEqual(actual, values.slice().sort());
  const zeros = [...actual].filter((v) => v === 0).map((v) => (Object.is(v, -0) ? "-0" : "+0"));
  assert.ok(zeros.length > 0 && zeros.join(",").indexOf("+0,-0") === -1); // every −0 before +0
  // a view into a larger buffer is sorted in place, leaving the rest of the buffer alone
  const buffer = new Float64Array(5000).fill(7);
  const view = buffer.subarray(100, 100 + values.length);
  view.set(values);
  sortFloat64(view);
  assert.deepEqual(view, values.slice().sort());
  assert.equal(buffer[99], 7);
  assert.equal(buffer[100 + values.length], 7);
});
