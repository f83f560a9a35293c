import assert from "node:assert/strict";
import { evaluate } from "../../calc/core/mod.ts";
import {
  areaLengthVolume,
  areaLengthVolumeFromContour,
  biplaneAreaLengthVolume,
  biplaneDiscVolume,
  biplaneEjectionFraction,
  contourArea,
  contourLongAxis,
  discSummationVolume,
  leftAtrialVolume,
  singlePlaneDiscVolume,
  validateContour,
} from "../../calc/chamber/mod.ts";
import { halfEllipse, halfEllipsoidVolume } from "./shapes.ts";

const rel = (a: number, b: number): number => a / b - 1;

// Midpoint-rule error of the discs on a half-ellipsoid (derived from solid geometry, hand-checkable):
// the disc area is π/4·D²·(1 − s²/L²); each slab of height h = L/N is sampled at its middle sᵢ and
// ∫ s² ds over the slab = h·sᵢ² + h³/12, so Σ undercounts ∫ s² by L·h²/12 and
// V_discs = (π/6)·L·D²·(1 + 1/(8N²)) exactly for the true ellipse. N = 20 → +3.125e-4.
const discBias = (n: number): number => 1 / (8 * n * n);

Deno.test("biplane discs on a prolate half-ellipsoid: 20-disc error bound", () => {
  // Exact volume (π/6)·L·D² of a half-ellipsoid (solid geometry), L = 8 cm, D = 4.5 cm.
  const c = halfEllipse(8, 4.5);
  const v = biplaneDiscVolume({ fourChamber: c, twoChamber: c });
  const exact = halfEllipsoidVolume(8, 4.5);
  const e = rel(v.volumeMl, exact);
  // Bound: |error| ≤ 4e-4 with 20 discs; and it equals the analytic midpoint bias 1/(8·20²)
  // within the polygonal-contour error (4001 points, < 1e-5).
  assert.ok(Math.abs(e) < 4e-4, `relative error ${e}`);
  assert.ok(Math.abs(e - discBias(20)) < 1e-5, `relative error ${e}`);
  assert.equal(v.discCount, 20);
  assert.ok(Math.abs(v.longAxisCm - 8) < 1e-12); // apex is the contour point (0, 8)
  assert.deepEqual(v.flags, []);
});

Deno.test("discs converge to (π/6)·L·D² as the disc count grows (second order)", () => {
  const c = halfEllipse(8, 4.5, 10001);
  const exact = halfEllipsoidVolume(8, 4.5);
  const err = (n: number): number =>
    rel(biplaneDiscVolume({ fourChamber: c, twoChamber: c }, { discCount: n }).volumeMl, exact);
  const e20 = err(20), e40 = err(40), e200 = err(200);
  // Analytic midpoint bias 1/(8N²) (derived above): 3.1e-4, 7.8e-5, 3.1e-6.
  assert.ok(Math.abs(e200) < 1e-5, `N = 200: ${e200}`);
  assert.ok(Math.abs(e200) < Math.abs(e40) && Math.abs(e40) < Math.abs(e20));
  // Doubling N divides the error by about 4 (second-order convergence of the midpoint rule).
  assert.ok(Math.abs(e20 / e40 - 4) < 0.05, `ratio ${e20 / e40}`);
  // A non-guideline disc count is flagged.
  const flagged = biplaneDiscVolume({ fourChamber: c, twoChamber: c }, { discCount: 40 });
  assert.deepEqual(flagged.flags, [
    "Method of discs volume: 'discCount' (Number of discs) = 40 lies outside the typical range [20, 20]: interpret with care",
  ]);
});

Deno.test("discs: triaxial half-ellipsoid, rotation and translation do not change the volume", () => {
  // Orthogonal planes of a half-ellipsoid with diameters 5 cm (four-chamber) and 4 cm
  // (two-chamber), L = 9 cm: exact (π/6)·L·D1·D2 (solid geometry).
  const a = halfEllipse(9, 5, 4001, 0.7, 3, -2); // rotated 0.7 rad and shifted
  const b = halfEllipse(9, 4, 4001, -1.9, -10, 4);
  const v = biplaneDiscVolume({ fourChamber: a, twoChamber: b }).volumeMl;
  const exact = halfEllipsoidVolume(9, 5, 4);
  assert.ok(Math.abs(rel(v, exact) - discBias(20)) < 1e-5, `relative error ${rel(v, exact)}`);
  // Hand-checkable: the reversed point order (other hinge first) gives the same volume.
  const v2 = biplaneDiscVolume({ fourChamber: [...a].reverse(), twoChamber: b }).volumeMl;
  assert.ok(Math.abs(v2 - v) < 1e-9);
});

