/**
 * The adaptive Monte Carlo procedure (JCGM 101:2008 §7.9) stabilises the interval it reports:
 * the probabilistically symmetric one, or the shortest one when that is asked for.
 */
import assert from "node:assert/strict";
import { normal, propagate } from "../../mod.ts";
import { comparisonLoss } from "./jcgm101_models.ts";
import { sequenceStatistics } from "../../calc/uncertainty/adaptive.ts";

/** JCGM 101:2008 §7.7 applied literally to a fully sorted copy: the shortest interval. */
function shortestBySort(a: Float64Array, p: number): { lower: number; upper: number } {
  const s = a.slice().sort();
  const m = s.length, pm = p * m;
  const q = Math.min(m - 1, Number.isInteger(pm) ? pm : Math.floor(pm + 0.5));
  let best = Infinity, lower = 0, upper = 0;
  for (let k = 1; k + q <= m; k++) {
    if (s[k + q - 1]! - s[k - 1]! < best) {
      best = s[k + q - 1]! - s[k - 1]!;
      lower = s[k - 1]!;
      upper = s[k + q - 1]!;
    }
  }
  return { lower, upper };
}

Deno.test("adaptive statistics of a sequence follow the reported interval: shortest ends when asked", () => {
  // a skewed column where the two intervals differ: the χ²₂ quantiles −2 ln(1 − u) at
  // u = (i + ½)/n, in a scrambled order (i·7919 mod n, 7919 prime to n)
  const n = 10_001;
  const col = new Float64Array(n);
  for (let i = 0; i < n; i++) col[(i * 7919) % n] = -2 * Math.log(1 - (i + 0.5) / n);
  const [shortest] = sequenceStatistics([col], 0.95, "shortest");
  const [symmetric] = sequenceStatistics([col], 0.95, "symmetric");
  const ref = shortestBySort(col, 0.95); // JCGM 101:2008 §7.7, by a full sort
  assert.equal(shortest!.low, ref.lower);
  assert.equal(shortest!.high, ref.upper);
  // the symmetric interval of a χ²₂ column starts well above its minimum (analytic: the 2.5 %
  // point of χ²₂ is −2 ln 0.975 = 0.0506), so the two are not the same ends
  assert.ok(symmetric!.low > 0.03 && shortest!.low < 0.01, `${symmetric!.low} ${shortest!.low}`);
});

Deno.test("adaptive Monte Carlo with the shortest interval: JCGM 101 §9.4 comparison loss stabilises", () => {
  const r = propagate(comparisonLoss, { x1: normal(0, 0.005), x2: normal(0, 0.005) }, {
    method: "monteCarlo",
    adaptive: { significantDigits: 1 },
    interval: "shortest",
    seed: 21,
  });
  assert.ok(r.monteCarlo!.adaptive!.stabilized);
  const dY = r.outputs.dY;
  // δY/u² ~ χ²₂ (analytic): shortest 95 % interval [0, −2u²·ln 0.05] = [0, 1.50e-4];
  // JCGM 101:2008 Table 10 prints [0.000 000, 0.000 150]
  const tolerance = r.monteCarlo!.adaptive!.tolerance.dY!;
  assert.ok(dY.interval.lower < tolerance, String(dY.interval.lower));
  assert.ok(
    Math.abs(dY.interval.upper - -2 * 25e-6 * Math.log(0.05)) < 2 * tolerance,
    `${dY.interval.upper} ± ${tolerance}`,
  );
});
