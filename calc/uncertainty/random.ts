/**
 * Seeded random streams for Monte Carlo: one Mersenne Twister (MT19937) stream per run, from the
 * @stdlib packages, feeding a ziggurat normal sampler and a Student t sampler. The same seed
 * gives the same numbers, bit for bit.
 *
 * @module
 */
import mt19937 from "@stdlib/random-base-mt19937";
import ziggurat from "@stdlib/random-base-improved-ziggurat";
import studentT from "@stdlib/random-base-t";

/** A seeded stream of random numbers. */
export interface RandomStream {
  /** The seed that started the stream. */
  readonly seed: number;
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Standard normal. */
  normal(): number;
  /** Standard Student t with `dof` degrees of freedom. */
  studentT(dof: number): number;
}

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
  const base = mt19937.factory({ seed });
  const uniform = (base as unknown as { normalized: () => number }).normalized;
  const normal = ziggurat.factory({ prng: uniform });
  const t = studentT.factory({ prng: uniform });
  return {
    seed,
    uniform,
    normal: () => normal(),
    studentT: (dof: number) => t(dof),
  };
}
