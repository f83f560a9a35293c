/**
 * Uncertain values: recognising them, and the covariance and correlation of two of them — from
 * their linear parts for the GUM law (so values computed from shared inputs come out correlated
 * without anyone declaring it), from their trial-aligned samples for Monte Carlo.
 *
 * @module
 */
import type { UncertainValue } from "./types.ts";
import { linearCovariance, mergeSources } from "./sources.ts";

/**
 * True for an uncertain value returned by a propagation.
 *
 * @example
 * ```ts
 * import { isUncertainValue, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) });
 * assert.equal(isUncertainValue(r.outputs.gradient), true);
 * assert.equal(isUncertainValue(normal(4, 0.1)), false);
 * ```
 */
export function isUncertainValue(value: unknown): value is UncertainValue {
  return typeof value === "object" && value !== null &&
    (value as { kind?: unknown }).kind === "sonorigor.uncertainValue";
}

/**
 * The covariance of two uncertain values of the same method: for the GUM law the sum over their
 * shared sources (JCGM 100:2008 eq. (F.2)); for Monte Carlo the sample covariance of their
 * trial-aligned samples.
 *
 * @param a First value.
 * @param b Second value.
 * @returns u(a, b) in unit(a)·unit(b).
 * @throws {TypeError} For values of different methods, or Monte Carlo values of different runs.
 *
 * @example EDV and ESV from one LVIDd are correlated without a declared correlation
 * ```ts
 * import { covariance, normal, propagate, teichholzEjectionFraction } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(teichholzEjectionFraction, {
 *   lvInternalDiameterDiastoleCm: normal(5, 0.1), lvInternalDiameterSystoleCm: normal(3.5, 0.1),
 * });
 * // EF depends on both volumes, SV too: they share both sources
 * assert.ok(covariance(r.outputs.ejectionFractionPercent, r.outputs.strokeVolumeMl) > 0);
 * ```
 */
export function covariance(a: UncertainValue, b: UncertainValue): number {
  if (a.method !== b.method) {
    throw new TypeError(
      `Covariance: expected two values of the same method, got ${a.method} and ${b.method}`,
    );
  }
  if (a.method === "gum") {
    const set = mergeSources([a.sources, b.sources], "Covariance");
    return linearCovariance(set, a.sensitivities, b.sensitivities);
  }
  const x = a.samples, y = b.samples;
  if (x === null || y === null || x.length !== y.length || a.layout?.seed !== b.layout?.seed) {
    throw new TypeError(
      `Covariance: expected two Monte Carlo values of one run with their samples, got ${
        x?.length ?? 0
      } and ${y?.length ?? 0} samples`,
    );
  }
  const m = x.length;
  let mx = 0, my = 0;
  for (let i = 0; i < m; i++) {
    mx += x[i]!;
    my += y[i]!;
  }
  mx /= m;
  my /= m;
  let s = 0;
  for (let i = 0; i < m; i++) s += (x[i]! - mx) * (y[i]! - my);
  return s / (m - 1);
}

/**
 * The correlation coefficient of two uncertain values: covariance over the product of their
 * standard uncertainties (0 when either is exact).
 *
 * @example
 * ```ts
 * import { correlation, normal, propagate, bsaMosteller } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(bsaMosteller, { heightCm: normal(180, 1), weightKg: normal(80, 1) });
 * assert.ok(Math.abs(correlation(r.outputs.bsaM2, r.outputs.bsaM2) - 1) < 1e-12);
 * ```
 */
export function correlation(a: UncertainValue, b: UncertainValue): number {
  const d = a.standardUncertainty * b.standardUncertainty;
  return d > 0 ? covariance(a, b) / d : 0;
}