Deno.test("discs use the longer long axis; a >10 % mismatch is flagged", () => {
  // Views of lengths 8 and 7.6 cm with the same diameter profile: diameters depend only on the
  // fraction of each axis, so V = (π/6)·max(L)·D1·D2·(1 + 1/(8N²)) (derived above).
  const v = biplaneDiscVolume({ fourChamber: halfEllipse(8, 5), twoChamber: halfEllipse(7.6, 4) });
  assert.ok(Math.abs(v.longAxisCm - 8) < 1e-12);
  assert.ok(Math.abs(rel(v.volumeMl, halfEllipsoidVolume(8, 5, 4)) - discBias(20)) < 1e-5);
  assert.deepEqual(v.flags, []); // 5 % difference: no flag
  const w = biplaneDiscVolume({ fourChamber: halfEllipse(8, 5), twoChamber: halfEllipse(7, 4) });
  assert.match(w.flags.join(" "), /Long axes differ by 12.5 %/); // (8 − 7)/8, common practice, no source
});

Deno.test("single-plane discs equal biplane discs with identical views", () => {
  // Hand-checkable from the formula: with aᵢ = bᵢ, Σ aᵢbᵢ = Σ aᵢ².
  const c = halfEllipse(7, 4);
  const s = singlePlaneDiscVolume(c).volumeMl;
  assert.ok(Math.abs(s - biplaneDiscVolume({ fourChamber: c, twoChamber: c }).volumeMl) < 1e-9);
  assert.ok(Math.abs(rel(s, halfEllipsoidVolume(7, 4)) - discBias(20)) < 1e-5);
});

Deno.test("disc summation formula on a cylinder", () => {
  // Solid geometry: 20 discs of diameter 4 cm over 8 cm form a cylinder, π·2²·8 = 32π mL.
  const r = evaluate(discSummationVolume, { diameterProductSumCm2: 20 * 16, longAxisCm: 8 });
  assert.ok(Math.abs(r.outputs.volumeMl - 32 * Math.PI) < 1e-12);
});

Deno.test("area–length: 0.85·A²/L against the exact ellipsoid volume", () => {
  // Solid geometry: a half-ellipse (semi-axes L and D/2) has area π·L·D/4; the half-ellipsoid
  // has volume (π/6)·L·D². 0.85·A²/L = 0.85·π²·L·D²/16, so the ratio is 0.85·3π/8 = 1.00138
  // (8/(3π) = 0.8488 would be exact; Lang 2015 writes 0.85).
  const L = 8, D = 4.5, A = (Math.PI * L * D) / 4;
  const v = evaluate(areaLengthVolume, { areaCm2: A, lengthCm: L }).outputs.volumeMl;
  assert.ok(Math.abs(v / halfEllipsoidVolume(L, D) - (0.85 * 3 * Math.PI) / 8) < 1e-12);
  // From a traced contour: shoelace area within the polygon error of the exact ellipse area.
  const r = areaLengthVolumeFromContour(halfEllipse(L, D));
  assert.ok(Math.abs(rel(r.areaCm2, A)) < 1e-6);
  assert.ok(Math.abs(r.volumeMl / halfEllipsoidVolume(L, D) - (0.85 * 3 * Math.PI) / 8) < 1e-5);
  // Biplane form with equal areas reduces to the single-plane form (hand-checkable).
  const b = evaluate(biplaneAreaLengthVolume, {
    fourChamberAreaCm2: A,
    twoChamberAreaCm2: A,
    lengthCm: L,
  }).outputs.volumeMl;
  assert.ok(Math.abs(b - v) < 1e-12);
  // Hand-checkable: A = 30 cm², L = 8.5 cm → 0.85·900/8.5 = 90 mL.
  assert.ok(
    Math.abs(evaluate(areaLengthVolume, { areaCm2: 30, lengthCm: 8.5 }).outputs.volumeMl - 90) <
      1e-12,
  );
});

Deno.test("contour geometry: long axis, apex, area", () => {
  // Hand-checkable: triangle (−2, 0), (0, 8), (2, 0): annulus midpoint (0, 0), apex (0, 8), L = 8,
  // area ½·4·8 = 16 cm².
  const c = validateContour([[-2, 0], { x: 0, y: 8 }, [2, 0]], "Test", "apical four-chamber");
  const axis = contourLongAxis(c);
  assert.deepEqual(axis.annulusMidpoint, [0, 0]);
  assert.deepEqual(axis.apex, [0, 8]);
  assert.equal(axis.apexIndex, 1);
  assert.equal(axis.lengthCm, 8);
  assert.equal(axis.annulusWidthCm, 4);
  assert.equal(contourArea(c), 16);
});

