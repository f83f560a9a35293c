/**
 * Quantiles and distribution functions used across the project, delegated to the @stdlib
 * packages (well-kept, tested implementations) behind one small typed facade. The t, F and χ²
 * quantiles invert the library's own CDFs (calc/stats/invert.ts): the library's quantile functions
 * load a logging package that reads the whole environment at import, which the project refuses
 * (the calculation module runs with no permission at all).
 *
 * @module
 */
// the @stdlib packages, bundled into one file (vendor/build.ts): ≈ 20 ms to import instead of
// ≈ 250–700 ms for their hundreds of small modules
import {
  chiSquareCdf as chiSquareCdfImpl,
  fCdf as fCdfImpl,
  normalCdf as normalCdfImpl,
  normalQuantile as normalQuantileImpl,
  tCdf as tCdfImpl,
} from "../../vendor/stdlib_math.js";
import { quantileByInversion } from "./invert.ts";

function checkProbability(p: number, where: string): void {
  if (!(p >= 0 && p <= 1)) {
    throw new RangeError(`${where}: expected a probability in [0, 1], got ${p}`);
  }
}
function checkDof(dof: number, where: string): void {
  if (!(dof > 0)) throw new RangeError(`${where}: expected degrees of freedom > 0, got ${dof}`);
}

/**
 * Quantile of the standard normal distribution.
 *
 * @example
 * ```ts
 * import { normalQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Math.abs(normalQuantile(0.975) - 1.959963984540054) < 1e-12);
 * ```
 */
export function normalQuantile(p: number): number {
  checkProbability(p, "Normal quantile");
  return normalQuantileImpl(p, 0, 1);
}

/** Cumulative distribution function of the standard normal distribution.
 *
 * @example
 * ```ts
 * import { normalCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(normalCdf(0), 0.5);
 * ```
 */
export function normalCdf(z: number): number {
  if (Number.isNaN(z)) throw new RangeError(`Normal CDF: expected a number, got NaN`);
  return normalCdfImpl(z, 0, 1);
}

/**
 * Quantile of Student's t distribution with `dof` degrees of freedom (Infinity → normal).
 *
 * @example
 * ```ts
 * import { tQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // JCGM 100:2008 Table G.2: t_95.45(∞) = 2.00; t_99(16) = 2.92
 * assert.equal(tQuantile(0.995, 16).toFixed(2), "2.92");
 * ```
 */
export function tQuantile(p: number, dof: number): number {
  checkProbability(p, "Student t quantile");
  checkDof(dof, "Student t quantile");
  if (dof === Infinity) return normalQuantileImpl(p, 0, 1);
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  // the lower tail by symmetry: the CDF resolves small probabilities better than ones near 1
  if (p > 0.5) return -tQuantile(1 - p, dof);
  if (p === 0.5) return 0;
  return quantileByInversion((t) => tCdfImpl(t, dof), p, -Infinity, normalQuantileImpl(p, 0, 1));
}

/** Cumulative distribution function of Student's t distribution.
 *
 * @example
 * ```ts
 * import { tCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(tCdf(0, 5), 0.5);
 * ```
 */
export function tCdf(t: number, dof: number): number {
  checkDof(dof, "Student t CDF");
  return dof === Infinity ? normalCdfImpl(t, 0, 1) : tCdfImpl(t, dof);
}

/** Quantile of the F distribution with (d1, d2) degrees of freedom.
 *
 * @example
 * ```ts
 * import { fQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Standard F table (e.g. NIST/SEMATECH e-Handbook 1.3.6.7.3): F_0.95(5, 10) = 3.326
 * assert.equal(fQuantile(0.95, 5, 10).toFixed(3), "3.326");
 * ```
 */
export function fQuantile(p: number, d1: number, d2: number): number {
  checkProbability(p, "F quantile");
  checkDof(d1, "F quantile");
  checkDof(d2, "F quantile");
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  return quantileByInversion((x) => fCdfImpl(x, d1, d2), p, 0, 1);
}

/** Cumulative distribution function of the F distribution.
 *
 * @example
 * ```ts
 * import { fCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(fCdf(0, 3, 4), 0);
 * ```
 */
export function fCdf(x: number, d1: number, d2: number): number {
  checkDof(d1, "F CDF");
  checkDof(d2, "F CDF");
  return fCdfImpl(x, d1, d2);
}

/** Quantile of the χ² distribution.
 *
 * @example
 * ```ts
 * import { chiSquareQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Standard χ² table: χ²_0.95(1) = 3.841
 * assert.equal(chiSquareQuantile(0.95, 1).toFixed(3), "3.841");
 * ```
 */
export function chiSquareQuantile(p: number, dof: number): number {
  checkProbability(p, "Chi-square quantile");
  checkDof(dof, "Chi-square quantile");
  if (p === 0) return 0;
  if (p === 1) return Infinity;
  return quantileByInversion((x) => chiSquareCdfImpl(x, dof), p, 0, Math.max(dof, 1e-3));
}

/** Cumulative distribution function of the χ² distribution.
 *
 * @example
 * ```ts
 * import { chiSquareCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(chiSquareCdf(0, 2), 0);
 * ```
 */
export function chiSquareCdf(x: number, dof: number): number {
  checkDof(dof, "Chi-square CDF");
  return chiSquareCdfImpl(x, dof);
}
