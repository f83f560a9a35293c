import assert from "node:assert/strict";
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import {
  evaluate,
  normal,
  propagate,
  rightAtrialPressureFromIvc,
  rvSystolicPressure,
  rvSystolicPressureFromIvc,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("RA pressure from the IVC follows Rudski et al. 2010", () => {
  const rap = (ivcDiameterCm: number, ivcCollapsePercent: number) =>
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm, ivcCollapsePercent }).outputs.rapMmHg;
  // Rudski 2010: ≤ 2.1 cm and > 50 % collapse → 3 mmHg
  assert.equal(rap(1.8, 60), 3);
  // boundary diameter 2.1 cm is still "≤ 2.1"
  assert.equal(rap(2.1, 51), 3);
  // > 2.1 cm and < 50 % → 15 mmHg
  assert.equal(rap(2.5, 30), 15);
  // mixed findings → 8 mmHg (both "other" combinations, and exactly 50 %)
  assert.equal(rap(2.5, 60), 8);
  assert.equal(rap(1.8, 30), 8);
  assert.equal(rap(1.8, 50), 8);
  assert.throws(
    () => evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 1.8, ivcCollapsePercent: 120 }),
    {
      name: "RangeError",
      message:
        /^Right-atrial pressure from the IVC: expected 'ivcCollapsePercent' \(IVC collapse with sniff\) in \[0, 100\] %, got 120$/,
    },
  );
});

Deno.test("RV systolic pressure = 4v² + RAP", () => {
  // Rudski 2010: RVSP = 4v² + RAP; 2.8 m/s + 3 mmHg = 31.36 + 3 = 34.36 (hand-checkable)
  close(
    evaluate(rvSystolicPressure, { trVelocity: 2.8, rapMmHg: 3 }).outputs.rvspMmHg,
    34.36,
    1e-9,
  );
  // composed with the IVC rule: 3.4 m/s, IVC 2.4 cm, 20 % → 46.24 + 15 = 61.24 (hand-checkable)
  const r = evaluate(rvSystolicPressureFromIvc, {
    trVelocity: 3.4,
    ivcDiameterCm: 2.4,
    ivcCollapsePercent: 20,
  }).outputs;
  close(r.rvspMmHg, 61.24, 1e-9);
  assert.equal(r.rapMmHg, 15);
  assert.throws(() => evaluate(rvSystolicPressure, { trVelocity: -2, rapMmHg: 3 }), {
    name: "RangeError",
    message:
      /^RV systolic pressure: expected 'trVelocity' \(Peak TR velocity\) in \[0, 7\] m\/s, got -2$/,
  });
});

/** The hand-written composite that the chain replaced (before the redesign), for comparison. */
function oldRvspComposite(
  x: { trVelocity: number; ivcDiameterCm: number; ivcCollapsePercent: number },
) {
  const { rapMmHg } = rightAtrialPressureFromIvc.formula(x);
  return { ...rvSystolicPressure.formula({ trVelocity: x.trVelocity, rapMmHg }), rapMmHg };
}

Deno.test("RVSP chain equals the old composite and keeps its public keys", () => {
  assert.equal(rvSystolicPressureFromIvc.id, "rvSystolicPressureFromIvc");
  assert.equal(rvSystolicPressureFromIvc.title, "RV systolic pressure (RA pressure from the IVC)");
  assert.deepEqual(rvSystolicPressureFromIvc.outputNames, ["rvspMmHg", "rapMmHg"]);
  assert.deepEqual([...rvSystolicPressureFromIvc.inputNames].sort(), [
    "ivcCollapsePercent",
    "ivcDiameterCm",
    "trVelocity",
  ]);
  // every branch of the Rudski 2010 rule, boundaries included (values hand-checkable)
  for (
    const [d, c] of [[1.8, 60], [2.1, 51], [2.5, 30], [2.5, 60], [1.8, 30], [1.8, 50], [2.11, 49]]
  ) {
    const x = { trVelocity: 3.1, ivcDiameterCm: d!, ivcCollapsePercent: c! };
    assert.deepEqual(evaluate(rvSystolicPressureFromIvc, x).outputs, oldRvspComposite(x));
  }
  // 4·3.1² + 15 = 53.44 mmHg for a dilated, non-collapsing IVC (hand-checkable)
  close(
    evaluate(rvSystolicPressureFromIvc, {
      trVelocity: 3.1,
      ivcDiameterCm: 2.5,
      ivcCollapsePercent: 30,
    }).outputs.rvspMmHg,
    53.44,
    1e-9,
  );
});

Deno.test("RVSP chain: GUM u from the TR velocity is 8·v·u(v)", () => {
  // JCGM 100 eq. (10): c = ∂(4v² + RAP)/∂v = 8v; v = 3.2 ± 0.1 m/s → u = 8·3.2·0.1 = 2.56 mmHg
  const r = propagate(rvSystolicPressureFromIvc, {
    trVelocity: normal(3.2, 0.1),
    ivcDiameterCm: 2.5,
    ivcCollapsePercent: 20,
  });
  close(r.outputs.rvspMmHg.standardUncertainty, 2.56, 1e-6, "u(RVSP)");
  close(r.outputs.rvspMmHg.value, 4 * 3.2 ** 2 + 15, 1e-9, "RVSP");
  // the categorical RA pressure has no slope: it adds nothing to the first-order u
  close(r.outputs.rapMmHg.standardUncertainty, 0, 1e-12, "u(RAP)");
});

Deno.test("RVSP chain: an IVC near the 2.1 cm cut-off — GUM warns, Monte Carlo sees the jump", () => {
  const inputs = { trVelocity: 3, ivcDiameterCm: normal(2.2, 0.1), ivcCollapsePercent: 20 };
  // first order: the rule is flat at 2.2 cm, but within ±u it jumps from 15 to 8 mmHg
  const g = propagate(rvSystolicPressureFromIvc, inputs);
  assert.ok(
    g.warnings.some((w) =>
      /inadequate for RV systolic pressure with respect to IVC diameter/.test(w)
    ),
    `expected a first-order warning, got ${JSON.stringify(g.warnings)}`,
  );
  // Rudski 2010 rule with collapse 20 %: RAP = 15 if d > 2.1 cm, else 8. P(d > 2.1) = Φ(1)
  // = 0.841345 (normal CDF from the @stdlib reference library), so E[RAP] = 8 + 7·0.841345
  // = 13.8894 mmHg and E[RVSP] = 4·3² + E[RAP] = 49.8894 mmHg
  const pHigh = 1 - normalCdf(2.1, 2.2, 0.1);
  close(pHigh, 0.841345, 1e-6, "Φ(1)");
  const m = propagate(rvSystolicPressureFromIvc, inputs, {
    method: "monteCarlo",
    trials: 100_000,
    seed: 13,
  });
  // Monte Carlo standard error: 7·√(p(1 − p)/M) = 0.008 mmHg; tolerance 4 standard errors
  close(m.outputs.rapMmHg.value, 8 + 7 * pHigh, 0.033, "E[RAP]");
  close(m.outputs.rvspMmHg.value, 36 + 8 + 7 * pHigh, 0.033, "E[RVSP]");
  // u(RAP) = 7·√(p(1 − p)) = 2.558 mmHg (Bernoulli variance; hand computation)
  close(m.outputs.rapMmHg.standardUncertainty, 7 * Math.sqrt(pHigh * (1 - pHigh)), 0.02, "u(RAP)");
});
