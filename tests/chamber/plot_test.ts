import assert from "node:assert/strict";
import { singlePlaneDiscVolume } from "../../calc/chamber/mod.ts";
import { discMethodChart } from "../../plot/chamber.ts";
import { halfEllipse } from "./shapes.ts";
import { svgText } from "../plot/svg_text.ts";

Deno.test("method-of-discs chart renders to SVG, with quantity labels, and rejects bad options", async () => {
  const result = singlePlaneDiscVolume(halfEllipse(8, 4, 101));
  const chart = discMethodChart(result);
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  // (π/6)·8·16 = 67.02 mL (solid geometry), shown at the chamber volume's resolution of 1 mL.
  assert.equal(chart.title, "Method of discs: 67 mL (20 discs, L = 8.00 cm)");
  // Axis titles are quantity labels with units, never code names.
  // (read from the SVG text: a title longer than its axis is drawn over several lines)
  const text = svgText(svg).replace(/\n/g, " ");
  assert.match(text, /Distance across the long axis \(cm\)/);
  assert.match(text, /Distance along the long axis from the annulus \(cm\)/);
  assert.throws(() => discMethodChart(result, { heightPx: 10 }), {
    name: "RangeError",
    message: "Method of discs chart: expected 'heightPx' (Panel height) in [100, 2000] px, got 10",
  });
  assert.throws(() => discMethodChart({} as never), {
    name: "TypeError",
    message:
      "Method of discs drawing: expected 'result' as a result of biplaneDiscVolume or singlePlaneDiscVolume, got a value of type object",
  });
});
