/**
 * Pulse timing: the PRF limit for a depth, the unambiguous depth for a PRF, and the frame rate
 * and temporal resolution of a 2D image.
 *
 * Every relation goes through the round-trip time 2·d/c, written once.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import {
  FOCAL_ZONES,
  FRAME_RATE,
  FRAME_TIME,
  LINE_DENSITY,
  LINES_PER_FRAME,
  PARALLEL_RECEIVE_BEAMS,
  PULSE_REPETITION_FREQUENCY,
  ROUND_TRIP_TIME,
  SECTOR_ANGLE,
  UNAMBIGUOUS_DEPTH,
} from "../quantities/ultrasound.ts";
import { HOSKINS, KREMKAU } from "./citations.ts";
import { depthInput, roundTripTimeS, SOUND_SPEED_INPUT } from "./shared.ts";

/**
 * Highest pulse repetition frequency that lets an echo return from a depth before the next pulse
 * (no range ambiguity).
 *
 * Formula: round-trip time t = 2·d / c; PRF_max = 1 / t = c / (2·d). About 13 µs per cm of depth
 * at 1540 m/s.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2 (13 µs/cm rule)
 * and ch. 5 (pulsed Doppler PRF); Hoskins PR et al. Diagnostic Ultrasound, 3rd ed. 2019, ch. 8.
 *
 * Inputs: `depthCm`, `soundSpeedMps` (default 1540 m/s). Outputs: `maxPrfHz`, `roundTripTimeUs`.
 *
 * @throws {RangeError} (through `evaluate`) for a depth ≤ 0 or beyond 50 cm.
 *
 * @example 15 cm: about 5.1 kHz
 * ```ts
 * import { evaluate, maximumPrfForDepth } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(maximumPrfForDepth, { depthCm: 15 });
 * assert.ok(Math.abs(r.outputs.maxPrfHz - 5133.33) < 0.01); // 1540 / (2 · 0.15) (hand check)
 * ```
 */
export const maximumPrfForDepth: Calculation<
  "depthCm" | "soundSpeedMps",
  "maxPrfHz" | "roundTripTimeUs"
