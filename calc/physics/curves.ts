/**
 * Data of the ultrasound-physics trade-off charts: the Nyquist limit swept over sample depth for
 * several transmit frequencies, and axial and lateral resolution with penetration depth swept
 * over transmit frequency. Every point is computed by the calculations' own definitions through
 * `sensitivityCurve` (so every point is validated); charts only draw these rows.
 *
 * @module
 */
import { defineArguments, type InputRole } from "../core/calculation.ts";
import { throwIfErrors } from "../core/issues.ts";
import { formatRange } from "../core/range.ts";
import { sensitivityCurve } from "../core/sensitivity.ts";
import { describeValue } from "../core/text.ts";
import type { InputDefinition, InputSchema, InputValues, ValidationIssue } from "../core/types.ts";
import type { QuantityInput } from "../core/units.ts";
import {
  type CheckedField,
  checkInputs,
  checkValue,
  quantityField,
  validateInputs,
} from "../core/validate.ts";
import { BLOOD_VELOCITY } from "../quantities/flow.ts";
import { TRANSMIT_FREQUENCY } from "../quantities/ultrasound.ts";
import { nyquistVelocityAtDepth } from "./aliasing.ts";
import { penetrationDepth } from "./attenuation.ts";
import { lateralResolution } from "./beam.ts";
import {
  ALIGNED_ANGLE_INPUT,
  bloodSpeedInput,
  SAMPLE_DEPTH_INPUT,
  SOUND_SPEED_INPUT,
} from "./shared.ts";
import { axialResolution } from "./wave.ts";

/** An input of a calculation reused as a sweep setting, with the sweep's default. */
function withDefault(def: InputDefinition, value: number): InputRole {
  return { quantity: def.quantity, label: def.label, description: def.description, default: value };
}

/** Number of points of a curve: a count of at least two. */
function pointsField(value: number): CheckedField {
  return {
    label: "Points per curve",
    unit: "1",
    range: { min: 2, max: 10000 },
    integer: true,
    default: value,
  };
}

/**
 * Checks the settings of a sweep, its list of transmit frequencies (when it has one) and its
 * number of points, all at once, with the one validator.
 */
function checkSweep<I extends string>(
  schema: InputSchema<I>,
  options: unknown,
  points: CheckedField,
  defaultFrequencies?: readonly number[],
): { values: InputValues<I>; steps: number; frequencies: number[] } {
  if (typeof options !== "object" || options === null || Array.isArray(options)) {
    throwIfErrors(checkInputs(schema, options).issues);
  }
  const { steps, transmitFrequenciesMHz, ...settings } = options as Record<string, unknown>;
  const where = schema.title;
  const issues: ValidationIssue[] = [];
  const frequencies: number[] = [];
  if (defaultFrequencies !== undefined) {
    const list = transmitFrequenciesMHz ?? defaultFrequencies;
    if (!Array.isArray(list) || list.length === 0) {
      issues.push({
        kind: "type",
        severity: "error",
        where,
        field: "transmitFrequenciesMHz",
        received: Array.isArray(list) ? "an empty array" : describeValue(list),
        expected: `as a non-empty array of values in ${
          formatRange(TRANSMIT_FREQUENCY.valid, TRANSMIT_FREQUENCY.unit)
        }`,
      });
    } else {
      list.forEach((f, i) => {
        const field = quantityField(TRANSMIT_FREQUENCY);
        const r = checkValue(`transmitFrequenciesMHz[${i}]`, field, f, { where });
        for (const issue of r.issues) issues.push(issue);
        if (r.value !== undefined) frequencies.push(r.value);
      });
    }
  } else if (transmitFrequenciesMHz !== undefined) {
    settings.transmitFrequenciesMHz = transmitFrequenciesMHz; // reported as unknown
  }
  const read = checkValue("steps", points, steps, { where });
  for (const issue of read.issues) issues.push(issue);
  const checked = checkInputs(schema, settings);
  for (const issue of checked.issues) issues.push(issue);
  throwIfErrors(issues);
  return { values: checked.values as InputValues<I>, steps: read.value!, frequencies };
}

const NYQUIST_SWEEP = defineArguments("Nyquist limit vs depth", {
  fromDepthCm: { ...SAMPLE_DEPTH_INPUT, label: "Shallowest sample depth", default: 1 },
  toDepthCm: { ...SAMPLE_DEPTH_INPUT, label: "Deepest sample depth", default: 20 },
  angleDeg: ALIGNED_ANGLE_INPUT,
  soundSpeedMps: SOUND_SPEED_INPUT,
});

/** Transmit frequencies of the Nyquist sweep when none are given, MHz. */
const NYQUIST_SWEEP_FREQUENCIES: readonly number[] = [1.5, 2.5, 3.5, 5];

