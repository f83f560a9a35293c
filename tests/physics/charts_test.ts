import assert from "node:assert/strict";
import { evaluate, nyquistVelocityAtDepth, penetrationDepth } from "../../mod.ts";
import {
  nyquistDepthChart,
  nyquistDepthRows,
  resolutionPenetrationChart,
  resolutionPenetrationRows,
} from "../../plot/mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

type Layer = { data: { values: Record<string, unknown>[] }; encoding: Record<string, unknown> };

Deno.test("Nyquist-vs-depth rows come from the calculation and fall with frequency and depth", () => {
  const rows = nyquistDepthRows({
    transmitFrequenciesMHz: [2, 5],
    fromDepthCm: 2,
    toDepthCm: 16,
    steps: 8,
  });
  assert.equal(rows.length, 16);
  for (const row of rows) {
    // Each row equals the calculation at that depth and frequency.
    const r = evaluate(nyquistVelocityAtDepth, {
      sampleDepthCm: row.sampleDepthCm,
      transmitFrequencyMHz: row.transmitFrequencyMHz,
    });
    close(row.nyquistVelocity, r.outputs.nyquistVelocity, 1e-12, "row");
  }
  // Hand check from c²/(8·d·f0): 16 cm, 2 MHz → 0.926 m/s.
  const deep2 = rows.find((r) => r.transmitFrequencyMHz === 2 && r.sampleDepthCm === 16)!;
  close(deep2.nyquistVelocity, 1540 ** 2 / (8 * 0.16 * 2e6), 1e-12, "16 cm 2 MHz");
  // Higher transmit frequency lowers the Nyquist velocity at every depth (common practice).
  for (const row of rows.filter((r) => r.transmitFrequencyMHz === 5)) {
    const same = rows.find((r) =>
      r.transmitFrequencyMHz === 2 && r.sampleDepthCm === row.sampleDepthCm
    )!;
    assert.ok(row.nyquistVelocity < same.nyquistVelocity);
  }
});

Deno.test("Nyquist-vs-depth chart: spec carries the rows and the SVG has lines", async () => {
  const chart = nyquistDepthChart({
    transmitFrequenciesMHz: [2, 3.5],
    velocityOfInterest: 1.5,
    steps: 10,
  });
  const layers = chart.spec.layer as Layer[];
  assert.equal(layers.length, 2);
  assert.deepEqual(
    layers[0]!.data.values,
    nyquistDepthRows({ transmitFrequenciesMHz: [2, 3.5], steps: 10 }),
  );
  assert.deepEqual((layers[0]!.encoding.y as { scale: unknown }).scale, { type: "log" });
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  // Two series → at least two line paths, plus the legend labels and the rule.
  assert.ok((svg.match(/<path/g) ?? []).length >= 2);
  assert.match(svg, /2 MHz/);
  assert.match(svg, /3\.5 MHz/);
  assert.match(svg, /<line/);
});

Deno.test("Nyquist-vs-depth chart rejects bad options with the field and range", () => {
  assert.throws(() => nyquistDepthChart({ transmitFrequenciesMHz: [] }), {
    name: "TypeError",
    message:
      /expected 'transmitFrequenciesMHz' as a non-empty array of numbers, got an empty array/,
  });
  assert.throws(() => nyquistDepthChart({ transmitFrequenciesMHz: [0] }), {
    name: "RangeError",
    message: /expected 'transmitFrequencyMHz' in \(0, 100\] MHz, got 0/,
  });
  assert.throws(() => nyquistDepthChart({ angleDeg: 90 }), {
    name: "RangeError",
    message: /expected 'angleDeg' in \[0, 90\) deg, got 90/,
  });
  assert.throws(() => nyquistDepthChart({ velocityOfInterest: -1 }), {
    name: "RangeError",
    message: /expected 'velocityOfInterest' in \(0, 20\] m\/s, got -1/,
  });
});

Deno.test("resolution/penetration rows: trade-off of frequency", () => {
  const rows = resolutionPenetrationRows({ fromFrequencyMHz: 2, toFrequencyMHz: 12, steps: 11 });
  assert.equal(rows.length, 11);
  const first = rows[0]!, last = rows[10]!;
  // Axial resolution at 2 MHz with 2 cycles = λ = 0.77 mm (common practice λ ≈ 0.77 mm at 2 MHz).
  close(first.axialResolutionMm, 0.77, 1e-12, "axial at 2 MHz");
  // Higher frequency: finer axial and lateral resolution, shallower penetration (common practice).
  assert.ok(last.axialResolutionMm < first.axialResolutionMm);
  assert.ok(last.lateralResolutionMm < first.lateralResolutionMm);
  assert.ok(last.penetrationDepthCm < first.penetrationDepthCm);
  // Penetration row equals the calculation: 60 dB at 12 MHz → 5 cm (hand check 60/(2·0.5·12)).
  close(
    last.penetrationDepthCm,
    evaluate(penetrationDepth, { dynamicRangeDb: 60, transmitFrequencyMHz: 12 }).outputs.maxDepthCm,
    1e-12,
    "row",
  );
  close(last.penetrationDepthCm, 5, 1e-12, "12 MHz");
});

Deno.test("resolution/penetration chart: spec and SVG", async () => {
  const chart = resolutionPenetrationChart({ steps: 15 });
  const spec = chart.spec as { data: { values: unknown[] }; vconcat: unknown[] };
  assert.deepEqual(spec.data.values, resolutionPenetrationRows({ steps: 15 }));
  assert.equal(spec.vconcat.length, 2);
  const svg = await chart.toSVG();
  assert.match(svg, /^<svg/);
  assert.ok((svg.match(/<path/g) ?? []).length >= 3);
  assert.match(svg, /Penetration depth/);
  assert.match(svg, /Lateral, at focus/);
  assert.throws(() => resolutionPenetrationChart({ apertureMm: 0 }), {
    name: "RangeError",
    message: /expected 'apertureMm' in \(0, 200\] mm, got 0/,
  });
});
