/**
 * Seeded random streams for Monte Carlo.
 *
 * The generator is xoshiro128** 1.1 (Blackman & Vigna 2021, "Scrambled linear pseudorandom number
 * generators", ACM TOMS 47(4):36, citation from memory; reference code
 * prng.di.unimi.it/xoshiro128starstar.c): 128 bits of state, period 2¹²⁸ − 1, 32-bit words; the
 * authors report that it passes BigCrush (from memory). Its four state words are the first
 * four outputs of the Mersenne Twister MT19937 (Matsumoto & Nishimura 1998; pure-rand's
 * implementation) started from the stream's seed (the MT reference `init_genrand`) or key (the MT
 * reference `init_by_array`, which numpy's legacy MT19937 seeding also uses), so that every seed
 * and every key of several words gives its own, well-mixed state.
 *
 * Why this generator: random bits were the largest single cost of a Monte Carlo run (8 words per
 * trial of the 4-input benchmark model). MT19937 through pure-rand cost ≈ 3.5–4.5 ns per word, and
 * a bulk MT19937 refill written here no less; xoshiro128** with its state held in local variables
 * across a whole column costs a fraction of that. Philox4x32-10 (counter-based, Salmon et al. 2011)
 * was measured too: it needs 64-bit products, which JavaScript builds from 16-bit halves, and ran
 * 6–12 times slower per word than MT19937 here. Streams keyed by run, source and block (see
 * calc/uncertainty/sampling.ts) keep pool results bit-identical to one thread: each block draws
 * from its own stream whatever thread runs it. Checked in tests/uncertainty/random_test.ts against
 * the reference code's outputs, and by moments, Kolmogorov–Smirnov and χ² tests of the samplers.
 *
 * On top of it:
 *
 * - uniform: (k + ½)/2⁵² with k a 52-bit integer from two 32-bit draws, strictly inside (0, 1):
 *   from 2⁻⁵³ to 1 − 2⁻⁵³. (Adding ½ to 53 bits would avoid 0 but can round up to exactly 1, so
 *   one bit fewer keeps the interval open.)
 * - normal: the ziggurat method of Marsaglia & Tsang (2000, J Stat Softw 5(8)) in the improved form
 *   of Doornik (2005, "An Improved Ziggurat Method to Generate Normal Random Samples"): 128 layers,
 *   a 53-bit uniform for the abscissa and separate bits for the layer, exact tail sampling. It is
 *   written here because the library ziggurat we tried (@stdlib) costs about four times as much
 *   per draw through its wrapper; it is checked in tests/uncertainty/random_test.ts against
 *   reference moments, a Kolmogorov–Smirnov test and a χ² goodness-of-fit test;
 * - Student t: Bailey's polar method (Bailey 1994, Math Comp 62:779–781), exact for any ν > 0.
 *
 * Monte Carlo gives every block of trials its own stream keyed by the run seed and the block
 * index, so that blocks can run in any order, on any number of workers, with the same result. The
 * same seed or key gives the same numbers, bit for bit.
 *
 * @module
 */
import { mersenne, mersenneFromState } from "pure-rand/generator/mersenne";

/** A seeded stream of random numbers. */
export interface RandomStream {
  /** The seed (or key of several words) that started the stream. */
  readonly seed: number | readonly number[];
  /** The next raw 32-bit word of the generator, in [0, 2³² − 1]. */
  uint32(): number;
  /** Uniform strictly inside (0, 1), 52-bit resolution: from 2⁻⁵³ to 1 − 2⁻⁵³. */
  uniform(): number;
  /** Standard normal. */
  normal(): number;
  /** Standard Student t with `dof` degrees of freedom. */
  studentT(dof: number): number;
  /** Fills `out` with normal draws of the given mean and standard deviation (default N(0, 1)). */
  fillNormal(out: Float64Array, mean?: number, sd?: number): void;
  /** Fills `out` with uniform draws on (0, 1). */
  fillUniform(out: Float64Array): void;
}

