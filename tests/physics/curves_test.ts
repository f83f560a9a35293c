import assert from "node:assert/strict";
import {
  evaluate,
  nyquistDepthRows,
  nyquistVelocityAtDepth,
  penetrationDepth,
  readVelocityOfInterest,
  resolutionPenetrationRows,
} from "../../mod.ts";
import { close } from "./helpers.ts";

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
    assert.equal(row.angleDeg, 0);
  }
  // Hand check from c²/(8·d·f0) (Hatle & Angelsen 1985 ch. 2): 16 cm, 2 MHz → 0.926 m/s.
  const deep2 = rows.find((r) => r.transmitFrequencyMHz === 2 && r.sampleDepthCm === 16)!;
  close(deep2.nyquistVelocity, 1540 ** 2 / (8 * 0.16 * 2e6), 1e-12, "16 cm 2 MHz");
  close(deep2.nyquistVelocity, 0.926, 0.0005, "16 cm 2 MHz, rounded hand value");
  // Depths in equal steps from 2 to 16 cm: 2 cm apart (hand check).
  assert.deepEqual(
    rows.filter((r) => r.transmitFrequencyMHz === 5).map((r) => r.sampleDepthCm),
    [2, 4, 6, 8, 10, 12, 14, 16],
  );
  // Higher transmit frequency lowers the Nyquist velocity at every depth (common practice).
  for (const row of rows.filter((r) => r.transmitFrequencyMHz === 5)) {
    const same = rows.find((r) =>
      r.transmitFrequencyMHz === 2 && r.sampleDepthCm === row.sampleDepthCm
    )!;
    assert.ok(row.nyquistVelocity < same.nyquistVelocity);
  }
});

Deno.test("Nyquist-vs-depth rows: defaults, angle and quantity strings", () => {
  // Defaults: four frequencies (1.5, 2.5, 3.5, 5 MHz), 1 to 20 cm, 60 points each.
  const rows = nyquistDepthRows();
  assert.equal(rows.length, 4 * 60);
  assert.deepEqual([...new Set(rows.map((r) => r.transmitFrequencyMHz))], [1.5, 2.5, 3.5, 5]);
  // 1 cm at 1.5 MHz: 1540² / (8 · 0.01 · 1.5e6) = 19.763 m/s (hand check).
  close(rows[0]!.nyquistVelocity, 1540 ** 2 / (8 * 0.01 * 1.5e6), 1e-9, "1 cm 1.5 MHz");
  // At 60° the limit doubles (cos 60° = 0.5, hand check); strings are converted.
  const at60 = nyquistDepthRows({
    transmitFrequenciesMHz: ["2000 kHz"],
    fromDepthCm: "150 mm",
    toDepthCm: 16,
    steps: 2,
    angleDeg: 60,
  });
  close(at60[0]!.nyquistVelocity, 2 * 1540 ** 2 / (8 * 0.15 * 2e6), 1e-9, "60°");
  assert.equal(at60[0]!.angleDeg, 60);
});

