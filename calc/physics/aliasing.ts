/**
 * The Nyquist limit a sample depth allows, and an aliasing check that lists which changes of
 * settings would display a velocity without aliasing, with the Nyquist limit each would give.
 *
 * Built only on the formulas of {@linkcode maximumPrfForDepth}, {@linkcode nyquistVelocity},
 * {@linkcode dopplerShiftFromVelocity} and {@linkcode unambiguousDepthForPrf}.
 *
 * @module
 */
import { defineArguments } from "../core/calculation.ts";
import { chain } from "../core/chain.ts";
import type { Calculation, InputConstraint, InputSchema } from "../core/types.ts";
import { BLOOD_VELOCITY } from "../quantities/flow.ts";
import { PULSE_REPETITION_FREQUENCY, TRANSMIT_FREQUENCY } from "../quantities/ultrasound.ts";
import { displayAliasingCheck, JUPYTER_DISPLAY } from "../../display/physics.ts";
import { dopplerShiftFromVelocity, nyquistVelocity } from "./doppler.ts";
import {
  ALIGNED_ANGLE_INPUT,
  bloodSpeedInput,
  SAMPLE_DEPTH_INPUT,
  SOUND_SPEED_INPUT,
  validateArguments,
} from "./shared.ts";
import { maximumPrfForDepth, unambiguousDepthForPrf } from "./timing.ts";
import type {
  AliasingArgument,
  AliasingCheck,
  AliasingOption,
  AliasingSetting,
  CheckedArguments,
} from "./types.ts";

/**
 * Lowest transmit frequency of usual adult cardiac probes, MHz (common practice, no source):
 * below it the aliasing check does not count a lower transmit frequency as a remedy.
 *
 * @example A 5 m/s jet at 14 cm would need a frequency below it
 * ```ts
 * import { aliasingCheck, LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = aliasingCheck({ velocity: 5, prfHz: 5500, transmitFrequencyMHz: 2.5, sampleDepthCm: 14 });
 * const lower = r.options.find((o) => o.remedy === "lowerTransmitFrequency")!;
 * assert.ok(lower.setting!.value < LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ);
 * assert.equal(lower.resolves, false);
 * ```
 */
export const LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ = 1;

/**
 * The highest Nyquist velocity pulsed Doppler can reach at a sample depth: the Nyquist limit at
 * the highest PRF that depth allows. A chain of {@linkcode maximumPrfForDepth} (the sample depth
 * as its depth) and {@linkcode nyquistVelocity} (its PRF limit as the PRF).
 *
 * Formula: PRF_max = c / (2·d); v_N = (PRF_max / 2) · c / (2·f0·cos θ) = c² / (8·d·f0·cos θ).
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2 (maximal
 * velocity as a function of depth and frequency); Kremkau FW. Sonography Principles and
 * Instruments, 9th ed. 2015, ch. 5.
 *
 * Inputs: `sampleDepthCm`, `soundSpeedMps` (default 1540 m/s), `transmitFrequencyMHz`,
 * `angleDeg` (default 0°). Outputs: `maxPrfHz`, `nyquistVelocity`.
 *
 * @throws {RangeError} (through `evaluate`) for a depth or frequency ≤ 0 or an angle ≥ 90°.
 *
 * @example 15 cm at 2 MHz: about 0.99 m/s
 * ```ts
 * import { evaluate, nyquistVelocityAtDepth } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(nyquistVelocityAtDepth, { sampleDepthCm: 15, transmitFrequencyMHz: 2 });
 * // 1540² / (8 · 0.15 · 2e6) = 0.98817 m/s (hand check)
 * assert.ok(Math.abs(r.outputs.nyquistVelocity - 0.98817) < 1e-5);
 * ```
 */
export const nyquistVelocityAtDepth: Calculation<
  "sampleDepthCm" | "soundSpeedMps" | "transmitFrequencyMHz" | "angleDeg",
  "maxPrfHz" | "nyquistVelocity"
