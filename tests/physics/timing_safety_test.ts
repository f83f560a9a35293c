import assert from "node:assert/strict";
import {
  CLINICAL_CAUTION,
  deratedPressure,
  evaluate,
  frameRate,
  maximumPrfForDepth,
  MECHANICAL_INDEX_LIMIT,
  mechanicalIndex,
  rangeAmbiguity,
  unambiguousDepthForPrf,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

Deno.test("PRF limit for 15 cm ≈ 5.1 kHz and 13 µs per cm round trip", () => {
  // PRF for 15 cm ≈ 5.1 kHz (hand check from c/2d = 1540/0.30).
  const r = evaluate(maximumPrfForDepth, { depthCm: 15 });
  close(r.outputs.maxPrfHz, 5133.3, 0.1, "15 cm");
  // About 13 µs round trip per cm of depth (common practice; Kremkau 2015 ch. 2).
  const perCm = evaluate(maximumPrfForDepth, { depthCm: 1 }).outputs.roundTripTimeUs;
  close(perCm, 13, 0.05, "13 µs/cm");
  // Deeper → lower PRF limit, inversely proportional.
  close(
    evaluate(maximumPrfForDepth, { depthCm: "300 mm" }).outputs.maxPrfHz,
    r.outputs.maxPrfHz / 2,
    1e-9,
    "30 cm",
  );
});

Deno.test("unambiguous depth inverts the PRF limit", () => {
  // d = c/(2·PRF): 5 kHz → 15.4 cm (hand check).
  close(
    evaluate(unambiguousDepthForPrf, { prfHz: 5000 }).outputs.unambiguousDepthCm,
    15.4,
    1e-9,
    "5 kHz",
  );
  for (const depthCm of [2, 7.5, 16, 24]) {
    const prf = evaluate(maximumPrfForDepth, { depthCm }).outputs.maxPrfHz;
    close(
      evaluate(unambiguousDepthForPrf, { prfHz: prf }).outputs.unambiguousDepthCm,
      depthCm,
      1e-9,
      "inverse",
    );
  }
});

Deno.test("frame rate follows the 77,000 cm/s rule and scales with focal zones and parallel beams", () => {
  // depth × lines per frame × frame rate ≤ 77,000 cm/s for one focus (Kremkau 2015 ch. 4,
  // from memory; c/2 = 77,000 cm/s).
  const r = evaluate(frameRate, { depthCm: 16, sectorAngleDeg: 80, lineDensityPerDeg: 1.6 });
  assert.equal(r.outputs.linesPerFrame, 128);
  close(16 * 128 * r.outputs.frameRateHz, 77000, 1e-6, "77,000 rule");
  close(r.outputs.temporalResolutionMs, 1000 / r.outputs.frameRateHz, 1e-12, "frame time");
  // 128 lines at 16 cm: 128 × 207.8 µs = 26.6 ms (hand check).
  close(r.outputs.temporalResolutionMs, 26.6, 0.05, "frame time value");
  // Two focal zones halve the frame rate; four parallel receive beams multiply it by four.
  const twoFoci = evaluate(frameRate, {
    depthCm: 16,
    sectorAngleDeg: 80,
    lineDensityPerDeg: 1.6,
    focalZones: 2,
  });
  close(twoFoci.outputs.frameRateHz, r.outputs.frameRateHz / 2, 1e-9, "two foci");
  const parallel = evaluate(frameRate, {
    depthCm: 16,
    sectorAngleDeg: 80,
    lineDensityPerDeg: 1.6,
    parallelReceiveBeams: 4,
  });
  close(parallel.outputs.frameRateHz, 4 * r.outputs.frameRateHz, 1e-9, "parallel beams");
  // Narrower sector → higher frame rate.
  const narrow = evaluate(frameRate, { depthCm: 16, sectorAngleDeg: 40, lineDensityPerDeg: 1.6 });
  close(narrow.outputs.frameRateHz, 2 * r.outputs.frameRateHz, 1e-9, "half sector");
  // Line density accepts its label.
  const labelled = evaluate(frameRate, {
    depthCm: 16,
    sectorAngleDeg: 80,
    lineDensityPerDeg: "1.6 lines/deg",
  });
  assert.equal(labelled.outputs.linesPerFrame, 128);
});

Deno.test("range ambiguity: sample volumes spaced by c/(2·PRF)", () => {
  // High-PRF: sample volumes at d₀ + k·c/(2·PRF) (Kremkau 2015 ch. 5). PRF 10 kHz → spacing
  // 7.7 cm; intended 12 cm → gates at 4.3 and 12 cm up to 16 cm (hand check).
  const r = rangeAmbiguity({ sampleDepthCm: 12, prfHz: "10 kHz", imagingDepthCm: 16 });
  assert.equal(r.highPrf, true);
  assert.equal(r.pulsesInFlight, 2);
  close(r.unambiguousDepthCm, 7.7, 1e-12, "spacing");
  assert.equal(r.sampleVolumeDepthsCm.length, 2);
  close(r.sampleVolumeDepthsCm[0]!, 4.3, 1e-9, "shallow gate");
  assert.equal(r.sampleVolumeDepthsCm[1], 12);
  assert.equal(r.ambiguousDepthsCm.length, 1);
  // Deeper imaging depth reveals the gate at 19.7 cm too.
  const deep = rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 20 });
  assert.deepEqual(deep.ambiguousDepthsCm.map((d) => Number(d.toFixed(6))), [4.3, 19.7]);
  // Conventional pulsed Doppler within the unambiguous range: no shallower gate.
  const pw = rangeAmbiguity({ sampleDepthCm: 6, prfHz: 10000, imagingDepthCm: 6 });
  assert.equal(pw.highPrf, false);
  assert.deepEqual(pw.ambiguousDepthsCm, []);
  assert.equal(pw.pulsesInFlight, 1);
  // Depth exactly at a multiple of the spacing.
  const edge = rangeAmbiguity({ sampleDepthCm: 15.4, prfHz: 10000, imagingDepthCm: 15.4 });
  assert.deepEqual(edge.sampleVolumeDepthsCm.map((d) => Number(d.toFixed(6))), [7.7, 15.4]);
  assert.throws(() => rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 8 }), {
    name: "RangeError",
    message:
      /Range ambiguity: expected 'imagingDepthCm' in \[12, 50\] cm \(at least the sample depth\), got 8/,
  });
});