/** Options of {@linkcode nyquistDepthRows}: numbers in canonical units or quantity strings. */
export interface NyquistDepthOptions {
  /** Transmit frequencies, one curve each, MHz. @default [1.5, 2.5, 3.5, 5] */
  readonly transmitFrequenciesMHz?: readonly QuantityInput[];
  /** Shallowest sample depth, cm. @default 1 */
  readonly fromDepthCm?: QuantityInput;
  /** Deepest sample depth, cm. @default 20 */
  readonly toDepthCm?: QuantityInput;
  /** Points per curve, an integer ≥ 2. @default 60 */
  readonly steps?: number;
  /** Insonation angle, degrees. @default 0 */
  readonly angleDeg?: QuantityInput;
  /** Speed of sound, m/s. @default 1540 */
  readonly soundSpeedMps?: QuantityInput;
}

/** One data row of the Nyquist limit against sample depth. */
export interface NyquistDepthRow {
  /** Sample-volume depth, cm. */
  readonly sampleDepthCm: number;
  /** Transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number;
  /** Insonation angle, degrees. */
  readonly angleDeg: number;
  /** Nyquist velocity at the highest PRF the depth allows, m/s. */
  readonly nyquistVelocity: number;
}

/**
 * The Nyquist limit of {@linkcode nyquistVelocityAtDepth} swept over sample depth, one curve per
 * transmit frequency: the data of the Nyquist-against-depth chart.
 *
 * Formula: v_N = c² / (8·d·f0·cos θ) at each depth d from `fromDepthCm` to `toDepthCm` in
 * `steps` equal steps.
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2 (maximal
 * velocity as a function of depth and frequency).
 *
 * @param options Frequencies, depth range, points, angle, speed of sound.
 * @returns One row per depth and frequency, frequency by frequency.
 * @throws {TypeError} For an unknown option, an empty or non-array frequency list, or a value of
 * the wrong type or unit.
 * @throws {RangeError} For a frequency, depth, angle or speed outside its valid range, or a number
 * of points that is not an integer ≥ 2.
 *
 * @example
 * ```ts
 * import { nyquistDepthRows } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const rows = nyquistDepthRows({ transmitFrequenciesMHz: [2], fromDepthCm: 15, toDepthCm: 16, steps: 2 });
 * // 1540² / (8 · 0.15 · 2e6) = 0.98817 m/s at 15 cm (hand check)
 * assert.ok(Math.abs(rows[0]!.nyquistVelocity - 0.98817) < 1e-5);
 * ```
 */
export function nyquistDepthRows(options: NyquistDepthOptions = {}): NyquistDepthRow[] {
  const { values, steps, frequencies } = checkSweep(
    NYQUIST_SWEEP,
    options,
    pointsField(60),
    NYQUIST_SWEEP_FREQUENCIES,
  );
  const { fromDepthCm, toDepthCm, angleDeg, soundSpeedMps } = values;
  return frequencies.flatMap((transmitFrequencyMHz) =>
    sensitivityCurve(
      nyquistVelocityAtDepth,
      { sampleDepthCm: fromDepthCm, transmitFrequencyMHz, angleDeg, soundSpeedMps },
      { vary: "sampleDepthCm", from: fromDepthCm, to: toDepthCm, steps, output: "nyquistVelocity" },
    ).points.map((p) => ({
      sampleDepthCm: p.x,
      transmitFrequencyMHz,
      angleDeg,
      nyquistVelocity: p.y,
    }))
  );
}

const VELOCITY_OF_INTEREST = defineArguments("Velocity of interest", {
  velocityOfInterest: bloodSpeedInput(
    "Velocity of interest",
    "A velocity to compare with the Nyquist limit (e.g. a jet to be displayed)",
    { min: 0, max: BLOOD_VELOCITY.valid.max, minExclusive: true },
    "a speed, drawn on a logarithmic velocity axis",
  ),
});

/**
 * Reads a velocity of interest to compare with Nyquist limits (a speed, greater than zero):
 * validated and converted to m/s.
 *
 * @param value The velocity, a number in m/s or a quantity string.
 * @returns The velocity in m/s.
 * @throws {TypeError} For a value of the wrong type or unit.
 * @throws {RangeError} For a velocity of zero or less, or beyond the blood-velocity range.
 *
 * @example
 * ```ts
 * import { readVelocityOfInterest } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(readVelocityOfInterest("150 cm/s"), 1.5);
 * assert.throws(() => readVelocityOfInterest(0), RangeError);
 * ```
 */
export function readVelocityOfInterest(value: QuantityInput): number {
  return validateInputs(VELOCITY_OF_INTEREST, { velocityOfInterest: value }).values
    .velocityOfInterest;
}

const RESOLUTION_SWEEP = defineArguments("Resolution and penetration vs frequency", {
  fromFrequencyMHz: {
    quantity: TRANSMIT_FREQUENCY,
    label: "Lowest transmit frequency",
    default: 1,
  },
  toFrequencyMHz: {
    quantity: TRANSMIT_FREQUENCY,
    label: "Highest transmit frequency",
    default: 15,
  },
  cyclesPerPulse: withDefault(axialResolution.inputs.cyclesPerPulse, 2),
  apertureMm: withDefault(lateralResolution.inputs.apertureMm, 20),
  focalDepthCm: withDefault(lateralResolution.inputs.focalDepthCm, 8),
  dynamicRangeDb: withDefault(penetrationDepth.inputs.dynamicRangeDb, 60),
  attenuationDbPerCmMHz: penetrationDepth.inputs.attenuationDbPerCmMHz,
  soundSpeedMps: SOUND_SPEED_INPUT,
});

