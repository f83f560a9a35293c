import assert from "node:assert/strict";
import { coverageIntervals, randomStream, sampleCovariance } from "../../mod.ts";
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

// JCGM 101:2008 §7.6 eqs (16)–(17) on the values kept: the NaN rows (excluded trials) removed
// first, then the two passes written plainly (the same summation order, so the same bits)
function meanAndSdOfKept(values: Float64Array) {
  const kept = values.filter((v) => !Number.isNaN(v));
  const m = kept.length;
  let s = 0;
  for (const v of kept) s += v;
  const mean = s / m;
  let ss = 0, comp = 0;
  for (const v of kept) {
    ss += (v - mean) ** 2;
    comp += v - mean;
  }
  const sd = Math.sqrt(Math.max((ss - (comp * comp) / m) / (m - 1), 0));
  return { mean, sd, count: m, min: Math.min(...kept), max: Math.max(...kept) };
}

Deno.test("mean and standard deviation skip excluded (NaN) trials and equal the plain two passes on the kept values, bit for bit", () => {
  for (const seed of [4, 5]) {
    const y = new Float64Array(20_001);
    randomStream(seed).fillNormal(y, 0, 1);
    for (let i = 0; i < y.length; i += 13) y[i] = NaN;
    for (let i = 5; i < y.length; i += 101) y[i] = -0;
    assert.deepEqual(meanAndStandardDeviation(y), meanAndSdOfKept(y));
  }
  // sums through exact zeros and signed zeros: 1 + (−1) = +0, then −0 and NaN rows
  const z = Float64Array.of(1, -1, -0, NaN, -0, 2, NaN, -2);
  assert.deepEqual(meanAndStandardDeviation(z), meanAndSdOfKept(z));
  assert.ok(Object.is(meanAndStandardDeviation(z).mean, 0));
});

// the sample covariance (JCGM 101:2008 §7.6, eq. (18) form) over the rows kept in both columns,
// written plainly on the filtered rows
Deno.test("sample covariance leaves out rows with a NaN and equals the plain sum over the kept rows", () => {
  const a = new Float64Array(5_001), b = new Float64Array(5_001);
  const rng = randomStream(9);
  rng.fillNormal(a, 1, 2);
  rng.fillNormal(b, -1, 0.5);
  for (let i = 0; i < a.length; i += 17) a[i] = NaN, b[i] = NaN;
  const keep = [...a.keys()].filter((i) => !Number.isNaN(a[i]!));
  const mean = (c: Float64Array) => meanAndSdOfKept(c).mean;
  const [ma, mb] = [mean(a), mean(b)];
  let sab = 0, saa = 0;
  for (const i of keep) {
    sab += (a[i]! - ma) * (b[i]! - mb);
    saa += (a[i]! - ma) * (a[i]! - ma);
  }
  const c = sampleCovariance([a, b]);
  assert.equal(c[0]![1], sab / (keep.length - 1));
  assert.equal(c[1]![0], sab / (keep.length - 1));
  assert.equal(c[0]![0], saa / (keep.length - 1));
});
