import assert from "node:assert/strict";
import fc from "fast-check";
import {
  chiSquareQuantile,
  coverageIntervals,
  normalCdf,
  normalQuantile,
  randomStream,
  tCdf,
} from "../../mod.ts";
import {
  streamState,
  uniformFromWords,
  xoshiro128StarStar,
} from "../../calc/uncertainty/random.ts";

const N = 200_000;

/** Kolmogorov–Smirnov statistic D = sup |F_n(x) − F(x)| of a sample against a CDF. */
function ksStatistic(sample: Float64Array, cdf: (x: number) => number): number {
  const s = sample.slice().sort();
  let d = 0;
  for (let i = 0; i < s.length; i++) {
    const f = cdf(s[i]!);
    d = Math.max(d, f - i / s.length, (i + 1) / s.length - f);
  }
  return d;
}
// Asymptotic KS critical value at α = 0.001: 1.95/√n (Massey 1951, J Am Stat Assoc 46:68–78, Table 1)
const ksCritical = (n: number) => 1.95 / Math.sqrt(n);

Deno.test("ziggurat normals: moments of N(0, 1)", () => {
  const z = new Float64Array(N);
  randomStream(123).fillNormal(z);
  let m1 = 0, m2 = 0, m3 = 0, m4 = 0;
  for (const x of z) {
    m1 += x;
    m2 += x * x;
    m3 += x ** 3;
    m4 += x ** 4;
  }
  m1 /= N, m2 /= N, m3 /= N, m4 /= N;
  // Standard normal moments 0, 1, 0, 3 (common practice, no source); tolerances ≈ 5 standard errors
  // (SE of mean 1/√N, of m2 √(2/N), of m3 √(15/N), of m4 √(96/N))
  assert.ok(Math.abs(m1) < 5 / Math.sqrt(N), `mean ${m1}`);
  assert.ok(Math.abs(m2 - 1) < 5 * Math.sqrt(2 / N), `variance ${m2}`);
  assert.ok(Math.abs(m3) < 5 * Math.sqrt(15 / N), `third moment ${m3}`);
  assert.ok(Math.abs(m4 - 3) < 5 * Math.sqrt(96 / N), `fourth moment ${m4}`);
});

Deno.test("ziggurat normals: Kolmogorov–Smirnov and χ² goodness of fit", () => {
  const z = new Float64Array(N);
  randomStream(321).fillNormal(z);
  assert.ok(ksStatistic(z, normalCdf) < ksCritical(N));
  // 100 equiprobable bins from the normal quantile function; χ²(99) at 0.999 from the χ² quantile
  const bins = 100;
  const edges = Array.from({ length: bins - 1 }, (_, i) => normalQuantile((i + 1) / bins));
  const counts = new Array<number>(bins).fill(0);
  for (const x of z) {
    let lo = 0, hi = edges.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (x < edges[mid]!) hi = mid;
      else lo = mid + 1;
    }
    counts[lo]!++;
  }
  const expected = N / bins;
  const chi2 = counts.reduce((s, c) => s + (c - expected) ** 2 / expected, 0);
  assert.ok(chi2 < chiSquareQuantile(0.999, bins - 1), `χ² = ${chi2}`);
});

Deno.test("ziggurat normals: the tail beyond 3.44 (bottom layer) has the right mass", () => {
  const z = new Float64Array(2_000_000);
  randomStream(77).fillNormal(z);
  let beyond = 0;
  for (const x of z) if (Math.abs(x) > 3.442619855899) beyond++;
  // P(|Z| > 3.4426) = 2(1 − Φ(3.4426)) ≈ 5.76e-4 from the normal CDF; binomial SE √(np(1−p))
  const p = 2 * (1 - normalCdf(3.442619855899));
  const expected = z.length * p;
  assert.ok(Math.abs(beyond - expected) < 5 * Math.sqrt(expected), `${beyond} vs ${expected}`);
});