Deno.test("resolution/penetration rows: trade-off of frequency", () => {
  const rows = resolutionPenetrationRows({ fromFrequencyMHz: 2, toFrequencyMHz: 12, steps: 11 });
  assert.equal(rows.length, 11);
  const first = rows[0]!, last = rows[10]!;
  // Axial resolution at 2 MHz with 2 cycles = λ = 0.77 mm (common practice λ ≈ 0.77 mm at 2 MHz).
  close(first.axialResolutionMm, 0.77, 1e-12, "axial at 2 MHz");
  // Lateral at 2 MHz, 20 mm aperture focused at 8 cm: 0.8859 · 0.77 mm · 4 = 2.7286 mm (Szabo
  // 2014 ch. 6 pulse-echo width of a line aperture; hand check).
  close(first.lateralResolutionMm, 0.8859 * 0.77 * 4, 1e-12, "lateral at 2 MHz");
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

Deno.test("resolution/penetration rows: defaults and settings", () => {
  // Defaults: 1 to 15 MHz in 57 points (0.25 MHz apart).
  const rows = resolutionPenetrationRows();
  assert.equal(rows.length, 57);
  close(rows[1]!.transmitFrequencyMHz - rows[0]!.transmitFrequencyMHz, 0.25, 1e-12, "step");
  // 1 MHz, 60 dB at 0.5 dB/cm/MHz: 60 cm (hand check).
  close(rows[0]!.penetrationDepthCm, 60, 1e-12, "1 MHz");
  // Three cycles and a 1 dB/cm/MHz medium at 3 MHz: axial 3·0.5133/2 = 0.77 mm and
  // penetration 60/(2·1·3) = 10 cm (hand checks).
  const [row] = resolutionPenetrationRows({
    fromFrequencyMHz: 3,
    toFrequencyMHz: 4,
    steps: 2,
    cyclesPerPulse: 3,
    attenuationDbPerCmMHz: 1,
  });
  close(row!.axialResolutionMm, 0.77, 1e-12, "axial, 3 cycles");
  close(row!.penetrationDepthCm, 10, 1e-12, "penetration at 1 dB/cm/MHz");
});

Deno.test("a velocity of interest is read as a speed in m/s", () => {
  assert.equal(readVelocityOfInterest("150 cm/s"), 1.5);
  assert.equal(readVelocityOfInterest(4), 4);
  assert.throws(() => readVelocityOfInterest(-1), {
    name: "RangeError",
    message:
      /^Velocity of interest: expected 'velocityOfInterest' \(Velocity of interest\) in \(0, 20\] m\/s, got -1$/,
  });
  assert.throws(() => readVelocityOfInterest("1.5 mmHg"), {
    name: "TypeError",
    message: /^Velocity of interest: expected 'velocityOfInterest' \(Velocity of interest\) in/,
  });
});

// Bad input: clear errors naming the field, its label, the valid range and the value (project
// rules, bad-input list); messages from the one validator.

Deno.test("sweeps reject bad options with the field and range", () => {
  assert.throws(() => nyquistDepthRows({ transmitFrequenciesMHz: [] }), {
    name: "TypeError",
    message:
      /^Nyquist limit vs depth: expected 'transmitFrequenciesMHz' as a non-empty array of values in \(0, 100\] MHz, got an empty array$/,
  });
  assert.throws(() => nyquistDepthRows({ transmitFrequenciesMHz: 2 as never }), {
    name: "TypeError",
    message: /expected 'transmitFrequenciesMHz' as a non-empty array .*, got 2$/,
  });
  assert.throws(() => nyquistDepthRows({ transmitFrequenciesMHz: [2, 0] }), {
    name: "RangeError",
    message:
      /^Nyquist limit vs depth: expected 'transmitFrequenciesMHz\[1\]' \(Transmit frequency\) in \(0, 100\] MHz, got 0$/,
  });
  assert.throws(() => nyquistDepthRows({ angleDeg: 90 }), {
    name: "RangeError",
    message:
      /^Nyquist limit vs depth: expected 'angleDeg' \(Insonation angle\) in \[0, 90\)°, got 90$/,
  });
  assert.throws(() => nyquistDepthRows({ toDepthCm: 60 }), {
    name: "RangeError",
    message:
      /^Nyquist limit vs depth: expected 'toDepthCm' \(Deepest sample depth\) in \(0, 50\] cm, got 60$/,
  });
  assert.throws(() => nyquistDepthRows({ steps: 2.5 }), {
    name: "RangeError",
    message:
      /^Nyquist limit vs depth: expected 'steps' \(Points per curve\) as a whole number in \[2, 10000\], got 2\.5$/,
  });
  assert.throws(() => nyquistDepthRows({ width: 300 } as never), {
    name: "TypeError",
    message: /^Nyquist limit vs depth: unknown input 'width'/,
  });
  assert.throws(() => resolutionPenetrationRows({ apertureMm: 0 }), {
    name: "RangeError",
    message:
      /^Resolution and penetration vs frequency: expected 'apertureMm' \(Aperture width\) in \(0, 200\] mm, got 0$/,
  });
  assert.throws(() => resolutionPenetrationRows({ transmitFrequenciesMHz: [2] } as never), {
    name: "TypeError",
    message: /^Resolution and penetration vs frequency: unknown input 'transmitFrequenciesMHz'/,
  });
  assert.throws(() => resolutionPenetrationRows(null as never), {
    name: "TypeError",
    message: /^Resolution and penetration vs frequency: expected 'inputs' as an object with/,
  });
});
