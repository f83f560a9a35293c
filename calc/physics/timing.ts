/**
 * Pulse timing: the PRF limit for a depth, the unambiguous depth for a PRF, frame rate and
 * temporal resolution, and range ambiguity in high-PRF Doppler.
 *
 * Every relation goes through the round-trip time 2·d/c, written once.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import {
  depthInput,
  HOSKINS,
  KREMKAU,
  prfInput,
  roundTripTimeS,
  soundSpeedInput,
  validateArguments,
} from "./shared.ts";

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
 * Inputs: `depthCm` (cm, (0, 50]), `soundSpeedMps` (m/s, default 1540). Outputs: `maxPrfHz` (Hz),
 * `roundTripTimeUs` (µs).
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
  inputs: { depthCm: depthInput("Imaging or sample-volume depth"), soundSpeedMps: soundSpeedInput },
  outputs: {
    maxPrfHz: { unit: "Hz", description: "Highest PRF without range ambiguity" },
    roundTripTimeUs: { unit: "us", description: "Round-trip time to the depth" },
  },
  formula: ({ depthCm, soundSpeedMps }) => {
    const t = roundTripTimeS(depthCm, soundSpeedMps);
    return { maxPrfHz: 1 / t, roundTripTimeUs: t * 1e6 };
  },
  formulaText: "t = 2d / c; PRF_max = c / (2d)",
  sources: [KREMKAU, HOSKINS],
  cautions: [],
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
 * Inputs: `prfHz` (Hz, (0, 1e6]), `soundSpeedMps` (m/s, default 1540). Output:
 * `unambiguousDepthCm` (cm).
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
  inputs: { prfHz: prfInput, soundSpeedMps: soundSpeedInput },
  outputs: { unambiguousDepthCm: { unit: "cm", description: "Unambiguous range" } },
  formula: ({ prfHz, soundSpeedMps }) => ({
    unambiguousDepthCm: 1 / prfHz / roundTripTimeS(1, soundSpeedMps),
  }),
  formulaText: "d_max = c / (2·PRF)",
  sources: [KREMKAU, HOSKINS],
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
 * Inputs: `depthCm` (cm), `sectorAngleDeg` (deg, (0, 180], typical [15, 100]),
 * `lineDensityPerDeg` (lines/deg, (0, 20], typical [0.5, 4]), `focalZones` ([1, 16], default 1),
 * `parallelReceiveBeams` (receive lines per transmit, [1, 64], default 1), `soundSpeedMps`
 * (m/s, default 1540). Outputs: `linesPerFrame`, `temporalResolutionMs` (frame time, ms),
 * `frameRateHz` (Hz).
 *
 * @throws {RangeError} (through `evaluate`) for a value outside its range.
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
    depthCm: depthInput("Imaging depth"),
    sectorAngleDeg: {
      unit: "deg",
      description: "Sector (field-of-view) angle",
      range: { min: 0, max: 180, minExclusive: true },
      typical: { min: 15, max: 100 },
    },
    lineDensityPerDeg: {
      unit: "lines/deg",
      description: "Scan lines per degree of sector",
      range: { min: 0, max: 20, minExclusive: true },
      typical: { min: 0.5, max: 4 },
    },
    focalZones: {
      unit: "1",
      description: "Number of transmit focal zones per line",
      range: { min: 1, max: 16 },
      default: 1,
    },
    parallelReceiveBeams: {
      unit: "1",
      description: "Receive lines formed per transmit pulse (multi-line acquisition)",
      range: { min: 1, max: 64 },
      default: 1,
    },
    soundSpeedMps: soundSpeedInput,
  },
  outputs: {
    linesPerFrame: { unit: "1", description: "Scan lines per frame" },
    temporalResolutionMs: { unit: "ms", description: "Frame time (temporal resolution)" },
    frameRateHz: { unit: "Hz", description: "Frames per second" },
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
  sources: [KREMKAU, HOSKINS],
  cautions: [
    "An upper limit: processing time, harmonic or compounding modes and colour Doppler lower the real frame rate",
  ],
});

/** Result of {@linkcode rangeAmbiguity}. */
export interface RangeAmbiguity {
  /** Depth of the intended sample volume, cm. */
  readonly sampleDepthCm: number;
  /** Pulse repetition frequency, Hz. */
  readonly prfHz: number;
  /** Unambiguous range c/(2·PRF), cm: the spacing between sample volumes. */
  readonly unambiguousDepthCm: number;
  /** True when the sample volume lies beyond the unambiguous range (high-PRF mode). */
  readonly highPrf: boolean;
  /** Pulses in flight when the intended echo returns: ceil(depth / unambiguous range). */
  readonly pulsesInFlight: number;
  /** All sample-volume depths from the shallowest to the imaging depth, cm, ascending. */
  readonly sampleVolumeDepthsCm: readonly number[];
  /** The sample-volume depths other than the intended one, cm, ascending. */
  readonly ambiguousDepthsCm: readonly number[];
  /** Values outside typical ranges. */
  readonly flags: readonly string[];
}