Deno.test("uniform construction: the extreme words give 2^-53 and 1 - 2^-53, never 0 or 1", () => {
  // IEEE 754 double arithmetic (hand check): (0 + 0.5)/2^52 = 2^-53 and (2^52 - 1 + 0.5)/2^52 =
  // 1 - 2^-53, both exact; signed and unsigned 32-bit words give the same value
  assert.equal(uniformFromWords(0, 0), 2 ** -53);
  assert.equal(uniformFromWords(0xffffffff, 0xffffffff), 1 - 2 ** -53);
  assert.equal(uniformFromWords(-1, -1), 1 - 2 ** -53);
  assert.ok(uniformFromWords(-1, -1) < 1);
});

Deno.test("uniform draws: open interval (0, 1), KS against U(0, 1)", () => {
  const u = new Float64Array(N);
  randomStream(9).fillUniform(u);
  assert.ok(u.every((x) => x > 0 && x < 1));
  assert.ok(ksStatistic(u, (x) => x) < ksCritical(N));
});

Deno.test("Student t draws (Bailey's polar method): KS against the t CDF for ν = 3 and 10", () => {
  for (const dof of [3, 10]) {
    const rng = randomStream(dof);
    const t = new Float64Array(N);
    for (let i = 0; i < N; i++) t[i] = rng.studentT(dof);
    assert.ok(ksStatistic(t, (x) => tCdf(x, dof)) < ksCritical(N), `ν = ${dof}`);
  }
});

Deno.test("coverage intervals from tails equal those from a full sort (property)", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 40, maxLength: 400 }),
      fc.constantFrom(0.9, 0.95, 0.99),
      (values, p) => {
        const a = Float64Array.from(values);
        const got = coverageIntervals(a, p);
        // reference: JCGM 101:2008 §7.7 applied literally to a fully sorted copy
        const s = a.slice().sort();
        const m = s.length, pm = p * m;
        const q = Math.min(m - 1, Number.isInteger(pm) ? pm : Math.floor(pm + 0.5));
        const r = Number.isInteger((m - q) / 2) ? (m - q) / 2 : (m - q + 1) / 2;
        let best = Infinity, br = 1;
        for (let k = 1; k + q <= m; k++) {
          if (s[k + q - 1]! - s[k - 1]! < best) {
            best = s[k + q - 1]! - s[k - 1]!;
            br = k;
          }
        }
        return got.symmetric.lower === s[r - 1] && got.symmetric.upper === s[r + q - 1] &&
          got.shortest.upper - got.shortest.lower === best && got.shortest.lower === s[br - 1];
      },
    ),
    { numRuns: 200, seed: 5 },
  );
});

Deno.test("coverage intervals: data the histogram cannot split give the full-sort answer", () => {
  // reference: JCGM 101:2008 §7.7 applied to a fully sorted copy (Float64Array.prototype.sort)
  const bySort = (a: Float64Array, p: number) => {
    const s = a.slice().sort();
    const m = s.length, q = Math.min(m - 1, Math.floor(p * m + 0.5));
    const r = Number.isInteger((m - q) / 2) ? (m - q) / 2 : (m - q + 1) / 2;
    return [s[r - 1], s[r + q - 1]];
  };
  const show = (v: readonly (number | undefined)[]) =>
    v.map((x) => (Object.is(x, -0) ? "-0" : String(x)));
  const cases = {
    "spread below the double resolution": Float64Array.from(
      { length: 1000 },
      (_, i) => (i % 2 ? 5e-324 : 0),
    ),
    "spread beyond the double range": Float64Array.from(
      { length: 1000 },
      (_, i) => (i % 2 ? 1e308 : -1e308),
    ),
    "zeros of both signs": Float64Array.from({ length: 1000 }, (_, i) => (i % 3 ? -0 : 0)),
    "one repeated value": new Float64Array(1000).fill(2.5),
  };
  for (const [name, values] of Object.entries(cases)) {
    for (const p of [0.4, 0.95]) {
      assert.deepEqual(
        show(Object.values(coverageIntervals(values, p).symmetric)),
        show(bySort(values, p)),
        `${name}, p = ${p}`,
      );
    }
  }
});