> = defineCalculation({
  id: "maximumPrfForDepth",
  title: "PRF limit for a depth",
  description:
    "Highest pulse repetition frequency at which echoes from a depth return before the next pulse is sent.",
  inputs: {
    depthCm: depthInput("Depth", "Imaging or sample-volume depth"),
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: {
    maxPrfHz: {
      quantity: PULSE_REPETITION_FREQUENCY,
      label: "Highest PRF for the depth",
      description: "Highest PRF without range ambiguity",
    },
    roundTripTimeUs: ROUND_TRIP_TIME,
  },
  formula: ({ depthCm, soundSpeedMps }) => {
    const t = roundTripTimeS(depthCm, soundSpeedMps);
    return { maxPrfHz: 1 / t, roundTripTimeUs: t * 1e6 };
  },
  formulaText: "t = 2d / c; PRF_max = c / (2d)",
  citations: [KREMKAU, HOSKINS],
  cautions: [
    "Real systems reserve part of the pulse interval, so the usable PRF is slightly lower",
  ],
});

/**
 * Deepest depth reached before the next pulse at a given PRF (the unambiguous range).
 *
 * Formula: d_max = c / (2 · PRF), the inverse of {@linkcode maximumPrfForDepth}, computed as the
 * pulse interval divided by the round-trip time per cm.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 5 (range
 * ambiguity); Hoskins PR et al. Diagnostic Ultrasound, 3rd ed. 2019, ch. 8.
 *
 * Inputs: `prfHz`, `soundSpeedMps` (default 1540 m/s). Output: `unambiguousDepthCm`.
 *
 * @throws {RangeError} (through `evaluate`) for a PRF ≤ 0.
 *
 * @example 5 kHz reaches 15.4 cm
 * ```ts
 * import { evaluate, unambiguousDepthForPrf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(unambiguousDepthForPrf, { prfHz: "5 kHz" });
 * assert.ok(Math.abs(r.outputs.unambiguousDepthCm - 15.4) < 1e-9); // 1540 / (2 · 5000) m
 * ```
 */
export const unambiguousDepthForPrf: Calculation<
  "prfHz" | "soundSpeedMps",
  "unambiguousDepthCm"
> = defineCalculation({
  id: "unambiguousDepthForPrf",
  title: "Unambiguous depth for a PRF",
  description:
    "Deepest depth from which an echo returns before the next pulse at a given pulse repetition frequency.",
  inputs: { prfHz: PULSE_REPETITION_FREQUENCY, soundSpeedMps: SOUND_SPEED_INPUT },
  outputs: { unambiguousDepthCm: UNAMBIGUOUS_DEPTH },
  formula: ({ prfHz, soundSpeedMps }) => ({
    unambiguousDepthCm: 1 / prfHz / roundTripTimeS(1, soundSpeedMps),
  }),
  formulaText: "d_max = c / (2·PRF)",
  citations: [KREMKAU, HOSKINS],
  cautions: [],
});

/**
 * Frame rate and temporal resolution of a scanned (2D) image.
 *
 * Formula: lines per frame N = sector angle × line density; frame time [ms] = N · n_focal ·
 * (2·d / c) / n_parallel; frame rate = 1 / frame time. Equivalent to the textbook limit
 * depth × lines × frame rate ≤ c/2 = 77,000 cm/s for one focal zone.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 4 (frame rate,
 * the 77,000 cm/s rule); Hoskins PR et al. Diagnostic Ultrasound, 3rd ed. 2019, ch. 4.
 *
 * Inputs: `depthCm`, `sectorAngleDeg`, `lineDensityPerDeg`, `focalZones` (a count, default 1),
 * `parallelReceiveBeams` (receive lines per transmit, a count, default 1), `soundSpeedMps`
 * (default 1540 m/s). Outputs: `linesPerFrame`, `temporalResolutionMs` (the frame time),
 * `frameRateHz`.
 *
 * @throws {RangeError} (through `evaluate`) for a value outside its range, or a fraction of a
 * focal zone or receive beam.
 *
 * @example 15 cm, 90° at 1.4 lines/° (126 lines), one focus: about 41 frames/s
 * ```ts
 * import { evaluate, frameRate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(frameRate, { depthCm: 15, sectorAngleDeg: 90, lineDensityPerDeg: 1.4 });
 * assert.ok(Math.abs(r.outputs.linesPerFrame - 126) < 1e-9);
 * // 77,000 / (15 · 126) = 40.74 frames/s (hand check)
 * assert.ok(Math.abs(r.outputs.frameRateHz - 77000 / (15 * 126)) < 1e-9);
 * ```
 */
export const frameRate: Calculation<
  | "depthCm"
  | "sectorAngleDeg"
  | "lineDensityPerDeg"
  | "focalZones"
  | "parallelReceiveBeams"
  | "soundSpeedMps",
  "linesPerFrame" | "temporalResolutionMs" | "frameRateHz"
> = defineCalculation({
  id: "frameRate",
  title: "Frame rate and temporal resolution",
  description:
    "Frame rate and frame time of a 2D image from depth, sector width, line density, focal zones and parallel receive beams.",
  inputs: {
    depthCm: depthInput("Imaging depth", "Displayed depth of the 2D image"),
    sectorAngleDeg: SECTOR_ANGLE,
    lineDensityPerDeg: LINE_DENSITY,
    focalZones: { quantity: FOCAL_ZONES, default: 1 },
    parallelReceiveBeams: { quantity: PARALLEL_RECEIVE_BEAMS, default: 1 },
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: {
    linesPerFrame: LINES_PER_FRAME,
    temporalResolutionMs: {
      quantity: FRAME_TIME,
      label: "Temporal resolution",
      description: "Frame time: the temporal resolution of the image",
    },
    frameRateHz: FRAME_RATE,
  },
  formula: (
    { depthCm, sectorAngleDeg, lineDensityPerDeg, focalZones, parallelReceiveBeams, soundSpeedMps },
  ) => {
    const linesPerFrame = sectorAngleDeg * lineDensityPerDeg;
    const frameTimeS = (linesPerFrame * focalZones * roundTripTimeS(depthCm, soundSpeedMps)) /
      parallelReceiveBeams;
    return { linesPerFrame, temporalResolutionMs: frameTimeS * 1e3, frameRateHz: 1 / frameTimeS };
  },
  formulaText: "N = sector·density; T_frame = N·n_focal·(2d/c) / n_parallel; FR = 1/T_frame",
  citations: [KREMKAU, HOSKINS],
  cautions: [
    "An upper limit: processing time, harmonic or compounding modes and colour Doppler lower the real frame rate",
  ],
});