const LAYERS = 128;
const R = 3.442619855899; // start of the tail (Marsaglia & Tsang 2000)
const V = 9.91256303526217e-3; // area of each layer
const ZIG_X = new Float64Array(LAYERS + 1);
const ZIG_RATIO = new Float64Array(LAYERS);
{
  let f = Math.exp(-0.5 * R * R);
  ZIG_X[0] = V / f;
  ZIG_X[1] = R;
  ZIG_X[LAYERS] = 0;
  for (let i = 2; i < LAYERS; i++) {
    ZIG_X[i] = Math.sqrt(-2 * Math.log(V / ZIG_X[i - 1]! + f));
    f = Math.exp(-0.5 * ZIG_X[i]! * ZIG_X[i]!);
  }
  for (let i = 0; i < LAYERS; i++) ZIG_RATIO[i] = ZIG_X[i + 1]! / ZIG_X[i]!;
}
/**
 * No standard normal draw of a stream exceeds this in magnitude: the ziggurat's layers give
 * |z| < R (R = 3.442619855899, the start of the tail), and its exact tail gives
 * z = R − ln(U)/R with U ≥ 2⁻⁵³ (the smallest uniform), so |z| ≤ R + 53·ln 2/R ≈ 14.1138;
 * rounded up here. A draw of N(μ, σ) therefore lies in μ ± 14.12·σ (up to rounding).
 *
 * @example
 * ```ts
 * import { NORMAL_DRAW_LIMIT } from "./random.ts";
 * import assert from "node:assert/strict";
 * // R + 53·ln 2 / R with R = 3.442619855899 (Marsaglia & Tsang 2000)
 * const R = 3.442619855899;
 * assert.ok(NORMAL_DRAW_LIMIT >= R + (53 * Math.LN2) / R);
 * assert.ok(NORMAL_DRAW_LIMIT - (R + (53 * Math.LN2) / R) < 0.01);
 * ```
 */
export const NORMAL_DRAW_LIMIT = 14.12;
const TWO_POW_26 = 67108864;
const TWO_POW_52 = 4503599627370496;
const TWO_POW_53 = 9007199254740992;

/** The 32-bit generator behind a stream: xoshiro128** over a state of four 32-bit words. */
class Generator32 {
  /** The state s₀ … s₃ (Int32Array: the words stay unboxed). */
  readonly s: Int32Array;
  constructor(state: Int32Array) {
    this.s = state;
  }
  /** The next word (as a signed 32-bit integer): xoshiro128** 1.1, the reference `next`. */
  next(): number {
    const s = this.s;
    const s0 = s[0]!, s1 = s[1]!, s2 = s[2]! ^ s0, s3 = s[3]! ^ s1;
    const x = Math.imul(s1, 5);
    const result = Math.imul((x << 7) | (x >>> 25), 9);
    s[0] = s0 ^ s3;
    s[1] = s1 ^ s2;
    s[2] = s2 ^ (s1 << 9);
    s[3] = (s3 << 11) | (s3 >>> 21);
    return result;
  }
}

/**
 * A xoshiro128** generator started from four state words (not all zero).
 *
 * @param state s₀ … s₃ as 32-bit integers (signed or not).
 * @returns A function giving the next word in [0, 2³² − 1].
 * @throws {RangeError} For an all-zero state (the generator's one forbidden state).
 *
 * @example The first word, by hand from the reference steps (the reference code's outputs are in
 * tests/uncertainty/random_test.ts)
 * ```ts
 * import { xoshiro128StarStar } from "./random.ts";
 * import assert from "node:assert/strict";
 * const next = xoshiro128StarStar([1, 2, 3, 4]);
 * // rotl(2·5, 7)·9 = 1280·9 = 11520 for the first word: the output depends on s₁ only
 * assert.equal(next(), 11520);
 * ```
 */
export function xoshiro128StarStar(state: readonly number[]): () => number {
  if (state.length !== 4 || state.every((w) => (w | 0) === 0)) {
    throw new RangeError(
      `xoshiro128**: expected four state words, not all zero, got [${state.join(", ")}]`,
    );
  }
  const g = new Generator32(Int32Array.from(state, (w) => w | 0));
  return () => g.next() >>> 0;
}

/** (k + ½)/2⁵² for the 52-bit integer k made of the high 26 bits of two 32-bit words: strictly
 * inside (0, 1), from 2⁻⁵³ to 1 − 2⁻⁵³ (every value exact in double precision).
 *
 * @param a First word (any 32-bit integer, signed or not).
 * @param b Second word.
 */
