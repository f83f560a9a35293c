import assert from "node:assert/strict";
import { nyquistDepthRows, resolutionPenetrationRows } from "../../mod.ts";
import { nyquistDepthChart, resolutionPenetrationChart } from "../../plot/mod.ts";

type Layer = { data: { values: Record<string, unknown>[] }; encoding: Record<string, unknown> };
type Axis = { field: string; title: string; scale?: unknown };

Deno.test("Nyquist-vs-depth chart: spec carries the rows, titles are labels with units", async () => {
  const chart = nyquistDepthChart({
    transmitFrequenciesMHz: [2, 3.5],
    velocityOfInterest: "150 cm/s",
    steps: 10,
  });
  const layers = chart.content.layer as Layer[];
  assert.equal(layers.length, 2);
  assert.deepEqual(
    layers[0]!.data.values,
    nyquistDepthRows({ transmitFrequenciesMHz: [2, 3.5], steps: 10 }),
  );
  const encoding = layers[0]!.encoding as { x: Axis; y: Axis; color: Axis };
  assert.equal(encoding.x.title, "Depth (cm)");
  assert.equal(encoding.y.title, "Nyquist velocity (m/s)");
  assert.equal(encoding.color.title, "Transmit frequency (MHz)");
  assert.deepEqual(encoding.y.scale, { type: "log" });
  assert.equal(chart.title, "Nyquist velocity vs sample depth (PRF at its depth limit, θ = 0°)");
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  // Two series → at least two line paths, plus the legend labels and the rule.
  assert.ok((svg.match(/<path/g) ?? []).length >= 2);
  assert.match(svg, />2<\/text>/);
  assert.match(svg, />3\.5<\/text>/);
  assert.match(svg, /1\.50 m\/s/);
  assert.match(svg, /<line/);
});

Deno.test("Nyquist-vs-depth chart rejects bad options with the field and range", () => {
  assert.throws(() => nyquistDepthChart({ transmitFrequenciesMHz: [] }), {
    name: "TypeError",
    message:
      /expected 'transmitFrequenciesMHz' as a non-empty array of values in \(0, 100\] MHz, got an empty array/,
  });
  assert.throws(() => nyquistDepthChart({ transmitFrequenciesMHz: [0] }), {
    name: "RangeError",
    message:
      /expected 'transmitFrequenciesMHz\[0\]' \(Transmit frequency\) in \(0, 100\] MHz, got 0/,
  });
  assert.throws(() => nyquistDepthChart({ angleDeg: 90 }), {
    name: "RangeError",
    message: /expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got 90/,
  });
  assert.throws(() => nyquistDepthChart({ velocityOfInterest: -1 }), {
    name: "RangeError",
    message: /expected 'velocityOfInterest' \(Velocity of interest\) in \(0, 20\] m\/s, got -1/,
  });
});

Deno.test("resolution/penetration chart: spec, labels and SVG", async () => {
  const chart = resolutionPenetrationChart({ steps: 15 });
  const spec = chart.content as {
    data: { values: unknown[] };
    vconcat: { encoding: { x: Axis; y: Axis } }[];
  };
  assert.deepEqual(spec.data.values, resolutionPenetrationRows({ steps: 15 }));
  assert.equal(spec.vconcat.length, 2);
  assert.equal(spec.vconcat[0]!.encoding.x.title, "Transmit frequency (MHz)");
  assert.equal(spec.vconcat[1]!.encoding.y.title, "Penetration depth (cm)");
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  assert.ok((svg.match(/<path/g) ?? []).length >= 3);
  assert.match(svg, /Penetration depth \(cm\)/);
  assert.match(svg, /Axial resolution</);
  assert.match(svg, /Lateral resolution at the focus</);
  // No code identifier reaches the reader.
  assert.doesNotMatch(svg, /Mm<|Cm<|MHz</);
  assert.throws(() => resolutionPenetrationChart({ apertureMm: 0 }), {
    name: "RangeError",
    message: /expected 'apertureMm' \(Aperture width\) in \(0, 200\] mm, got 0/,
  });
});
