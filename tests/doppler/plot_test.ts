import assert from "node:assert/strict";
import { AORTIC_STENOSIS_2017, gradeSeverity } from "../../mod.ts";
import {
  angleUnderestimationChart,
  severityProbabilityChart,
  valveAreaDiameterErrorChart,
} from "../../plot/mod.ts";

type Encoding = Record<string, { title?: string | null; field?: string }>;

Deno.test("charts render to SVG and carry their data in the spec", async () => {
  const a = angleUnderestimationChart({ maxAngleDeg: 40, stepDeg: 10 });
  assert.match(await a.toSVG(), /^<svg/);
  const v = valveAreaDiameterErrorChart();
  const svg = await v.toSVG();
  assert.match(svg, /^<svg/);
  assert.match(svg, /LVOT diameter error/);
  const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 1.1, 1.2, 1.6]);
  const s = severityProbabilityChart(d);
  const values = (s.content.data as { values: { grade: string; probability: number }[] }).values;
  // counting (hand-checkable): 1 of 4 severe, 2 moderate, 1 mild
  assert.deepEqual(values.map((x) => x.probability), [0.25, 0.5, 0.25]);
  assert.match(await s.toSVG(), /^<svg/);
});

Deno.test("axis titles and legends are quantity labels with units, never code names", () => {
  // Project rule (issue 11): labels come from the quantities, with labelWithUnit
  const angle = angleUnderestimationChart({ maxAngleDeg: 40, stepDeg: 10 }).content;
  const line = (angle.layer as { encoding: Encoding }[])[0]!.encoding;
  assert.equal(line.x!.title, "Insonation angle (°)");
  assert.equal(line.y!.title, "Underestimation of the true value (%)");
  const valve = valveAreaDiameterErrorChart().content.encoding as Encoding;
  assert.equal(valve.x!.title, "LVOT diameter error (mm)");
  assert.equal(valve.y!.title, "Valve-area error (%)");
  assert.equal(valve.color!.title, "LVOT diameter (cm)");
  const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 1.1]);
  const bars = severityProbabilityChart(d).content.encoding as Encoding;
  assert.equal(bars.x!.title, "Class: Aortic valve area (cm²)");
  for (const e of [line, valve, bars]) {
    for (const channel of Object.values(e)) {
      if (typeof channel.title === "string") assert.doesNotMatch(channel.title, /[a-z][A-Z]/);
    }
  }
});
