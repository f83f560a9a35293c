import assert from "node:assert/strict";
import {
  CLINICAL_CAUTION,
  evaluate,
  normal,
  propagate,
  RIGHT_ATRIAL_PRESSURE_RANGES,
  rightAtrialPressureFromIvc,
  rightAtrialPressureRange,
  rvSystolicPressure,
} from "../../mod.ts";
import { close, shownText } from "./helpers.ts";

Deno.test("RA pressure: each IVC category carried as a rectangle over the guideline's range", () => {
  // Rudski 2010 (ranges confirmed in secondary summaries): normal 0–5 (3), intermediate 5–10
  // (8), high 10–20 (15) mmHg
  const cases = [
    [{ ivcDiameterCm: 1.8, ivcCollapsePercent: 60 }, "normal", 0, 5, 3],
    [{ ivcDiameterCm: 1.8, ivcCollapsePercent: 30 }, "intermediate", 5, 10, 8],
    [{ ivcDiameterCm: 2.5, ivcCollapsePercent: 60 }, "intermediate", 5, 10, 8],
    [{ ivcDiameterCm: 2.5, ivcCollapsePercent: 20 }, "high", 10, 20, 15],
  ] as const;
  for (const [ivc, category, lower, upper, point] of cases) {
    const ra = rightAtrialPressureRange(ivc);
    assert.deepEqual([ra.category, ra.lowerMmHg, ra.upperMmHg, ra.pointValueMmHg], [
      category,
      lower,
      upper,
      point,
    ]);
    // rectangular: estimate the midpoint, u = (b − a)/√12 (JCGM 100:2008 §4.3.7)
    close(ra.midpointMmHg, (lower + upper) / 2, 0, "midpoint");
    close(ra.standardUncertaintyMmHg, (upper - lower) / Math.sqrt(12), 1e-15, "u");
    assert.deepEqual(ra.input, { kind: "rectangular", lower, upper });
  }
  // the midpoint (2.5, 7.5) differs from the rule's point value (3, 8); for high both are 15
  const normalRa = rightAtrialPressureRange({ ivcDiameterCm: 1.8, ivcCollapsePercent: 60 });
  assert.match(normalRa.notes.join("\n"), /midpoint 2\.5 mmHg, not the rule's point value 3 mmHg/);
});

Deno.test("RA pressure: u(RVSP) includes the RA share range/√12", () => {
  for (
    const ivc of [{ ivcDiameterCm: 1.8, ivcCollapsePercent: 60 }, {
      ivcDiameterCm: 2.5,
      ivcCollapsePercent: 20,
    }]
  ) {
    const ra = rightAtrialPressureRange(ivc);
    const r = propagate(rvSystolicPressure, { trVelocity: normal(3, 0.1), rapMmHg: ra.input });
    // RVSP = 4v² + RAP: u² = (8·v·u_v)² + (range/√12)² (JCGM 100 eq. (10), hand-checkable)
    const range = ra.upperMmHg - ra.lowerMmHg;
    close(r.outputs.rvspMmHg.value, 36 + ra.midpointMmHg, 1e-9, "value");
    close(
      r.outputs.rvspMmHg.standardUncertainty,
      Math.hypot(2.4, range / Math.sqrt(12)),
      1e-6,
      "u",
    );
    const row = r.outputs.rvspMmHg.budget.find((b) => b.source === "rapMmHg")!;
    close(row.standardUncertainty, range / Math.sqrt(12), 1e-12, "RA budget row");
    // with the point value as an exact number the RA share is lost
    const point = propagate(rvSystolicPressure, {
      trVelocity: normal(3, 0.1),
      rapMmHg: ra.pointValueMmHg,
    });
    close(point.outputs.rvspMmHg.standardUncertainty, 2.4, 1e-6, "TR only");
  }
});

Deno.test("RA pressure: every branch of the rule falls in exactly one category range", () => {
  for (let d = 0.5; d <= 3.5; d += 0.05) {
    for (let c = 0; c <= 100; c += 2.5) {
      const point =
        evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: d, ivcCollapsePercent: c })
          .outputs.rapMmHg;
      const inside = RIGHT_ATRIAL_PRESSURE_RANGES.filter((r) =>
        point > r.lowerMmHg && point < r.upperMmHg
      );
      assert.equal(inside.length, 1, `${d} cm, ${c} %`);
    }
  }
});

Deno.test("RA pressure: the caution and the unverified mark travel with the result", () => {
  const ra = rightAtrialPressureRange({ ivcDiameterCm: 2.5, ivcCollapsePercent: 20 });
  assert.ok(ra.cautions.includes(CLINICAL_CAUTION));
  assert.ok(ra.cautions.some((c) => /not verified/.test(c)));
  const text = shownText(ra);
  assert.match(text, /not verified/);
  assert.match(text, /Caution: Not a diagnosis/);
  assert.throws(() => rightAtrialPressureRange({ ivcDiameterCm: -1, ivcCollapsePercent: 20 }), {
    name: "RangeError",
    message:
      "Right-atrial pressure from the IVC: expected 'ivcDiameterCm' (IVC diameter) in (0, 5] cm, got -1",
  });
  assert.throws(() => rightAtrialPressureRange(null as never), TypeError);
});