/** Options of {@linkcode resolutionPenetrationRows}: numbers in canonical units or quantity
 * strings. */
export interface ResolutionPenetrationOptions {
  /** Lowest transmit frequency, MHz. @default 1 */
  readonly fromFrequencyMHz?: QuantityInput;
  /** Highest transmit frequency, MHz. @default 15 */
  readonly toFrequencyMHz?: QuantityInput;
  /** Points per curve, an integer ≥ 2. @default 57 */
  readonly steps?: number;
  /** Cycles per pulse (axial resolution). @default 2 */
  readonly cyclesPerPulse?: QuantityInput;
  /** Aperture width, mm (lateral resolution). @default 20 */
  readonly apertureMm?: QuantityInput;
  /** Focal depth, cm (lateral resolution). @default 8 */
  readonly focalDepthCm?: QuantityInput;
  /** Dynamic range, dB (penetration). @default 60 */
  readonly dynamicRangeDb?: QuantityInput;
  /** Attenuation coefficient, dB/cm/MHz (penetration). @default 0.5 */
  readonly attenuationDbPerCmMHz?: QuantityInput;
  /** Speed of sound, m/s. @default 1540 */
  readonly soundSpeedMps?: QuantityInput;
}

/** One data row of resolution and penetration against transmit frequency. */
export interface ResolutionPenetrationRow {
  /** Transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number;
  /** Axial resolution, mm (from {@linkcode axialResolution}). */
  readonly axialResolutionMm: number;
  /** Lateral resolution at the focus, mm (the beam width of {@linkcode lateralResolution}). */
  readonly lateralResolutionMm: number;
  /** Penetration depth, cm (from {@linkcode penetrationDepth}). */
  readonly penetrationDepthCm: number;
}

/**
 * Axial and lateral resolution and penetration depth swept over transmit frequency by their
 * calculations: the data of the resolution-against-penetration chart.
 *
 * Formulas: axial = n·λ/2 ({@linkcode axialResolution}); lateral = 0.886·λ·F#
 * ({@linkcode lateralResolution}); penetration = DR/(2·α·f) ({@linkcode penetrationDepth}), with
 * λ = c/f, at each frequency from `fromFrequencyMHz` to `toFrequencyMHz` in `steps` equal steps.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2 and 3; Szabo TL.
 * Diagnostic Ultrasound Imaging: Inside Out, 2nd ed. 2014, ch. 6.
 *
 * @param options Frequency range, points, pulse, aperture, focus, dynamic range, attenuation.
 * @returns One row per frequency.
 * @throws {TypeError} For an unknown option or a value of the wrong type or unit.
 * @throws {RangeError} For a value outside its valid range, or a number of points that is not an
 * integer ≥ 2.
 *
 * @example
 * ```ts
 * import { resolutionPenetrationRows } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const [row] = resolutionPenetrationRows({ fromFrequencyMHz: 3, toFrequencyMHz: 6, steps: 2 });
 * assert.ok(Math.abs(row!.penetrationDepthCm - 20) < 1e-12); // 60 dB / (2 · 0.5 · 3) (hand check)
 * ```
 */
export function resolutionPenetrationRows(
  options: ResolutionPenetrationOptions = {},
): ResolutionPenetrationRow[] {
  const { values, steps } = checkSweep(RESOLUTION_SWEEP, options, pointsField(57));
  const { fromFrequencyMHz: from, toFrequencyMHz: to, soundSpeedMps } = values;
  const sweep = { vary: "transmitFrequencyMHz" as const, from, to, steps };
  const axial = sensitivityCurve(axialResolution, {
    transmitFrequencyMHz: from,
    cyclesPerPulse: values.cyclesPerPulse,
    soundSpeedMps,
  }, { ...sweep, output: "axialResolutionMm" }).points;
  const lateral = sensitivityCurve(lateralResolution, {
    transmitFrequencyMHz: from,
    apertureMm: values.apertureMm,
    focalDepthCm: values.focalDepthCm,
    soundSpeedMps,
  }, { ...sweep, output: "beamWidthMm" }).points;
  const penetration = sensitivityCurve(penetrationDepth, {
    transmitFrequencyMHz: from,
    dynamicRangeDb: values.dynamicRangeDb,
    attenuationDbPerCmMHz: values.attenuationDbPerCmMHz,
  }, { ...sweep, output: "maxDepthCm" }).points;
  return axial.map((p, i) => ({
    transmitFrequencyMHz: p.x,
    axialResolutionMm: p.y,
    lateralResolutionMm: lateral[i]!.y,
    penetrationDepthCm: penetration[i]!.y,
  }));
}
