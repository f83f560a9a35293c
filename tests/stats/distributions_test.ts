import assert from "node:assert/strict";
import { chiSquareQuantile, fQuantile, normalQuantile, tCdf, tQuantile } from "../../mod.ts";

// Reference quantiles: scipy.stats 1.17.1 (t.ppf, f.ppf, chi2.ppf), a general-purpose reference
// library, printed to full precision; the tables of JCGM 100:2008 G.2 agree to their 3 digits.
const relative = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

Deno.test("Student t quantiles against scipy.stats.t.ppf", () => {
  const cases: [number, number, number][] = [
    [0.975, 1, 12.706204736174694],
    [0.975, 2, 4.302652729749462],
    [0.975, 4, 2.7764451051977934],
    [0.995, 16, 2.9207816224251],
    [0.9999, 3, 22.203742273205],
    [0.025, 7, -2.3646242515927844],
    [0.9, 100.5, 1.29003207221386],
    [1e-6, 3, -103.29946778041935],
  ];
  for (const [p, dof, expected] of cases) {
    assert.ok(relative(tQuantile(p, dof), expected) < 1e-12, `t(${p}, ${dof})`);
  }
  assert.equal(tQuantile(0.5, 5), 0);
  assert.equal(tQuantile(0.975, Infinity), normalQuantile(0.975));
  // round trip through the CDF
  assert.ok(Math.abs(tCdf(tQuantile(0.3, 9), 9) - 0.3) < 1e-14);
});

Deno.test("F and χ² quantiles against scipy.stats.f.ppf and chi2.ppf", () => {
  const f: [number, number, number, number][] = [
    [0.95, 5, 10, 3.3258345304130104],
    [0.975, 1, 1, 647.7890114778442],
    [0.025, 3, 40, 0.07124278513657085],
    [0.99, 20, 2.5, 44.957488973970534],
  ];
  for (const [p, a, b, expected] of f) {
    assert.ok(relative(fQuantile(p, a, b), expected) < 1e-11, `F(${p}, ${a}, ${b})`);
  }
  const chi: [number, number, number][] = [
    [0.95, 1, 3.841458820694124],
    [0.999, 19, 43.82019596451753],
    [0.025, 2, 0.05063561596857975],
    [0.975, 0.5, 3.433235299960771],
    [1e-8, 10, 0.13232794458438146],
    [0.5, 200, 199.33372983863097],
  ];
  for (const [p, dof, expected] of chi) {
    assert.ok(relative(chiSquareQuantile(p, dof), expected) < 1e-11, `χ²(${p}, ${dof})`);
  }
  assert.equal(chiSquareQuantile(0, 3), 0);
  assert.equal(fQuantile(1, 3, 4), Infinity);
});

Deno.test("bad probabilities and degrees of freedom are refused, naming the value", () => {
  assert.throws(() => tQuantile(1.5, 3), {
    name: "RangeError",
    message: "Student t quantile: expected a probability in [0, 1], got 1.5",
  });
  assert.throws(() => chiSquareQuantile(0.5, 0), {
    name: "RangeError",
    message: "Chi-square quantile: expected degrees of freedom > 0, got 0",
  });
});
