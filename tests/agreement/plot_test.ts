import assert from "node:assert/strict";
import {
  blandAltman,
  methodValidation,
  statedQuantity,
  validationReadOptions,
} from "../../calc/agreement/mod.ts";
import { readTable } from "../../calc/table/mod.ts";
import { EJECTION_FRACTION } from "../../calc/quantities/mod.ts";
import {
  blandAltmanChart,
  methodComparisonChart,
  methodValidationChart,
  observerChart,
} from "../../plot/agreement.ts";
import { MINI1, WRIGHT1 } from "./data.ts";

type Layer = {
  data: { values: Record<string, unknown>[] };
  encoding: Record<string, { title?: string }>;
};

Deno.test("the Bland–Altman chart draws the result's own bias, limits and intervals, labelled with units", async () => {
  const r = blandAltman(WRIGHT1, MINI1, {
    multiplier: 2,
    quantity: { label: "Peak expiratory flow", unit: "L/min" },
    methodNames: ["Wright", "mini"],
  });
  const chart = blandAltmanChart(r);
  const [bands, lines, points] = chart.content.layer as Layer[];
  // charts compute nothing: every drawn statistic is the result's, unchanged
  assert.deepEqual(bands!.data.values.map((b) => [b.lower, b.upper]), [
    [r.biasCi.lower, r.biasCi.upper],
    [r.lowerLimit.exactCi.lower, r.lowerLimit.exactCi.upper],
    [r.upperLimit.exactCi.lower, r.upperLimit.exactCi.upper],
  ]);
  assert.deepEqual(lines!.data.values.map((l) => l.y), [
    r.bias,
    r.lowerLimit.value,
    r.upperLimit.value,
  ]);
  assert.equal(points!.data.values.length, 17);
  assert.equal(bands!.encoding.y!.title, "Peak expiratory flow: Wright − mini (L/min)");
  assert.equal(points!.encoding.x!.title, "Peak expiratory flow: mean of Wright and mini (L/min)");
  const approximate = blandAltmanChart(r, { bands: "approximate" }).content.layer as Layer[];
  assert.equal(approximate[0]!.data.values[1]!.lower, r.lowerLimit.approximateCi.lower);
  const svg = await chart.toSVG();
  assert.match(svg, /Peak expiratory flow: Wright − mini \(L\/min\)/);
});

Deno.test("axis titles come from the quantity's label and unit, never a code identifier", async () => {
  const report = methodValidation(
    readTable(await Deno.readFile("examples/data/validation_demo.csv"), {
      source: "validation_demo.csv",
      ...validationReadOptions(),
    }),
  );
  for (const figure of report.figures) {
    const svg = await methodValidationChart(report, figure).toSVG();
    assert.match(svg, /LV ejection fraction/, figure.file);
    assert.match(svg, /\(%\)/, figure.file);
    assert.doesNotMatch(svg, /ejectionFraction|lvef_percent|statedQuantity|undefined/, figure.file);
  }
  const scatter = methodComparisonChart([40, 50, 60], [41, 52, 59], [], {
    quantity: EJECTION_FRACTION,
    methodNames: ["manual", "auto"],
  }).content.layer as Layer[];
  assert.equal(scatter[0]!.encoding.x!.title, "LV ejection fraction: manual (%)");
  assert.equal(scatter[0]!.encoding.y!.title, "LV ejection fraction: auto (%)");
  const dots = observerChart([{ subject: "P1", observer: "A", value: 50 }], {
    quantity: statedQuantity({ label: "Jet width", unit: "mm" }),
  }).content as { encoding: Record<string, { title?: string }> };
  assert.equal(dots.encoding.y!.title, "Jet width (mm)");
  assert.throws(
    () => methodValidationChart(report, { kind: "comparison", comparison: 9, file: "x.svg" }),
    {
      name: "TypeError",
      message:
        "Method-validation chart: expected a figure of one of the 2 comparisons, got comparison 9",
    },
  );
});

Deno.test("names from the data are escaped in the SVG", async () => {
  const svg = await observerChart([
    { subject: "<b>P1</b>", observer: "<script>alert(1)</script>", value: 50 },
    { subject: "P2 & co", observer: "B", value: 52 },
  ]).toSVG();
  assert.doesNotMatch(svg, /<script|<b>/);
  assert.match(svg, /&lt;script&gt;alert\(1\)&lt;\/script&gt;/);
});

Deno.test("the method-comparison chart finds its extent by a loop (200 000 points)", () => {
  const n = 200_000;
  const x = Array.from({ length: n }, (_, i) => 20 + (i % 600) / 10);
  const y = x.map((v, i) => v + ((i % 7) - 3) / 10);
  const layers = methodComparisonChart(x, y, [{ name: "fit", slope: 1, intercept: 0 }])
    .content.layer as Layer[];
  // the identity line spans both series: min 20 − 0.3 = 19.7 and max 79.9 + 0.3 = 80.2 (y at
  // i ≡ 0 mod 4200 and i ≡ 599 mod 600, 6 mod 7), by construction
  const ends = layers[0]!.data.values.slice(0, 2).map((p) => p.x as number);
  assert.ok(Math.abs(ends[0]! - 19.7) < 1e-9);
  assert.ok(Math.abs(ends[1]! - 80.2) < 1e-9);
  assert.throws(() => methodComparisonChart([1, 2], [1], []), {
    name: "TypeError",
    message: "Method-comparison chart: expected 'x' and 'y' of equal length, got 2 and 1",
  });
});
