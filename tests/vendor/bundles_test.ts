import assert from "node:assert/strict";
import * as bundled from "../../vendor/stdlib_math.js";
import * as mathBundle from "../../vendor/mathjs.js";
import tCdf from "@stdlib/stats-base-dists-t-cdf";
import normalQuantile from "@stdlib/stats-base-dists-normal-quantile";
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import fCdf from "@stdlib/stats-base-dists-f-cdf";
import chiSquareCdf from "@stdlib/stats-base-dists-chisquare-cdf";
import cos from "@stdlib/math-base-special-cos";
import { all, create } from "mathjs";
import { buildBundle, BUNDLES } from "../../vendor/build.ts";

Deno.test("the vendored @stdlib bundle gives the packages' own results, bit for bit", () => {
  // reference: the npm packages the bundle is built from (deno.json)
  for (const x of [-3.5, -1, -0.25, 0, 0.3, 1.7, 4, 12.5]) {
    for (const dof of [0.7, 1, 2.5, 5, 30]) {
      assert.equal(bundled.tCdf(x, dof), tCdf(x, dof));
      assert.equal(bundled.chiSquareCdf(Math.abs(x), dof), chiSquareCdf(Math.abs(x), dof));
      assert.equal(bundled.fCdf(Math.abs(x), dof, dof + 3), fCdf(Math.abs(x), dof, dof + 3));
    }
    assert.equal(bundled.normalCdf(x, 0.5, 2), normalCdf(x, 0.5, 2));
    assert.equal(bundled.cos(x), cos(x));
  }
  for (const p of [1e-9, 0.025, 0.5, 0.975, 1 - 1e-9]) {
    assert.equal(bundled.normalQuantile(p, 0, 1), normalQuantile(p, 0, 1));
  }
  // t(0.975, 5) CDF of the 97.5 % point 2.570581835636314 (tabulated t value, e.g. NIST/SEMATECH
  // e-Handbook of Statistical Methods §1.3.6.7.2: 2.571)
  assert.ok(Math.abs(bundled.tCdf(2.570581835636314, 5) - 0.975) < 1e-12);
});

Deno.test("the vendored mathjs bundle converts and differentiates as mathjs does", () => {
  // reference: the mathjs package the bundle is built from (deno.json)
  const ours = mathBundle.create(mathBundle.all!, {});
  const theirs = create(all!, {});
  for (const [text, unit] of [["21 mm", "cm"], ["1.2 L/min", "mL/s"], ["3 m/s", "cm/s"]]) {
    assert.equal(ours.unit(text!).toNumber(unit!), theirs.unit(text!).toNumber(unit!));
  }
  assert.equal(
    ours.derivative("4 * v^2", "v").toString(),
    theirs.derivative("4 * v^2", "v").toString(),
  );
  assert.equal(ours.lgamma(7.5), theirs.lgamma(7.5));
});

Deno.test("the vendored bundles are what vendor/build.ts makes from the pinned packages", async () => {
  for (const bundle of BUNDLES) {
    const current = await Deno.readTextFile(
      new URL(`../../vendor/${bundle.file}`, import.meta.url),
    );
    assert.equal(current === await buildBundle(bundle), true, `vendor/${bundle.file} is stale`);
  }
});