Deno.test("coverage intervals leave their input untouched (frozen copy compared)", () => {
  const a = Float64Array.from({ length: 1000 }, (_, i) => Math.sin(i));
  const before = a.slice();
  coverageIntervals(a, 0.95);
  assert.deepEqual(a, before);
});

Deno.test("xoshiro128** raw words: the reference code's outputs", () => {
  const words = (state: number[], n: number) => {
    const next = xoshiro128StarStar(state);
    return Array.from({ length: n }, () => next());
  };
  // edorfaus/xoshiro-6502, test-rom/testdata.asm (values from the C reference implementation
  // xoshiro128starstar.c): state bytes 0C 4A 4D 96 95 B8 0A D4 CB DE 7F AD F0 F0 06 30, i.e. the
  // little-endian words below; outputs F1391922, 6FE53806, A5BE2840, F510EE70
  assert.deepEqual(
    words([0x964d4a0c, 0xd40ab895, 0xad7fdecb, 0x3006f0f0], 4),
    [0xf1391922, 0x6fe53806, 0xa5be2840, 0xf510ee70],
  );
  // state {0, 1, 2, 3}: the reference code's first ten outputs as quoted by public xoshiro128**
  // test suites (TypeScript ports tested against the C reference; found by code search)
  assert.deepEqual(words([0, 1, 2, 3], 10), [
    5760,
    17280,
    2966400,
    32451840,
    2604340873,
    3891234569,
    1254043636,
    216095511,
    3291724652,
    2070429911,
  ]);
  assert.throws(() => xoshiro128StarStar([0, 0, 0, 0]), /not all zero, got \[0, 0, 0, 0\]/);
});

Deno.test("stream state: the first four MT19937 words of the seed or key", () => {
  // mt19937ar.out (Matsumoto & Nishimura 2002 reference code), key {0x123, 0x234, 0x345, 0x456}:
  // first outputs; the same values from numpy 2.4.6 MT19937._legacy_seeding (init_by_array)
  assert.deepEqual(
    streamState([0x123, 0x234, 0x345, 0x456]),
    [1067595299, 955945823, 477289528, 4107218783],
  );
  // numpy 2.4.6, MT19937()._legacy_seeding(key).random_raw(4), for a run seed with a block index
  // and for a three-word key
  assert.deepEqual(streamState([20080101, 3]), [3318652550, 1599953118, 1737149465, 2376876779]);
  assert.deepEqual(streamState([7, 0, 1]), [4134331577, 364536972, 1405532956, 207176672]);
  // init_genrand(5489), the reference default seed: 3499211612, 581869302, 3890346734 (numpy 2.4.6
  // MT19937._legacy_seeding(5489); from memory, the first value of C++11 std::mt19937 by default)
  assert.deepEqual(streamState(5489).slice(0, 3), [3499211612, 581869302, 3890346734]);
  // a stream's words are xoshiro128** from that state (the same construction, step by step)
  const next = xoshiro128StarStar(streamState([7, 0, 1]));
  const stream = randomStream([7, 0, 1]);
  for (let i = 0; i < 1000; i++) assert.equal(stream.uint32(), next());
});