const RANGE_AMBIGUITY_INPUTS = {
  sampleDepthCm: depthInput("Depth of the intended sample volume"),
  prfHz: prfInput,
  imagingDepthCm: depthInput("Deepest depth with reflectors (displayed depth)"),
  soundSpeedMps: soundSpeedInput,
} as const;

/**
 * Range ambiguity in pulsed and high-PRF Doppler: the depths from which echoes arrive at the same
 * time as those from the intended sample volume.
 *
 * Formula: spacing Δ = c / (2·PRF) ({@linkcode unambiguousDepthForPrf}); sample volumes at
 * d₀ + k·Δ (k = 0, 1, …) up to the imaging depth, where d₀ = d − ⌊d/Δ⌋·Δ is the shallowest gate
 * (d₀ = Δ when d is a whole multiple of Δ).
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 5 (range
 * ambiguity, high-PRF Doppler); Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed.
 * 1985, ch. 2.
 *
 * @param args.sampleDepthCm Intended sample-volume depth, cm, (0, 50].
 * @param args.prfHz Pulse repetition frequency, Hz, (0, 1e6].
 * @param args.imagingDepthCm Deepest depth with reflectors, cm, (0, 50], at least the sample depth.
 * @param args.soundSpeedMps Speed of sound, m/s, default 1540.
 * @returns The spacing, whether the mode is high-PRF, and every sample-volume depth.
 * @throws {TypeError} For an unknown, missing or mistyped argument.
 * @throws {RangeError} For a value outside its range, or an imaging depth shallower than the
 * sample depth.
 *
 * @example 10 kHz with the sample volume at 12 cm: gates at 4.3 and 12 cm
 * ```ts
 * import { rangeAmbiguity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 16 });
 * assert.equal(r.highPrf, true);
 * assert.ok(Math.abs(r.unambiguousDepthCm - 7.7) < 1e-9); // 1540 / (2 · 10⁴) m
 * assert.deepEqual(r.ambiguousDepthsCm.map((d) => Number(d.toFixed(2))), [4.3]);
 * ```
 */
export function rangeAmbiguity(args: {
  readonly sampleDepthCm: number | string;
  readonly prfHz: number | string;
  readonly imagingDepthCm: number | string;
  readonly soundSpeedMps?: number | string;
}): RangeAmbiguity {
  const title = "Range ambiguity";
  const { values, flags } = validateArguments(title, RANGE_AMBIGUITY_INPUTS, args);
  const { sampleDepthCm, prfHz, imagingDepthCm, soundSpeedMps } = values;
  if (!(imagingDepthCm >= sampleDepthCm)) {
    throw new RangeError(
      `${title}: expected 'imagingDepthCm' in [${sampleDepthCm}, 50] cm (at least the sample depth), got ${imagingDepthCm}`,
    );
  }
  const spacing = unambiguousDepthForPrf.formula({ prfHz, soundSpeedMps }).unambiguousDepthCm;
  const tolerance = 1e-9 * spacing;
  const whole = Math.floor(sampleDepthCm / spacing + 1e-9);
  let shallowest = sampleDepthCm - whole * spacing;
  if (shallowest <= tolerance) shallowest += spacing;
  const depths: number[] = [];
  for (let k = 0; shallowest + k * spacing <= imagingDepthCm + tolerance; k++) {
    depths.push(shallowest + k * spacing);
  }
  const intended = depths.findIndex((d) => Math.abs(d - sampleDepthCm) <= 1e-6 * spacing);
  const sampleVolumeDepthsCm = depths.map((d, i) => (i === intended ? sampleDepthCm : d));
  return {
    sampleDepthCm,
    prfHz,
    unambiguousDepthCm: spacing,
    highPrf: sampleDepthCm > spacing + tolerance,
    pulsesInFlight: Math.ceil(sampleDepthCm / spacing - 1e-9),
    sampleVolumeDepthsCm,
    ambiguousDepthsCm: sampleVolumeDepthsCm.filter((_, i) => i !== intended),
    flags,
  };
}
