/**
 * What a chart of uncertainty results draws, computed here so that charts compute nothing: a
 * probability-density histogram of Monte Carlo model values, and the density of the GUM result's
 * distribution (normal, or scaled and shifted t with ν_eff degrees of freedom).
 *
 * @module
 */
import type { Interval, UncertainValue } from "./types.ts";
import { coverageIntervals } from "./intervals.ts";

/** One bar of a density histogram. */
export interface HistogramBar {
  /** Left edge. */
  readonly start: number;
  /** Right edge. */
  readonly end: number;
  /** Share of the values in the bar divided by its width. */
  readonly density: number;
}

/**
 * A probability-density histogram of samples over a range (values outside are not counted).
 *
 * @param samples The values.
 * @param range The histogram's range.
 * @param bins Number of bars, ≥ 1.
 * @returns The bars, left to right.
 * @throws {RangeError} For an empty range or a bad bin count.
 *
 * @example
 * ```ts
 * import { densityHistogram } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const bars = densityHistogram(Float64Array.of(0.1, 0.2, 0.7), { lower: 0, upper: 1 }, 2);
 * // two of three values in [0, 0.5): density (2/3)/0.5
 * assert.ok(Math.abs(bars[0]!.density - 4 / 3) < 1e-12);
 * ```
 */
export function densityHistogram(
  samples: Float64Array,
  range: Interval,
  bins: number,
): HistogramBar[] {
  if (!(Number.isInteger(bins) && bins >= 1)) {
    throw new RangeError(`Histogram: expected bins to be an integer >= 1, got ${bins}`);
  }
  const { lower: lo, upper: hi } = range;
  if (!(hi > lo)) {
    throw new RangeError(`Histogram: expected an increasing range, got [${lo}, ${hi}]`);
  }
  const width = (hi - lo) / bins;
  const counts = new Float64Array(bins);
  for (let i = 0; i < samples.length; i++) {
    const b = Math.floor((samples[i]! - lo) / width);
    if (b >= 0 && b < bins) counts[b]!++;
  }
  return Array.from(counts, (c, b) => ({
    start: lo + b * width,
    end: lo + (b + 1) * width,
    density: c / (samples.length * width),
  }));
}

/**
 * The range a histogram of a Monte Carlo value should show: its 99.9 % probabilistically
 * symmetric interval, widened to hold the value's reported and shortest intervals and any others
 * given (a GUM interval to compare).
 *
 * @example
 * ```ts
 * import { histogramRange, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const m = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) },
 *   { method: "monteCarlo", trials: 10_000, seed: 1 });
 * const r = histogramRange(m.outputs.gradient);
 * assert.ok(r.lower < m.outputs.gradient.interval.lower && r.upper > m.outputs.gradient.interval.upper);
 * ```
 */
export function histogramRange(v: UncertainValue, ...others: Interval[]): Interval {
  if (v.samples === null) {
    throw new TypeError(
      `Histogram: '${v.name}' holds no samples (a Monte Carlo value with keepSamples is needed)`,
    );
  }
  const wide = coverageIntervals(v.samples, 0.999).symmetric;
  const all = [wide, v.interval, ...(v.shortestInterval ? [v.shortestInterval] : []), ...others];
  return {
    lower: all.reduce((m, i) => Math.min(m, i.lower), Infinity),
    upper: all.reduce((m, i) => Math.max(m, i.upper), -Infinity),
  };
}

/**
 * The probability density of a GUM result's distribution over a range: normal N(y, u²), as the
 * GUM law summarises the output (JCGM 100:2008 §G.6), at evenly spaced points.
 *
 * @example
 * ```ts
 * import { gumDensity, normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const g = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }).outputs.gradient;
 * const [p] = gumDensity(g, { lower: 64, upper: 65 }, 2);
 * // N(64, 3.2²) at its mean: 1/(3.2·√(2π))
 * assert.ok(Math.abs(p!.density - 1 / (3.2 * Math.sqrt(2 * Math.PI))) < 1e-9);
 * ```
 */
export function gumDensity(
  v: UncertainValue,
  range: Interval,
  points = 201,
): { x: number; density: number }[] {
  const u = v.standardUncertainty;
  if (!(u > 0)) return [];
  const out: { x: number; density: number }[] = [];
  for (let k = 0; k < points; k++) {
    const x = range.lower + ((range.upper - range.lower) * k) / (points - 1);
    const z = (x - v.value) / u;
    out.push({ x, density: Math.exp(-0.5 * z * z) / (u * Math.sqrt(2 * Math.PI)) });
  }
  return out;
}
