import assert from "node:assert/strict";
import { expressionModel, normal, propagate, sensitivityCurve } from "../../mod.ts";
import { budgetChart, Chart, histogramChart, sensitivityChart } from "../../plot/mod.ts";

const model = expressionModel({
  expression: "4 * v^2",
  inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
  output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
});
const inputs = { v: normal(4, 0.2) };

Deno.test("histogram chart: density integrates to 1 and the GUM curve is N(y, u²)", async () => {
  const mc = propagate(model, inputs, { method: "monteCarlo", trials: 50_000, seed: 8 });
  const g = propagate(model, inputs);
  const chart = histogramChart(mc, { gum: g, bins: 40 });
  const layers = chart.content.layer as { data: { values: Record<string, number>[] } }[];
  const bars = layers[0]!.data.values;
  const mass = bars.reduce((s, b) => s + b.density! * (b.end! - b.start!), 0);
  // the plotted range covers at least the 99.9 % interval, so the bars hold ≥ 0.998 of the mass
  assert.ok(mass > 0.998 && mass <= 1 + 1e-12, `mass ${mass}`);
  const curve = layers[1]!.data.values;
  const peak = Math.max(...curve.map((p) => p.density!));
  // the GUM curve's peak is 1/(u√(2π)) with u = 8·4·0.2 = 6.4 mmHg (JCGM 100 eq. (10), hand-checkable)
  assert.ok(Math.abs(peak - 1 / (6.4 * Math.sqrt(2 * Math.PI))) / peak < 0.01);
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  assert.ok((svg.match(/<path/g) ?? []).length > 40, "bars, curve and rules are drawn");
});

Deno.test("histogram chart is deterministic for a seed (snapshot of the spec)", () => {
  const a = histogramChart(
    propagate(model, inputs, { method: "monteCarlo", trials: 5_000, seed: 9 }),
  );
  const b = histogramChart(
    propagate(model, inputs, { method: "monteCarlo", trials: 5_000, seed: 9 }),
  );
  assert.deepEqual(a.spec, b.spec);
});

Deno.test("budget and sensitivity charts carry their data", async () => {
  const budget = budgetChart(propagate(model, inputs));
  // the budget's source is named by its label, with its unit
  assert.deepEqual((budget.content.data as { values: unknown[] }).values, [{
    source: "Peak velocity (m/s)",
    sharePercent: 100,
    shareText: "100.0 %",
  }]);
  const curve = sensitivityCurve(model, { v: 4 }, { vary: "v", from: 3, to: 5, steps: 3 });
  const chart = sensitivityChart([curve], { relative: true });
  const values = (chart.content.data as { values: { x: number; y: number }[] }).values;
  // (3/4)² − 1 = −43.75 %, 0 %, (5/4)² − 1 = 56.25 % (hand-checkable from ΔP = 4v²)
  assert.deepEqual(values.map((v) => v.y), [-43.75, 0, 56.25]);
  const svg = await chart.toSVG();
  assert.match(svg, /<svg/);
  // axis titles: labels with units, the relative change says what it is relative to
  assert.match(svg, /Peak velocity \(m\/s\)/);
  assert.match(
    svg,
    /Change of Peak gradient relative to its value at Peak velocity = 4 m\/s \(%\)/,
  );
});

Deno.test("sensitivity chart: relative by default, on an axis that spans the change", () => {
  // a 3 % change must not look flat: the y axis is not zero-based unless asked
  const curve = sensitivityCurve(model, { v: 4 }, { vary: "v", from: 4, to: 4.06, steps: 4 });
  const chart = sensitivityChart([curve]);
  const y = (chart.content.encoding as Record<string, { scale?: { zero?: boolean } }>).y!;
  assert.equal(y.scale?.zero, false);
  const values = (chart.content.data as { values: { y: number }[] }).values;
  // (4.06/4)² − 1 = 3.0225 % (hand computation from ΔP = 4v²)
  assert.ok(Math.abs(values.at(-1)!.y - 3.0225) < 1e-9);
  const zero = sensitivityChart([curve], { zeroBased: true });
  assert.equal(
    (zero.content.encoding as Record<string, { scale?: { zero?: boolean } }>).y!.scale?.zero,
    true,
  );
  // absolute values on request, titled by the output's label and unit
  const absolute = sensitivityChart([curve], { relative: false });
  const ya = (absolute.content.encoding as Record<string, { title?: string }>).y!;
  assert.equal(ya.title, "Peak gradient (mmHg)");
});

Deno.test("chart errors: bad spec, unknown output, no samples", () => {
  assert.throws(() => new Chart(null as never), {
    name: "TypeError",
    message: "Chart: expected a vega-lite spec object, got object",
  });
  const mc = propagate(model, inputs, {
    method: "monteCarlo",
    trials: 1000,
    seed: 1,
    keepSamples: false,
  });
  assert.throws(() => histogramChart(mc), {
    name: "TypeError",
    message: /expected a Monte Carlo result with its samples, got a result without samples/,
  });
  assert.throws(() => histogramChart(mc, { output: "nope" }), {
    name: "TypeError",
    message: /unknown output 'nope'/,
  });
});

Deno.test("chart display offers vega-lite and SVG MIME types", async () => {
  const chart = budgetChart(propagate(model, inputs));
  const bundle = await (chart as unknown as Record<symbol, () => Promise<Record<string, unknown>>>)[
    Symbol.for("Jupyter.display")
  ]!();
  assert.ok(bundle["application/vnd.vegalite.v6+json"]);
  assert.match(String(bundle["image/svg+xml"]), /^<svg/);
});
