import assert from "node:assert/strict";
import {
  biplaneDiscVolume,
  discMethodData,
  singlePlaneDiscVolume,
} from "../../calc/chamber/mod.ts";
import { halfEllipse } from "./shapes.ts";

Deno.test("method-of-discs drawing data: contour, axis and one chord per disc in the axis frame", () => {
  // A rotated, shifted half-ellipse (L = 8, D = 4): in the long-axis frame the apex is at (0, 8)
  // and the hinge points at (±2, 0) (solid geometry; the frame undoes the placement).
  const c = halfEllipse(8, 4, 201, 0.9, 5, -3);
  const { rows } = discMethodData(
    biplaneDiscVolume({ fourChamber: c, twoChamber: halfEllipse(8, 3, 201) }),
  );
  const four = rows.filter((r) => r.view === "apical four-chamber");
  const contour = four.filter((r) => r.kind === "contour");
  assert.equal(contour.length, 202); // 201 points + closing point
  const apex = contour[100]!;
  assert.ok(Math.abs(apex.x) < 1e-9 && Math.abs(apex.y - 8) < 1e-9);
  assert.ok(Math.abs(Math.abs(contour[0]!.x) - 2) < 1e-9 && Math.abs(contour[0]!.y) < 1e-9);
  const discs = four.filter((r) => r.kind === "disc");
  assert.equal(discs.length, 20); // convex: one chord per disc
  // Disc 0 at mid-slab 0.2 cm; width of the true ellipse there 4·√(1 − (0.2/8)²) = 3.99875 cm,
  // polygon error < 1e-3 (solid geometry).
  assert.ok(Math.abs(discs[0]!.y - 0.2) < 1e-12);
  assert.ok(Math.abs(discs[0]!.x2! - discs[0]!.x - 4 * Math.sqrt(1 - (0.2 / 8) ** 2)) < 1e-3);
  assert.equal(four.filter((r) => r.kind === "axis").length, 1);
  assert.equal(rows.filter((r) => r.view === "apical two-chamber" && r.kind === "disc").length, 20);
});

Deno.test("method-of-discs drawing data: the extent spans the annulus to the apex", () => {
  // Triangle (−2, 0), (0, 8), (2, 0): hinges at transverse ±2, apex 8 cm up the axis
  // (hand-checkable geometry).
  const d = discMethodData(singlePlaneDiscVolume([[-2, 0], [0, 8], [2, 0]]));
  assert.ok(Math.abs(d.axialExtent.lower) < 1e-12 && Math.abs(d.axialExtent.upper - 8) < 1e-12);
  assert.ok(Math.abs(d.transverseExtent.lower + 2) < 1e-12);
  assert.ok(Math.abs(d.transverseExtent.upper - 2) < 1e-12);
  assert.throws(() => discMethodData({} as never), {
    name: "TypeError",
    message:
      "Method of discs drawing: expected 'result' as a result of biplaneDiscVolume or singlePlaneDiscVolume, got a value of type object",
  });
});