> = chain([
  { calculation: maximumPrfForDepth, inputs: { depthCm: "sampleDepthCm" } },
  { calculation: nyquistVelocity, inputs: { prfHz: "maxPrfHz" } },
], {
  id: "nyquistVelocityAtDepth",
  title: "Nyquist limit at a sample depth",
  description:
    "Highest velocity pulsed Doppler can display without aliasing at a sample depth, using the highest PRF that depth allows.",
  outputs: ["maxPrfHz", "nyquistVelocity"],
}) as Calculation<
  "sampleDepthCm" | "soundSpeedMps" | "transmitFrequencyMHz" | "angleDeg",
  "maxPrfHz" | "nyquistVelocity"
>;

const TITLE = "Aliasing check";

/** Relative tolerance of the comparisons with a limit (a velocity at the limit does not alias). */
const RELATIVE_TOLERANCE = 1e-9;

const PRF_WITHIN_DEPTH: InputConstraint<AliasingArgument> = {
  inputs: ["prfHz", "sampleDepthCm", "soundSpeedMps"],
  description:
    "'prfHz' <= 'soundSpeedMps' / (2·'sampleDepthCm'), the highest PRF the sample depth allows (beyond it pulsed Doppler is high-PRF and range-ambiguous: see rangeAmbiguity)",
  holds: ({ prfHz, sampleDepthCm, soundSpeedMps }) =>
    prfHz <=
      maximumPrfForDepth.formula({ depthCm: sampleDepthCm, soundSpeedMps }).maxPrfHz *
        (1 + RELATIVE_TOLERANCE),
};

const LOWER_IS_LOWER: InputConstraint<AliasingArgument> = {
  inputs: ["lowerTransmitFrequencyMHz", "transmitFrequencyMHz"],
  description: "'lowerTransmitFrequencyMHz' < 'transmitFrequencyMHz'",
  holds: (x) => x.lowerTransmitFrequencyMHz < x.transmitFrequencyMHz,
};

const ALIASING: InputSchema<AliasingArgument> = {
  ...defineArguments(TITLE, {
    velocity: bloodSpeedInput(
      "Velocity to display",
      "Speed (magnitude) of the flow to display",
      { min: 0, max: BLOOD_VELOCITY.valid.max },
      "a speed: whether it aliases does not depend on the direction of the flow",
    ),
    prfHz: PULSE_REPETITION_FREQUENCY,
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    sampleDepthCm: SAMPLE_DEPTH_INPUT,
    angleDeg: ALIGNED_ANGLE_INPUT,
    soundSpeedMps: SOUND_SPEED_INPUT,
    lowerTransmitFrequencyMHz: {
      quantity: TRANSMIT_FREQUENCY,
      label: "Lower transmit frequency",
      description: "A lower transmit frequency available on the probe (optional)",
    },
  }),
  constraints: [PRF_WITHIN_DEPTH, LOWER_IS_LOWER],
};

/** Arguments of {@linkcode aliasingCheck}: numbers in canonical units or quantity strings. */
export interface AliasingCheckArguments {
  /** Velocity magnitude, m/s. */
  readonly velocity: number | string;
  /** Current pulse repetition frequency, Hz, at most c/(2·sample depth). */
  readonly prfHz: number | string;
  /** Current transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number | string;
  /** Sample-volume depth, cm. */
  readonly sampleDepthCm: number | string;
  /** Insonation angle, degrees. @default 0 */
  readonly angleDeg?: number | string;
  /** Speed of sound, m/s. @default 1540 */
  readonly soundSpeedMps?: number | string;
  /** A lower transmit frequency available on the probe, MHz; when omitted, the check reports the
   * highest frequency that would avoid aliasing (undefined: not given). */
  readonly lowerTransmitFrequencyMHz?: number | string | undefined;
}

