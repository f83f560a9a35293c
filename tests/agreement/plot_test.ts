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
  mark: Record<string, unknown>;
  encoding: Record<
    string,
    {
      title?: string | string[];
      legend?: { title?: string } | null;
      scale?: { domain?: unknown[]; range?: unknown[] };
      value?: unknown;
    }
  >;
};

/** An axis title as read (a title broken into lines is joined with spaces). */
const titleOf = (t: string | string[] | undefined) => Array.isArray(t) ? t.join(" ") : t;

Deno.test("the Bland–Altman chart draws the result's own bias, limits and intervals, labelled with units", async () => {
  const r = blandAltman(WRIGHT1, MINI1, {
    multiplier: 2,
    quantity: { label: "Peak expiratory flow", unit: "L/min" },
    methodNames: ["Wright", "mini"],
  });
  const chart = blandAltmanChart(r);
  const [bands, lines, labels, points] = chart.content.layer as Layer[];
  // charts compute nothing: every drawn statistic is the result's, unchanged
  assert.deepEqual(bands!.data.values.map((b) => [b.lower, b.upper]), [
    [r.biasCi.lower, r.biasCi.upper],
    [r.upperLimit.exactCi.lower, r.upperLimit.exactCi.upper],
    [r.lowerLimit.exactCi.lower, r.lowerLimit.exactCi.upper],
  ]);
  assert.deepEqual(lines!.data.values.map((l) => l.y), [
    r.bias,
    r.upperLimit.value,
    r.lowerLimit.value,
  ]);
  assert.equal(points!.data.values.length, 17);
  assert.equal(titleOf(bands!.encoding.y!.title), "Peak expiratory flow: Wright − mini (L/min)");
  assert.equal(points!.encoding.x!.title, "Peak expiratory flow: mean of Wright and mini (L/min)");
  // the values written on the lines and in the legend, rounded as the table shows them: bias
  // −2.12, limits −79.6 and 75.4 L/min (Bland & Altman 1986 p. 308: −79.7, 75.5 from rounded
  // inputs), to whole L/min (bias interval half-width 19.9, JCGM 100:2008 §7.2.6)
  assert.deepEqual(labels!.data.values.map((l) => l.text), [
    "bias -2",
    "upper limit 75",
    "lower limit -80",
  ]);
  const color = lines!.encoding.color!;
  assert.deepEqual(color.scale!.domain, [
    "Bias: -2 L/min",
    "Upper limit of agreement (bias + 2 SD): 75 L/min",
    "Lower limit of agreement (bias − 2 SD): -80 L/min",
  ]);
  // a named legend (not "Line"); colour-blind-safe colours (Okabe & Ito 2008: blue, vermillion)
  // and distinct line styles: solid bias, dashed limits
  assert.equal(
    color.legend!.title,
    "Bias and limits of agreement (shaded: their confidence intervals)",
  );
  assert.deepEqual(color.scale!.range, ["#0072B2", "#D55E00", "#D55E00"]);
  const dash = lines!.encoding.strokeDash!.scale!.range as number[][];
  assert.deepEqual(dash[0], [1, 0]);
  assert.notDeepEqual(dash[1], dash[0]);
  assert.deepEqual(dash[2], dash[1]);
  const approximate = blandAltmanChart(r, { bands: "approximate" }).content.layer as Layer[];
  assert.equal(approximate[0]!.data.values[2]!.lower, r.lowerLimit.approximateCi.lower);
  const svg = await chart.toSVG();
  assert.match(svg, /Peak expiratory flow: Wright − mini \(L\/min\)/);
  assert.match(svg, />bias -2</);
  assert.match(svg, />Upper limit of agreement \(bias \+ 2 SD\): 75 L\/min</);
  assert.match(svg, /stroke-dasharray="7,4"/);
  assert.match(svg, /Not a diagnosis/); // the caution footnote stays
  // a quantity in %: differences in percentage points, means in %
  const ef = blandAltman([60, 52, 41, 66, 58], [58, 52, 44, 63, 59], {
    quantity: EJECTION_FRACTION,
    methodNames: ["auto", "manual"],
  });
  const efLayers = blandAltmanChart(ef).content.layer as Layer[];
  assert.equal(
    titleOf(efLayers[0]!.encoding.y!.title),
    "LV ejection fraction: auto − manual (percentage points)",
  );
  assert.equal(efLayers[3]!.encoding.x!.title, "LV ejection fraction: mean of auto and manual (%)");
});

Deno.test("the method-comparison chart tells the identity line from the fitted lines by style and legend", async () => {
  const chart = methodComparisonChart([40, 50, 60, 45], [41, 52, 59, 47], [
    { name: "Deming regression", slope: 0.95, intercept: 3 },
    { name: "Passing–Bablok regression", slope: 1, intercept: 1 },
  ], { quantity: EJECTION_FRACTION, methodNames: ["manual", "auto"] });
  const [segments] = chart.content.layer as Layer[];
  const color = segments!.encoding.color!;
  assert.equal(color.legend!.title, "Lines");
  assert.deepEqual(color.scale!.domain, [
    "Line of identity (auto = manual)",
    "Deming regression",
    "Passing–Bablok regression",
  ]);
  // Okabe & Ito (2008) colours for the fits, grey for identity; three different dash patterns
  assert.deepEqual(color.scale!.range, ["#595959", "#0072B2", "#E69F00"]);
  const dash = segments!.encoding.strokeDash!.scale!.range as number[][];
  assert.equal(new Set(dash.map((d) => d.join(","))).size, 3);
  const svg = await chart.toSVG();
  assert.match(svg, /Line of identity \(auto = manual\)/);
  assert.match(svg, /Not a diagnosis/);
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
  assert.equal(titleOf(scatter[0]!.encoding.y!.title), "LV ejection fraction: auto (%)");
  const dots = observerChart([{ subject: "P1", observer: "A", value: 50 }], {
    quantity: statedQuantity({ label: "Jet width", unit: "mm" }),
  }).content as { encoding: Record<string, { title?: string }> };
  assert.equal(dots.encoding.y!.title, "Jet width (mm)");
  assert.throws(
    () => methodValidationChart(report, { kind: "comparison", comparison: 9, file: "x.svg" }),
    {
      name: "TypeError",
      message:
        "Method-validation chart: expected a figure of one of the 3 comparisons, got comparison 9",
    },
  );
});

Deno.test("every tooltip of the report's charts has a reader's title", async () => {
  const report = methodValidation(
    readTable(await Deno.readFile("examples/data/validation_demo.csv"), {
      source: "validation_demo.csv",
      ...validationReadOptions(),
    }),
  );
  const tooltips = (spec: unknown, out: Record<string, unknown>[] = []) => {
    if (Array.isArray(spec)) { for (const v of spec) tooltips(v, out); }
    else if (spec !== null && typeof spec === "object") {
      for (const [k, v] of Object.entries(spec)) {
        if (k === "tooltip" && Array.isArray(v)) out.push(...v);
        else tooltips(v, out);
      }
    }
    return out;
  };
  let seen = 0;
  for (const figure of report.figures) {
    for (const t of tooltips(methodValidationChart(report, figure).spec)) {
      seen++;
      assert.ok(
        typeof t.title === "string" && t.title !== "",
        `${figure.file}: ${JSON.stringify(t)}`,
      );
    }
  }
  assert.ok(seen > 0);
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