export function uniformFromWords(a: number, b: number): number {
  return ((a >>> 6) * TWO_POW_26 + (b >>> 6) + 0.5) / TWO_POW_52;
}

/** Uniform strictly inside (0, 1) from the next two words of the stream. */
function uniformOpen(mt: Generator32): number {
  return uniformFromWords(mt.next(), mt.next());
}

/** Exact sampling of the normal tail beyond R (Marsaglia 1964, as used by Doornik 2005). */
function tail(mt: Generator32, negative: boolean): number {
  let x: number, y: number;
  do {
    x = Math.log(uniformOpen(mt)) / R;
    y = Math.log(uniformOpen(mt));
  } while (-2 * y < x * x);
  return negative ? x - R : R - x;
}

/** The rare ziggurat cases: bottom layer (tail) or a wedge; on rejection a fresh normal. */
function slowNormal(mt: Generator32, u: number, i: number): number {
  if (i === 0) return tail(mt, u < 0);
  const x = u * ZIG_X[i]!;
  const f0 = Math.exp(-0.5 * (ZIG_X[i]! * ZIG_X[i]! - x * x));
  const f1 = Math.exp(-0.5 * (ZIG_X[i + 1]! * ZIG_X[i + 1]! - x * x));
  return f1 + uniformOpen(mt) * (f0 - f1) < 1 ? x : normal(mt);
}

/** One standard normal draw: the same as a fill of length one (see {@linkcode fillNormal}),
 * whose slow path, if taken, follows the row's two words at once. */
function normal(mt: Generator32): number {
  const a = mt.next();
  const b = mt.next();
  const u = 2 * (((a >>> 5) * TWO_POW_26 + (b >>> 6) + 0.5) / TWO_POW_53) - 1;
  const i = (b & 63) | ((a & 1) << 6);
  return Math.abs(u) < ZIG_RATIO[i]! ? u * ZIG_X[i]! : slowNormal(mt, u, i);
}

/**
 * Fills `out` with mean + sd·Z, Z by the improved ziggurat (Doornik 2005, 128 layers), in two
 * passes over the stream:
 *
 * 1. for row r, in order, the next two words a, b give u = 2·((a ≫ 5)·2²⁶ + (b ≫ 6) + ½)/2⁵³ − 1
 *    (53 bits, strictly inside (−1, 1)) and the layer i = (b & 63) | ((a & 1) ≪ 6); if
 *    |u| < xᵢ₊₁/xᵢ the row is u·xᵢ (the ziggurat's fast path, about 99 % of rows);
 * 2. the other rows, in row order, then take the ziggurat's slow path (the tail beyond R, or the
 *    wedge test with a fresh uniform, and on rejection a whole fresh draw) from the words that
 *    follow.
 *
 * Each row's accept-or-reject depends on its own two words only, and every slow path draws fresh
 * words, so the values are independent standard normals exactly as with one pass; the order of
 * the words is what the two passes change. With the slow path inside the loop the fill took 1.6–2
 * times as long (the rare branch costs the hot loop its registers; bench/analysis.md). The
 * generator is written inline (the same steps as `Generator32.next`, two per row), its state in
 * local variables across the whole column.
 */