function settingOf(
  checked: CheckedArguments<AliasingArgument>,
  name: AliasingArgument,
  value: number,
): AliasingSetting {
  const d = checked.definitions[name];
  return { name, label: d.label, value, unit: d.unit, quantity: d.quantity };
}

/**
 * Checks whether a velocity aliases under pulsed-Doppler settings and lists which changes would
 * resolve it, each with the Nyquist limit it would give:
 * - `maximumPrf`: raise the PRF (velocity scale) to c/(2·d), the most the sample depth allows;
 * - `baselineShift`: shift the baseline fully, up to about 2 × the Nyquist limit in one direction;
 * - `shallowerSampleVolume`: the deepest sample depth whose highest PRF displays the velocity;
 * - `lowerTransmitFrequency`: the given lower frequency, or the highest frequency that would
 *   avoid aliasing (not practical below {@linkcode LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ});
 * - `continuousWave`: no Nyquist limit (nyquistVelocity = Infinity), at the cost of depth
 *   resolution.
 *
 * Formula: v_N = (PRF/2)·c / (2·f0·cos θ) ({@linkcode nyquistVelocity}); depth for a PRF from
 * {@linkcode unambiguousDepthForPrf}; PRF needed = 2·Δf(v) ({@linkcode dopplerShiftFromVelocity}).
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (aliasing, high-PRF and CW
 * Doppler); Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 5 (ways to
 * eliminate aliasing); Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2.
 *
 * @param args Velocity, current PRF, transmit frequency, sample depth, optional angle, speed of
 * sound and an available lower transmit frequency.
 * @returns Whether the velocity aliases and the options with their Nyquist limits; it displays
 * itself in a notebook.
 * @throws {TypeError} For an unknown, missing or mistyped argument.
 * @throws {RangeError} For a value outside its range, a PRF above what the sample depth allows
 * (c/2d; high-PRF is range-ambiguous, see `rangeAmbiguity`), or a "lower" transmit frequency that
 * is not below the current one.
 *
 * @example 1.5 m/s at 2 MHz and 4 kHz PRF, sample volume at 15 cm
 * ```ts
 * import { aliasingCheck } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = aliasingCheck({ velocity: 1.5, prfHz: 4000, transmitFrequencyMHz: 2, sampleDepthCm: 15 });
 * assert.equal(r.aliases, true); // Nyquist 2000 · 1540 / 4e6 = 0.77 m/s
 * const shift = r.options.find((o) => o.remedy === "baselineShift")!;
 * assert.equal(shift.resolves, true); // 2 × 0.77 = 1.54 m/s
 * const cw = r.options.find((o) => o.remedy === "continuousWave")!;
 * assert.equal(cw.nyquistVelocity, Infinity);
 * ```
 */
