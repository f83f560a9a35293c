/**
 * Seeded random streams for Monte Carlo.
 *
 * The generator is the Mersenne Twister MT19937 (Matsumoto & Nishimura 1998) from the well-kept
 * `pure-rand` package. On top of it:
 *
 * - uniform: 53-bit doubles from two 32-bit draws (the genrand_res53 construction of the MT
 *   reference code), on the open interval (0, 1);
 * - normal: the ziggurat method of Marsaglia & Tsang (2000, J Stat Softw 5(8)) in the improved form
 *   of Doornik (2005, "An Improved Ziggurat Method to Generate Normal Random Samples"): 128 layers,
 *   a 53-bit uniform for the abscissa and separate bits for the layer, exact tail sampling. It is
 *   written here because the library ziggurat we tried (@stdlib) costs about four times as much
 *   per draw through its wrapper; it is checked in tests/uncertainty/random.test.ts against
 *   reference moments, a Kolmogorov–Smirnov test and a χ² goodness-of-fit test;
 * - Student t: Bailey's polar method (Bailey 1994, Math Comp 62:779–781), exact for any ν > 0.
 *
 * The same seed gives the same numbers, bit for bit.
 *
 * @module
 */
import { mersenne } from "pure-rand/generator/mersenne";

/** A seeded stream of random numbers. */
export interface RandomStream {
  /** The seed that started the stream. */
  readonly seed: number;
  /** Uniform on the open interval (0, 1), 53-bit resolution. */
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
const TWO_POW_26 = 67108864;
const TWO_POW_53 = 9007199254740992;

/**
 * Creates a seeded random stream.
 *
 * @param seed A positive integer below 2³².
 * @returns The stream.
 * @throws {RangeError} For a seed that is not a positive integer below 2³².
 *
 * @example
 * ```ts
 * import { randomStream } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(randomStream(7).normal(), randomStream(7).normal());
 * ```
 */
export function randomStream(seed: number): RandomStream {
  if (!(Number.isInteger(seed) && seed > 0 && seed < 2 ** 32)) {
    throw new RangeError(
      `Random stream: expected a seed that is an integer in [1, 2^32 - 1], got ${seed}`,
    );
  }
  const mt = mersenne(seed | 0);
  const uniform = (): number => {
    const a = mt.next() >>> 5;
    const b = mt.next() >>> 6;
    return (a * TWO_POW_26 + b + 0.5) / TWO_POW_53;
  };
  const tail = (negative: boolean): number => {
    let x: number, y: number;
    do {
      x = Math.log(uniform()) / R;
      y = Math.log(uniform());
    } while (-2 * y < x * x);
    return negative ? x - R : R - x;
  };
  const normal = (): number => {
    for (;;) {
      const a = mt.next();
      const b = mt.next();
      // 53-bit uniform on (−1, 1) from the high bits; the layer from the low bits of both draws
      const u = 2 * (((a >>> 5) * TWO_POW_26 + (b >>> 6) + 0.5) / TWO_POW_53) - 1;
      const i = (b & 63) | ((a & 1) << 6);
      if (Math.abs(u) < ZIG_RATIO[i]!) return u * ZIG_X[i]!;
      if (i === 0) return tail(u < 0);
      const x = u * ZIG_X[i]!;
      const f0 = Math.exp(-0.5 * (ZIG_X[i]! * ZIG_X[i]! - x * x));
      const f1 = Math.exp(-0.5 * (ZIG_X[i + 1]! * ZIG_X[i + 1]! - x * x));
      if (f1 + uniform() * (f0 - f1) < 1) return x;
    }
  };
  const studentT = (dof: number): number => {
    for (;;) {
      const u = 2 * uniform() - 1;
      const v = 2 * uniform() - 1;
      const w = u * u + v * v;
      if (w <= 1 && w > 0) return u * Math.sqrt((dof * (w ** (-2 / dof) - 1)) / w);
    }
  };
  return {
    seed,
    uniform,
    normal,
    studentT,
    fillNormal(out: Float64Array, mean = 0, sd = 1): void {
      const m = out.length;
      for (let r = 0; r < m; r++) {
        // fast path of the ziggurat inlined; the rare wedge and tail cases call normal()
        const a = mt.next();
        const b = mt.next();
        const u = 2 * (((a >>> 5) * TWO_POW_26 + (b >>> 6) + 0.5) / TWO_POW_53) - 1;
        const i = (b & 63) | ((a & 1) << 6);
        let z: number;
        if (Math.abs(u) < ZIG_RATIO[i]!) z = u * ZIG_X[i]!;
        else if (i === 0) z = tail(u < 0);
        else {
          const x = u * ZIG_X[i]!;
          const f0 = Math.exp(-0.5 * (ZIG_X[i]! * ZIG_X[i]! - x * x));
          const f1 = Math.exp(-0.5 * (ZIG_X[i + 1]! * ZIG_X[i + 1]! - x * x));
          z = f1 + uniform() * (f0 - f1) < 1 ? x : normal();
        }
        out[r] = mean + sd * z;
      }
    },
    fillUniform(out: Float64Array): void {
      for (let r = 0; r < out.length; r++) out[r] = uniform();
    },
  };
}
