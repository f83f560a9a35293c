import assert from "node:assert/strict";
import { coverageIntervals, randomStream } from "../../mod.ts";
import { intervalsOfValues, meanAndStandardDeviation } from "../../calc/uncertainty/intervals.ts";

// JCGM 101:2008 §7.7: the intervals are order statistics; the reference here is a full sort of
// the same values (Array.prototype.sort with a numeric comparison), independent of the tail search
function byFullSort(values: Float64Array, p: number) {
  const s = [...values].sort((a, b) => a - b);
  const m = s.length;
  const pm = p * m;
  const q = Number.isInteger(pm) ? pm : Math.floor(pm + 0.5);
  const r = Number.isInteger((m - q) / 2) ? (m - q) / 2 : (m - q + 1) / 2;
  let best = Infinity, j = 0;
  for (let i = 0; i + q < m; i++) {
    if (s[i + q]! - s[i]! < best) best = s[i + q]! - s[i]!, j = i;
  }
  return {
    symmetric: { lower: s[r - 1]!, upper: s[r + q - 1]! },
    shortest: { lower: s[j]!, upper: s[j + q]! },
  };
}

Deno.test("coverage intervals from the tails equal those of a full sort, with or without a known span", () => {
  for (const seed of [1, 2, 3]) {
    const y = new Float64Array(100_003);
    randomStream(seed).fillNormal(y, 10, 2);
    for (let i = 0; i < y.length; i += 7) y[i] = y[i]! ** 3; // a skewed part
    const expected = byFullSort(y, 0.95);
    assert.deepEqual(coverageIntervals(y, 0.95), expected);
    const { mean: _m, sd: _s, ...span } = meanAndStandardDeviation(y);
    assert.deepEqual(intervalsOfValues(y, 0.95, span), expected);
    // a span narrower than the values (the values changed after it was taken) still gives the
    // intervals of the values: the binning is clamped, so it stays monotone
    const cut = 0.002 * (span.max - span.min);
    const narrow = { ...span, min: span.min + cut, max: span.max - cut };
    assert.deepEqual(intervalsOfValues(y, 0.95, narrow), expected);
  }
});