export function aliasingCheck(args: AliasingCheckArguments): AliasingCheck {
  const lowerGiven = typeof args === "object" && args !== null &&
    args.lowerTransmitFrequencyMHz !== undefined;
  const checked = validateArguments(
    ALIASING,
    args,
    lowerGiven ? {} : { skip: ["lowerTransmitFrequencyMHz"] },
  );
  const { velocity, prfHz, transmitFrequencyMHz, sampleDepthCm, angleDeg, soundSpeedMps } =
    checked.values;
  const atDepth = nyquistVelocityAtDepth.formula({
    sampleDepthCm,
    transmitFrequencyMHz,
    angleDeg,
    soundSpeedMps,
  });
  const displays = (limit: number): boolean => velocity <= limit * (1 + RELATIVE_TOLERANCE);
  const current = nyquistVelocity.formula({ prfHz, transmitFrequencyMHz, angleDeg, soundSpeedMps })
    .nyquistVelocity;
  const options: AliasingOption[] = [];

  options.push({
    remedy: "maximumPrf",
    label: "Raise the PRF to its depth limit",
    description: "Raise the PRF (velocity scale) to the most the sample depth allows",
    setting: settingOf(checked, "prfHz", atDepth.maxPrfHz),
    nyquistVelocity: atDepth.nyquistVelocity,
    resolves: displays(atDepth.nyquistVelocity),
    tradeOff: "None in range; the scale cannot go higher at this depth",
  });

  options.push({
    remedy: "baselineShift",
    label: "Shift the baseline",
    description: "Shift the zero baseline fully away from the flow direction (current PRF)",
    setting: null,
    nyquistVelocity: 2 * current,
    resolves: displays(2 * current),
    tradeOff: "Only for flow in one direction: the opposite direction loses its display range",
  });

  // PRF that would place the velocity exactly at the Nyquist limit: twice its Doppler shift.
  const prfNeeded = 2 *
    dopplerShiftFromVelocity.formula({ velocity, transmitFrequencyMHz, angleDeg, soundSpeedMps })
      .dopplerShiftHz;
  const depthNeeded = prfNeeded > 0
    ? unambiguousDepthForPrf.formula({ prfHz: prfNeeded, soundSpeedMps }).unambiguousDepthCm
    : Infinity;
  const targetDepth = Math.min(depthNeeded, sampleDepthCm);
  const atTarget = nyquistVelocityAtDepth.formula({
    sampleDepthCm: targetDepth,
    transmitFrequencyMHz,
    angleDeg,
    soundSpeedMps,
  });
  options.push({
    remedy: "shallowerSampleVolume",
    label: "Sample shallower",
    description:
      "Sample at this depth or shallower (from another window) with the PRF at its limit for that depth",
    setting: settingOf(checked, "sampleDepthCm", targetDepth),
    nyquistVelocity: atTarget.nyquistVelocity,
    resolves: displays(atTarget.nyquistVelocity),
    tradeOff: "Only if the flow can be reached at that depth from another window",
  });

  const given = lowerGiven ? checked.values.lowerTransmitFrequencyMHz : undefined;
  const frequencyNeeded = velocity > 0 ? transmitFrequencyMHz * (current / velocity) : Infinity;
  const lower = given ?? Math.min(frequencyNeeded, transmitFrequencyMHz);
  const atLower = nyquistVelocity.formula({
    prfHz,
    transmitFrequencyMHz: lower,
    angleDeg,
    soundSpeedMps,
  }).nyquistVelocity;
  const practical = lower >= LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ;
  options.push({
    remedy: "lowerTransmitFrequency",
    label: "Lower the transmit frequency",
    description: `${
      given === undefined
        ? "Transmit at this frequency or lower"
        : "Transmit at the lower frequency given"
    } (current PRF)${
      practical
        ? ""
        : `, below the usual lowest cardiac probe frequency of about ${LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ} MHz`
    }`,
    setting: settingOf(checked, "transmitFrequencyMHz", lower),
    nyquistVelocity: atLower,
    resolves: practical && displays(atLower),
    tradeOff:
      "Weaker blood echoes (scattering falls steeply with frequency), though better penetration",
  });

  options.push({
    remedy: "continuousWave",
    label: "Continuous-wave Doppler",
    description: "Use continuous-wave Doppler",
    setting: null,
    nyquistVelocity: Infinity,
    resolves: true,
    tradeOff: "No depth resolution: the highest velocity anywhere along the beam is recorded",
  });

  const result: AliasingCheck = {
    velocity,
    nyquistVelocity: current,
    maxPrfHz: atDepth.maxPrfHz,
    aliases: !displays(current),
    options,
    flags: checked.flags,
    arguments: checked,
    outputDefinitions: {
      nyquistVelocity: nyquistVelocity.outputs.nyquistVelocity,
      maxPrfHz: maximumPrfForDepth.outputs.maxPrfHz,
    },
    [JUPYTER_DISPLAY]: () => displayAliasingCheck(result),
  };
  return result;
}