Deno.test("mechanical index: hand values, the 1.9 limit and the clinical caution", () => {
  // MI = p_r,derated/√f (Apfel & Holland 1991, Ultrasound Med Biol 17:179; AIUM/NEMA UD 3):
  // 2.6 MPa at 1.87 MHz → 1.901 (hand check).
  const r = evaluate(mechanicalIndex, {
    peakRarefactionalPressureMPa: 2.6,
    transmitFrequencyMHz: 1.87,
  });
  close(r.outputs.mechanicalIndex, 2.6 / Math.sqrt(1.87), 1e-12, "MI");
  close(r.outputs.mechanicalIndex, 1.901, 0.001, "MI value");
  // Regulatory limit 1.9 for cardiac is common practice (FDA Track 3, from memory).
  assert.equal(MECHANICAL_INDEX_LIMIT, 1.9);
  assert.ok(r.outputs.percentOfRegulatoryLimit > 100);
  assert.ok(r.cautions.some((c) => /1\.9/.test(c)));
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
  // Unit conversion: "1500 kPa" = 1.5 MPa.
  const kpa = evaluate(mechanicalIndex, {
    peakRarefactionalPressureMPa: "1500 kPa",
    transmitFrequencyMHz: 2.25,
  });
  close(kpa.outputs.mechanicalIndex, 1, 1e-12, "kPa");
});

Deno.test("derating at 0.3 dB/cm/MHz", () => {
  // Derating 0.3 dB/cm/MHz (IEC 62359; AIUM/NEMA UD 3): 3 MHz, 5 cm → 4.5 dB → ×0.5957
  // (hand check).
  const r = evaluate(deratedPressure, { waterPressureMPa: 3, transmitFrequencyMHz: 3, depthCm: 5 });
  close(r.outputs.deratedPressureMPa, 3 * 0.59566, 1e-4, "derated");
  // Derated pressure feeds the MI.
  const mi = evaluate(mechanicalIndex, {
    peakRarefactionalPressureMPa: r.outputs.deratedPressureMPa,
    transmitFrequencyMHz: 3,
  });
  close(mi.outputs.mechanicalIndex, (3 * 0.59566) / Math.sqrt(3), 1e-4, "MI from derated");
});