Deno.test("seeded reproducibility: the same seed or key gives the same draws, bit for bit", () => {
  for (const seed of [1, 20080101, [5, 0, 9], [2 ** 32 - 1, 123456789, 42, 7]]) {
    const a = randomStream(seed), b = randomStream(seed);
    const x = new Float64Array(5000), y = new Float64Array(5000);
    a.fillNormal(x, 3, 2);
    b.fillNormal(y, 3, 2);
    assert.deepEqual(x, y);
    a.fillUniform(x);
    b.fillUniform(y);
    assert.deepEqual(x, y);
    for (let i = 0; i < 100; i++) assert.equal(a.studentT(4), b.studentT(4));
  }
  // a fill of length one is one draw
  const one = new Float64Array(1);
  for (let seed = 1; seed <= 2000; seed++) {
    randomStream(seed).fillNormal(one);
    assert.equal(one[0], randomStream(seed).normal());
  }
  const bulk = randomStream(77), single = randomStream(77);
  const u = new Float64Array(20_000);
  bulk.fillUniform(u);
  for (let i = 0; i < u.length; i++) assert.equal(u[i], single.uniform());
});

// The ziggurat of Doornik (2005), "An improved ziggurat method to generate normal random
// samples", Nuffield College: 128 layers of area V, x₁ = R, xᵢ₊₁ = √(−2 ln(V/xᵢ + f(xᵢ))), with
// R = 3.442619855899 and V = 9.91256303526217e-3 (Marsaglia & Tsang 2000, J Stat Softw 5(8)).
function doornikLayers(): { x: Float64Array; ratio: Float64Array } {
  const R = 3.442619855899, V = 9.91256303526217e-3;
  const x = new Float64Array(129), ratio = new Float64Array(128);
  let f = Math.exp(-0.5 * R * R);
  x[0] = V / f, x[1] = R, x[128] = 0;
  for (let i = 2; i < 128; i++) {
    x[i] = Math.sqrt(-2 * Math.log(V / x[i - 1]! + f));
    f = Math.exp(-0.5 * x[i]! * x[i]!);
  }
  for (let i = 0; i < 128; i++) ratio[i] = x[i + 1]! / x[i]!;
  return { x, ratio };
}

Deno.test("normal fills: row r from words 2r and 2r + 1 on the ziggurat's fast path, the rest after", () => {
  const { x, ratio } = doornikLayers();
  for (const key of [[77], [5, 0, 9], [2 ** 32 - 1, 1, 2]]) {
    const n = 20_000;
    const z = new Float64Array(n);
    randomStream(key).fillNormal(z, 3, 2);
    const next = xoshiro128StarStar(streamState(key));
    let fast = 0;
    for (let r = 0; r < n; r++) {
      const a = next(), b = next();
      // u on (−1, 1) from 53 bits, the layer from 7 other bits (the documented layout)
      const u = 2 * (((a >>> 5) * 2 ** 26 + (b >>> 6) + 0.5) / 2 ** 53) - 1;
      const i = (b & 63) | ((a & 1) << 6);
      if (Math.abs(u) < ratio[i]!) {
        fast++;
        assert.equal(z[r], 3 + 2 * (u * x[i]!), `row ${r}`);
      } else assert.ok(Number.isFinite(z[r]!), `row ${r}`);
    }
    // u is uniform on (−1, 1), so a layer's fast path takes the share xᵢ₊₁/xᵢ of its draws and the
    // whole fast path the mean of those ratios (about 0.971 here); ±4 binomial standard errors
    const share = ratio.reduce((t, v) => t + v, 0) / 128;
    const se = Math.sqrt((share * (1 - share)) / n);
    assert.ok(
      Math.abs(fast / n - share) < 4 * se,
      `fast path share ${fast / n}, expected ${share}`,
    );
  }
});

Deno.test("random stream keys: bad keys are refused with the key shown", () => {
  assert.throws(
    () => randomStream([]),
    /expected a key of one or more integers in \[0, 2\^32 - 1\], got \[\]/,
  );
  assert.throws(() => randomStream([1, -2]), /got \[1, -2\]/);
  assert.throws(() => randomStream([1, 2 ** 32]), /got \[1, 4294967296\]/);
  assert.throws(() => randomStream([1.5]), /got \[1.5\]/);
});