Deno.test("ejection fraction from traced contours", () => {
  // EDV, ESV of half-ellipsoids (solid geometry, (π/6)·L·D²·(1 + 1/3200) with 20 discs):
  // ED L = 8, D = 5 → 104.72 mL; ES L = 7, D = 3.5 → 44.90 mL; EF = 1 − (7·12.25)/(8·25) = 57.125 %.
  const r = biplaneEjectionFraction({
    endDiastole: { fourChamber: halfEllipse(8, 5), twoChamber: halfEllipse(8, 5) },
    endSystole: { fourChamber: halfEllipse(7, 3.5), twoChamber: halfEllipse(7, 3.5) },
  });
  assert.ok(Math.abs(r.ejectionFractionPercent - 57.125) < 1e-3, `${r.ejectionFractionPercent}`);
  assert.ok(Math.abs(r.strokeVolumeMl - r.endDiastole.volumeMl + r.endSystole.volumeMl) < 1e-12);
  assert.throws(
    () =>
      biplaneEjectionFraction({
        endDiastole: { fourChamber: halfEllipse(7, 3.5), twoChamber: halfEllipse(7, 3.5) },
        endSystole: { fourChamber: halfEllipse(8, 5), twoChamber: halfEllipse(8, 5) },
      }),
    {
      name: "RangeError",
      message:
        /^Biplane ejection fraction: expected 'endSystolicVolumeMl' \(LV end-systolic volume\) ≤ 'endDiastolicVolumeMl' \(LV end-diastolic volume\), got endSystolicVolumeMl = 104\.75\d* mL, endDiastolicVolumeMl = 44\.91\d* mL$/,
    },
  );
  assert.throws(
    () =>
      biplaneEjectionFraction({
        endDiastole: { fourChamber: halfEllipse(8, 5), twoChamber: halfEllipse(8, 5) },
        endSystole: { fourChamber: halfEllipse(7, 3.5), twoChamber: [[0, 0], [1, 1]] },
      }),
    {
      name: "RangeError",
      message:
        "Biplane ejection fraction: expected 'endSystole.twoChamber' (end-systolic apical two-chamber contour) with 3 to 20000 points, got 2 points",
    },
  );
});

Deno.test("left atrial volume: area–length uses the shorter axis, discs the longer", () => {
  // LA as half-ellipsoids: four-chamber L = 5.4, two-chamber L = 5.0, D = 4 cm both.
  // Areas π·L·D/4 (solid geometry); area–length 0.85·A4·A2/min(L) (Lang 2015, from memory).
  const a = halfEllipse(5.4, 4), b = halfEllipse(5, 4);
  const r = leftAtrialVolume({ fourChamber: a, twoChamber: b }, { bodySurfaceAreaM2: 1.8 });
  const A4 = (Math.PI * 5.4 * 4) / 4, A2 = (Math.PI * 5 * 4) / 4;
  assert.equal(r.areaLengthLengthCm, 5);
  assert.ok(Math.abs(rel(r.areaLengthMl, (0.85 * A4 * A2) / 5)) < 1e-5);
  assert.ok(Math.abs(r.discs.longAxisCm - 5.4) < 1e-12);
  assert.ok(Math.abs(rel(r.discsMl, halfEllipsoidVolume(5.4, 4)) - discBias(20)) < 1e-5);
  // Hand-checkable indexing: V/BSA.
  assert.ok(Math.abs(r.discsIndexMlPerM2! - r.discsMl / 1.8) < 1e-12);
  assert.ok(Math.abs(r.areaLengthIndexMlPerM2! - r.areaLengthMl / 1.8) < 1e-12);
  assert.throws(
    () => leftAtrialVolume({ fourChamber: a, twoChamber: b }, { bodySurfaceAreaM2: 0 }),
    {
      name: "RangeError",
      message:
        "Left atrial volume: expected 'bodySurfaceAreaM2' (Body surface area) in (0, 5] m², got 0",
    },
  );
  assert.throws(
    () => leftAtrialVolume({ fourChamber: a, twoChamber: [[0, 0], [1, 2], [1, 0], [0, 2]] }),
    {
      name: "RangeError",
      message:
        /^Left atrial volume: expected 'twoChamber' \(apical two-chamber contour\) not to cross itself/,
    },
  );
});

Deno.test("contour functions: bad arguments are named by the validator", () => {
  assert.throws(() => biplaneDiscVolume(null as never), {
    name: "TypeError",
    message:
      "Biplane method of discs: expected 'contours' as an object with 'fourChamber' and 'twoChamber' contours, got null",
  });
  const c = halfEllipse(8, 4, 101);
  assert.throws(() => biplaneDiscVolume({ fourChamber: c, twoChamber: c }, { discCount: 0 }), {
    name: "RangeError",
    message:
      "Biplane method of discs: expected 'discCount' (Number of discs) in [1, 100000], got 0",
  });
  assert.throws(
    () => biplaneEjectionFraction({ endDiastole: { fourChamber: c, twoChamber: c } } as never),
    {
      name: "TypeError",
      message:
        "Biplane ejection fraction: expected 'endSystole' as an object with 'fourChamber' and 'twoChamber' contours, got nothing",
    },
  );
  // A disc count given as a quantity string is read like any count (hand-checkable: "20").
  assert.equal(
    biplaneDiscVolume({ fourChamber: c, twoChamber: c }, { discCount: "20" as never }).discCount,
    20,
  );
});

Deno.test("disc volume calculations take their inputs as quantities", () => {
  assert.equal(discSummationVolume.inputs.discCount.default, 20); // the guideline method (Lang 2015)
  assert.equal(biplaneAreaLengthVolume.inputs.fourChamberAreaCm2.label, "Apical four-chamber area");
  assert.equal(
    biplaneAreaLengthVolume.inputs.twoChamberAreaCm2.quantity,
    areaLengthVolume.inputs.areaCm2.quantity,
  );
  assert.equal(areaLengthVolume.outputs.volumeMl.quantity.id, "chamberVolume");
});
