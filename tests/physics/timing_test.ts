import assert from "node:assert/strict";
import {
  evaluate,
  FRAME_RATE,
  frameRate,
  maximumPrfForDepth,
  PULSE_REPETITION_FREQUENCY,
  UNAMBIGUOUS_DEPTH,
  unambiguousDepthForPrf,
} from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("timing calculations take and give the declared quantities", () => {
  assert.equal(maximumPrfForDepth.outputs.maxPrfHz.quantity, PULSE_REPETITION_FREQUENCY);
  assert.equal(maximumPrfForDepth.outputs.maxPrfHz.label, "Highest PRF for the depth");
  assert.equal(unambiguousDepthForPrf.outputs.unambiguousDepthCm.quantity, UNAMBIGUOUS_DEPTH);
  assert.equal(frameRate.outputs.frameRateHz.quantity, FRAME_RATE);
});

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
  // A low PRF reaches beyond any imaging depth, and that is a result, not an error:
  // 100 Hz → 1540 / 200 m = 770 cm (hand check).
  close(
    evaluate(unambiguousDepthForPrf, { prfHz: 100 }).outputs.unambiguousDepthCm,
    770,
    1e-9,
    "100 Hz",
  );
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

Deno.test("timing inputs outside their range are RangeErrors naming the field and range", () => {
  assert.throws(() => evaluate(maximumPrfForDepth, { depthCm: 0 }), {
    name: "RangeError",
    message: /^PRF limit for a depth: expected 'depthCm' \(Depth\) in \(0, 50\] cm, got 0$/,
  });
  assert.throws(
    () =>
      evaluate(frameRate, {
        depthCm: 16,
        sectorAngleDeg: 80,
        lineDensityPerDeg: 1.6,
        focalZones: 0,
      }),
    {
      name: "RangeError",
      message:
        /^Frame rate and temporal resolution: expected 'focalZones' \(Focal zones\) in \[1, 16\], got 0$/,
    },
  );
  assert.throws(() => evaluate(unambiguousDepthForPrf, { prfHz: "-1 kHz" }), {
    name: "RangeError",
    message:
      /^Unambiguous depth for a PRF: expected 'prfHz' \(Pulse repetition frequency\) in \(0, 1000000\] Hz, got "-1 kHz" \(-1000 Hz\)$/,
  });
});