function fillNormal(g: Generator32, out: Float64Array, mean: number, sd: number): void {
  const st = g.s;
  let s0 = st[0]!, s1 = st[1]!, s2 = st[2]!, s3 = st[3]!;
  const n = out.length;
  // rows for the slow path and their layers (u waits in `out`)
  let rows = new Int32Array(64), layers = new Uint8Array(64), rejected = 0;
  for (let r = 0; r < n; r++) {
    let x = Math.imul(s1, 5), t = s1 << 9;
    const a = Math.imul((x << 7) | (x >>> 25), 9);
    s2 ^= s0, s3 ^= s1, s1 ^= s2, s0 ^= s3, s2 ^= t, s3 = (s3 << 11) | (s3 >>> 21);
    x = Math.imul(s1, 5), t = s1 << 9;
    const b = Math.imul((x << 7) | (x >>> 25), 9);
    s2 ^= s0, s3 ^= s1, s1 ^= s2, s0 ^= s3, s2 ^= t, s3 = (s3 << 11) | (s3 >>> 21);
    const u = 2 * (((a >>> 5) * TWO_POW_26 + (b >>> 6) + 0.5) / TWO_POW_53) - 1;
    const i = (b & 63) | ((a & 1) << 6);
    const ratio = ZIG_RATIO[i]!;
    out[r] = mean + sd * (u * ZIG_X[i]!);
    if (!(u < ratio && u > -ratio)) {
      if (rejected === rows.length) {
        const moreRows = new Int32Array(2 * rejected), moreLayers = new Uint8Array(2 * rejected);
        moreRows.set(rows);
        moreLayers.set(layers);
        rows = moreRows, layers = moreLayers;
      }
      rows[rejected] = r, layers[rejected++] = i;
      out[r] = u;
    }
  }
  st[0] = s0, st[1] = s1, st[2] = s2, st[3] = s3;
  for (let k = 0; k < rejected; k++) {
    const r = rows[k]!;
    out[r] = mean + sd * slowNormal(g, out[r]!, layers[k]!);
  }
}

/** Fills `out` with uniforms on (0, 1) ({@linkcode uniformFromWords} of two words each), the
 * generator written inline as in {@linkcode fillNormal}. */
function fillUniform(g: Generator32, out: Float64Array): void {
  const st = g.s;
  let s0 = st[0]!, s1 = st[1]!, s2 = st[2]!, s3 = st[3]!;
  for (let r = 0; r < out.length; r++) {
    let x = Math.imul(s1, 5), t = s1 << 9;
    const a = Math.imul((x << 7) | (x >>> 25), 9);
    s2 ^= s0, s3 ^= s1, s1 ^= s2, s0 ^= s3, s2 ^= t, s3 = (s3 << 11) | (s3 >>> 21);
    x = Math.imul(s1, 5), t = s1 << 9;
    const b = Math.imul((x << 7) | (x >>> 25), 9);
    s2 ^= s0, s3 ^= s1, s1 ^= s2, s0 ^= s3, s2 ^= t, s3 = (s3 << 11) | (s3 >>> 21);
    out[r] = ((a >>> 6) * TWO_POW_26 + (b >>> 6) + 0.5) / TWO_POW_52;
  }
  st[0] = s0, st[1] = s1, st[2] = s2, st[3] = s3;
}

/** Standard Student t by Bailey's polar method (Bailey 1994). */
function studentT(mt: Generator32, dof: number): number {
  for (;;) {
    const u = 2 * uniformOpen(mt) - 1;
    const v = 2 * uniformOpen(mt) - 1;
    const w = u * u + v * v;
    if (w <= 1 && w > 0) return u * Math.sqrt((dof * (w ** (-2 / dof) - 1)) / w);
  }
}

const N = 624;
const M = 397;

/** The MT19937 state recurrence over all 624 words, in place (Matsumoto & Nishimura 1998); the
 * same order of updates as the reference `genrand_int32` refill. */
function twist(mt: Int32Array): void {
  const step = (i: number, next: number, far: number) => {
    const y = (mt[i]! & -0x80000000) | (mt[next]! & 0x7fffffff);
    mt[i] = mt[far]! ^ (y >>> 1) ^ (-(y & 1) & 0x9908b0df);
  };
  for (let i = 0; i < N - M; i++) step(i, i + 1, i + M);
  for (let i = N - M; i < N - 1; i++) step(i, i + 1, i + M - N);
  step(N - 1, 0, M - 1);
}

/** MT19937 initialised by an array of 32-bit words: the reference `init_by_array`
 * (mt19937ar.c, Matsumoto & Nishimura 2002), handed to pure-rand as a twisted state. */
