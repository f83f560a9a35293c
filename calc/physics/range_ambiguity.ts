/**
 * Range ambiguity in pulsed and high-PRF Doppler: the depths whose echoes arrive together with
 * those of the intended sample volume.
 *
 * @module
 */
import { defineArguments, notAbove } from "../core/calculation.ts";
import type { InputSchema } from "../core/types.ts";
import { PULSE_REPETITION_FREQUENCY } from "../quantities/ultrasound.ts";
import { displayRangeAmbiguity, JUPYTER_DISPLAY } from "../../display/physics.ts";
import { depthInput, SAMPLE_DEPTH_INPUT, SOUND_SPEED_INPUT, validateArguments } from "./shared.ts";
import { unambiguousDepthForPrf } from "./timing.ts";
import type { RangeAmbiguity, RangeAmbiguityArgument } from "./types.ts";

const RANGE_AMBIGUITY: InputSchema<RangeAmbiguityArgument> = {
  ...defineArguments("Range ambiguity", {
    sampleDepthCm: SAMPLE_DEPTH_INPUT,
    prfHz: PULSE_REPETITION_FREQUENCY,
    imagingDepthCm: depthInput("Imaging depth", "Deepest depth with reflectors (displayed depth)"),
    soundSpeedMps: SOUND_SPEED_INPUT,
  }),
  constraints: [notAbove("sampleDepthCm", "imagingDepthCm")],
};

/** Relative tolerance of depth comparisons: a gate within it of a depth is at that depth. */
const TOLERANCE = 1e-9;

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
 * @param args.sampleDepthCm Intended sample-volume depth.
 * @param args.prfHz Pulse repetition frequency.
 * @param args.imagingDepthCm Deepest depth with reflectors, at least the sample depth.
 * @param args.soundSpeedMps Speed of sound. @default 1540 m/s
 * @returns The spacing, whether the mode is high-PRF, and every sample-volume depth; it displays
 * itself in a notebook.
 * @throws {TypeError} For an unknown, missing or mistyped argument.
 * @throws {RangeError} For a value outside its range, or an imaging depth shallower than the
 * sample depth.
 *
 * @example 10 kHz with the sample volume at 12 cm: gates at 4.3 and 12 cm
 * ```ts
 * import { rangeAmbiguity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = rangeAmbiguity({ sampleDepthCm: 12, prfHz: "10 kHz", imagingDepthCm: 16 });
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
  const checked = validateArguments(RANGE_AMBIGUITY, args);
  const { sampleDepthCm, prfHz, imagingDepthCm, soundSpeedMps } = checked.values;
  const spacing = unambiguousDepthForPrf.formula({ prfHz, soundSpeedMps }).unambiguousDepthCm;
  const tolerance = TOLERANCE * spacing;
  const whole = Math.floor(sampleDepthCm / spacing + TOLERANCE);
  let shallowest = sampleDepthCm - whole * spacing;
  if (shallowest <= tolerance) shallowest += spacing;
  const depths: number[] = [];
  for (let k = 0; shallowest + k * spacing <= imagingDepthCm + tolerance; k++) {
    depths.push(shallowest + k * spacing);
  }
  const intended = depths.findIndex((d) => Math.abs(d - sampleDepthCm) <= 1e-6 * spacing);
  const sampleVolumeDepthsCm = depths.map((d, i) => (i === intended ? sampleDepthCm : d));
  const result: RangeAmbiguity = {
    sampleDepthCm,
    prfHz,
    unambiguousDepthCm: spacing,
    highPrf: sampleDepthCm > spacing + tolerance,
    pulsesInFlight: Math.ceil(sampleDepthCm / spacing - TOLERANCE),
    sampleVolumeDepthsCm,
    ambiguousDepthsCm: sampleVolumeDepthsCm.filter((_, i) => i !== intended),
    flags: checked.flags,
    arguments: checked,
    outputDefinitions: { unambiguousDepthCm: unambiguousDepthForPrf.outputs.unambiguousDepthCm },
    [JUPYTER_DISPLAY]: () => displayRangeAmbiguity(result),
  };
  return result;
}
