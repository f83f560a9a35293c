import assert from "node:assert/strict";
import { biplaneDiscVolume, singlePlaneDiscVolume } from "../../calc/chamber/mod.ts";
import { discMethodChart, discMethodData } from "../../plot/chamber.ts";
import { halfEllipse } from "./shapes.ts";

Deno.test("method-of-discs chart data: contour, axis and one chord per disc in the axis frame", () => {
  // A rotated, shifted half-ellipse (L = 8, D = 4): in the long-axis frame the apex is at (0, 8)
  // and the hinge points at (±2, 0) (solid geometry; the frame undoes the placement).
  const c = halfEllipse(8, 4, 201, 0.9, 5, -3);
  const rows = discMethodData(
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

Deno.test("method-of-discs chart renders to SVG and rejects bad options", async () => {
  const result = singlePlaneDiscVolume(halfEllipse(8, 4, 101));
  const chart = discMethodChart(result);
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  assert.match(chart.title, /^Method of discs: 67\.0 mL \(20 discs, L = 8\.00 cm\)$/); // (π/6)·8·16 = 67.02
  assert.throws(() => discMethodChart(result, { heightPx: 10 }), {
    name: "RangeError",
    message: /^Method of discs chart: expected 'heightPx' in \[100, 2000\], got 10$/,
  });
  assert.throws(() => discMethodData({} as never), {
    name: "TypeError",
    message:
      /^Method of discs chart: expected a result of biplaneDiscVolume or singlePlaneDiscVolume, got object$/,
  });
});