function mersenneFromKey(key: readonly number[]): ReturnType<typeof mersenne> {
  const mt = new Int32Array(N);
  mt[0] = 19650218;
  for (let i = 1; i < N; i++) {
    mt[i] = Math.imul(1812433253, mt[i - 1]! ^ (mt[i - 1]! >>> 30)) + i;
  }
  let i = 1, j = 0;
  for (let k = Math.max(N, key.length); k > 0; k--) {
    mt[i] = ((mt[i]! ^ Math.imul(mt[i - 1]! ^ (mt[i - 1]! >>> 30), 1664525)) + key[j]! + j) | 0;
    i++;
    j++;
    if (i >= N) {
      mt[0] = mt[N - 1]!;
      i = 1;
    }
    if (j >= key.length) j = 0;
  }
  for (let k = N - 1; k > 0; k--) {
    mt[i] = ((mt[i]! ^ Math.imul(mt[i - 1]! ^ (mt[i - 1]! >>> 30), 1566083941)) - i) | 0;
    i++;
    if (i >= N) {
      mt[0] = mt[N - 1]!;
      i = 1;
    }
  }
  mt[0] = -0x80000000; // 0x80000000: a non-zero initial state
  twist(mt);
  return mersenneFromState([0, ...mt]);
}

/**
 * The xoshiro128** state of a stream: the first four MT19937 words of the seed (reference
 * `init_genrand`) or key (reference `init_by_array`); should all four be zero (probability
 * 2⁻¹²⁸), the state [1, 0, 0, 0] instead.
 *
 * @param seed A seed or key, already checked.
 * @returns The four state words in [0, 2³² − 1].
 *
 * @example
 * ```ts
 * import { streamState } from "./random.ts";
 * import assert from "node:assert/strict";
 * // init_genrand(5489), the MT19937 reference default seed: first word 3499211612 (the same from
 * // numpy 2.4.6 MT19937._legacy_seeding(5489), see tests/uncertainty/random_test.ts)
 * assert.equal(streamState(5489)[0], 3499211612);
 * ```
 */
export function streamState(seed: number | readonly number[]): number[] {
  const mt = typeof seed === "number" ? mersenne(seed | 0) : mersenneFromKey(seed);
  const state = [mt.next() >>> 0, mt.next() >>> 0, mt.next() >>> 0, mt.next() >>> 0];
  return state.every((w) => w === 0) ? [1, 0, 0, 0] : state;
}

/** The xoshiro128** generator of a seed or key. */
function streamGenerator(seed: number | readonly number[]): Generator32 {
  return new Generator32(Int32Array.from(streamState(seed), (w) => w | 0));
}

/** Checks a seed: an integer in [1, 2³² − 1].
 * @throws {RangeError} Naming the seed and the valid range. */
export function checkSeed(seed: number): number {
  if (!(Number.isInteger(seed) && seed > 0 && seed < 2 ** 32)) {
    throw new RangeError(
      `Random stream: expected a seed that is an integer in [1, 2^32 - 1], got ${seed}`,
    );
  }
  return seed;
}

const isWord = (v: number) => Number.isInteger(v) && v >= 0 && v < 2 ** 32;

/**
 * Creates a seeded random stream: xoshiro128** whose state is the first four words of MT19937
 * started from one seed (reference `init_genrand`) or from a key of several 32-bit words
 * (reference `init_by_array`).
 *
 * @param seed A positive integer below 2³², or a non-empty array of integers in [0, 2³² − 1].
 * @returns The stream.
 * @throws {RangeError} For a seed that is not a positive integer below 2³², or a bad key.
 *
 * @example
 * ```ts
 * import { randomStream } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(randomStream(7).normal(), randomStream(7).normal());
 * // a key of several words, e.g. a run seed and a block index
 * assert.notEqual(randomStream([7, 0]).normal(), randomStream([7, 1]).normal());
 * ```
 */
export function randomStream(seed: number | readonly number[]): RandomStream {
  if (typeof seed !== "number") {
    if (!(Array.isArray(seed) && seed.length > 0 && seed.every(isWord))) {
      throw new RangeError(
        `Random stream: expected a key of one or more integers in [0, 2^32 - 1], got [${
          Array.isArray(seed) ? seed.join(", ") : String(seed)
        }]`,
      );
    }
  } else checkSeed(seed);
  const g = streamGenerator(seed);
  return {
    seed,
    uint32: () => g.next() >>> 0,
    uniform: () => uniformOpen(g),
    normal: () => normal(g),
    studentT: (dof: number) => studentT(g, dof),
    fillNormal: (out: Float64Array, mean = 0, sd = 1) => fillNormal(g, out, mean, sd),
    fillUniform: (out: Float64Array) => fillUniform(g, out),
  };
}
