/**
 * The Nyquist limit a sample depth allows, and an aliasing check that lists which changes of
 * settings would display a velocity without aliasing, with the Nyquist limit each would give.
 *
 * Built only on the formulas of {@linkcode maximumPrfForDepth}, {@linkcode nyquistVelocity},
 * {@linkcode dopplerShiftFromVelocity} and {@linkcode unambiguousDepthForPrf}.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import {
  escapeHtml,
  formatNumber,
  htmlNotes,
  htmlTable,
  JUPYTER_DISPLAY,
  type MimeBundle,
  textTable,
} from "../core/display.ts";
import type { Calculation } from "../core/types.ts";
import { dopplerShiftFromVelocity, nyquistVelocity } from "./doppler.ts";
import {
  angleInput,
  depthInput,
  HATLE_ANGELSEN,
  KREMKAU,
  prfInput,
  soundSpeedInput,
  transmitFrequencyInput,
  validateArguments,
} from "./shared.ts";
import { maximumPrfForDepth, unambiguousDepthForPrf } from "./timing.ts";

/**
 * Lowest transmit frequency of usual adult cardiac probes, MHz (common practice, no source).
 *
 * @example
 * ```ts
 * import { LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ > 0);
 * ```
 */
export const LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ = 1;

/**
 * The highest Nyquist velocity pulsed Doppler can reach at a sample depth: the Nyquist limit at
 * the highest PRF that depth allows.
 *
 * Formula: PRF_max = c / (2·d) ({@linkcode maximumPrfForDepth}); v_N = (PRF_max / 2) · c /
 * (2·f0·cos θ) ({@linkcode nyquistVelocity}) = c² / (8·d·f0·cos θ).
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2 (maximal
 * velocity as a function of depth and frequency); Kremkau FW. Sonography Principles and
 * Instruments, 9th ed. 2015, ch. 5.
 *
 * Inputs: `sampleDepthCm` (cm, (0, 50]), `transmitFrequencyMHz` (MHz), `angleDeg` (deg, [0, 90),
 * default 0), `soundSpeedMps` (m/s, default 1540). Outputs: `maxPrfHz` (Hz), `nyquistVelocity`
 * (m/s).
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
  "sampleDepthCm" | "transmitFrequencyMHz" | "angleDeg" | "soundSpeedMps",
  "maxPrfHz" | "nyquistVelocity"
> = defineCalculation({
  id: "nyquistVelocityAtDepth",
  title: "Nyquist limit at a sample depth",
  description:
    "Highest velocity pulsed Doppler can display without aliasing at a sample depth, using the highest PRF that depth allows.",
  inputs: {
    sampleDepthCm: depthInput("Depth of the sample volume"),
    transmitFrequencyMHz: transmitFrequencyInput,
    angleDeg: { ...angleInput, default: 0 },
    soundSpeedMps: soundSpeedInput,
  },
  outputs: {
    maxPrfHz: { unit: "Hz", description: "Highest PRF for the depth" },
    nyquistVelocity: { unit: "m/s", description: "Nyquist velocity at that PRF" },
  },
  formula: ({ sampleDepthCm, transmitFrequencyMHz, angleDeg, soundSpeedMps }) => {
    const { maxPrfHz } = maximumPrfForDepth.formula({ depthCm: sampleDepthCm, soundSpeedMps });
    const limit = nyquistVelocity.formula({
      prfHz: maxPrfHz,
      transmitFrequencyMHz,
      angleDeg,
      soundSpeedMps,
    });
    return { maxPrfHz, nyquistVelocity: limit.nyquistVelocity };
  },
  formulaText: "v_N,max = c² / (8·d·f0·cos θ)",
  sources: [HATLE_ANGELSEN, KREMKAU],
  cautions: [
    "Real systems reserve part of the pulse interval, so the usable PRF is slightly lower",
  ],
});

/** A change of settings that could stop a velocity aliasing. */
export type AliasingRemedy =
  | "maximumPrf"
  | "baselineShift"
  | "shallowerSampleVolume"
  | "lowerTransmitFrequency"
  | "continuousWave";

/** One change of settings and the Nyquist limit it would give. */
export interface AliasingOption {
  /** Which change. */
  readonly remedy: AliasingRemedy;
  /** What to do, in words. */
  readonly description: string;
  /** The setting to use (null when the change has no single number). */
  readonly setting: { readonly name: string; readonly value: number; readonly unit: string } | null;
  /** Nyquist velocity after the change, m/s, in the direction of the flow (Infinity: no limit). */
  readonly nyquistVelocity: number;
  /** True when the velocity would no longer alias (and the setting is practical). */
  readonly resolves: boolean;
  /** What the change costs. */
  readonly tradeOff: string;
}

/** Result of {@linkcode aliasingCheck}. */
export interface AliasingCheck {
  /** Velocity magnitude checked, m/s. */
  readonly velocity: number;
  /** Nyquist velocity at the current settings, m/s. */
  readonly nyquistVelocity: number;
  /** Highest PRF the current sample depth allows, Hz. */
  readonly maxPrfHz: number;
  /** True when the velocity exceeds the current Nyquist limit. */
  readonly aliases: boolean;
  /** Changes of settings, each with the Nyquist limit it would give. */
  readonly options: readonly AliasingOption[];
  /** Inputs outside their typical range. */
  readonly flags: readonly string[];
  /** Notebook display: a table of the options. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

const TITLE = "Aliasing check";

const ALIASING_INPUTS = {
  velocity: {
    unit: "m/s",
    description: "Velocity magnitude to display",
    range: { min: 0, max: 20 },
    typical: { min: 0, max: 7 },
  },
  prfHz: prfInput,
  transmitFrequencyMHz: transmitFrequencyInput,
  sampleDepthCm: depthInput("Depth of the sample volume"),
  angleDeg: { ...angleInput, default: 0 },
  soundSpeedMps: soundSpeedInput,
} as const;

/** Arguments of {@linkcode aliasingCheck}: numbers in the stated units or quantity strings. */
export interface AliasingCheckArguments {
  /** Velocity magnitude, m/s, [0, 20]. */
  readonly velocity: number | string;
  /** Current pulse repetition frequency, Hz, at most c/(2·sample depth). */
  readonly prfHz: number | string;
  /** Current transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number | string;
  /** Sample-volume depth, cm. */
  readonly sampleDepthCm: number | string;
  /** Insonation angle, degrees, [0, 90), default 0. */
  readonly angleDeg?: number | string;
  /** Speed of sound, m/s, default 1540. */
  readonly soundSpeedMps?: number | string;
  /** A lower transmit frequency available on the probe, MHz; when omitted, the check reports the
   * highest frequency that would avoid aliasing. */
  readonly lowerTransmitFrequencyMHz?: number | string;
}

const RELATIVE_TOLERANCE = 1e-9;

/**
 * Checks whether a velocity aliases under pulsed-Doppler settings and lists which changes would
 * resolve it, each with the Nyquist limit it would give:
 * - `maximumPrf`: raise the PRF (velocity scale) to c/(2·d), the most the sample depth allows;
 * - `baselineShift`: shift the baseline fully, up to about 2 × the Nyquist limit in one direction;
 * - `shallowerSampleVolume`: the deepest sample depth whose highest PRF displays the velocity;
 * - `lowerTransmitFrequency`: the given lower frequency, or the highest frequency that would
 *   avoid aliasing (not practical below about 1 MHz);
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
 * @returns Whether the velocity aliases and the options with their Nyquist limits.
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
  if (typeof args !== "object" || args === null) {
    throw new TypeError(
      `${TITLE}: expected an object of inputs, got ${args === null ? "null" : typeof args}`,
    );
  }
  const { lowerTransmitFrequencyMHz: lowerRaw, ...rest } = args;
  const { values, flags } = validateArguments(TITLE, ALIASING_INPUTS, rest);
  const { velocity, prfHz, transmitFrequencyMHz, sampleDepthCm, angleDeg, soundSpeedMps } = values;
  const atDepth = nyquistVelocityAtDepth.formula({
    sampleDepthCm,
    transmitFrequencyMHz,
    angleDeg,
    soundSpeedMps,
  });
  if (!(prfHz <= atDepth.maxPrfHz * (1 + RELATIVE_TOLERANCE))) {
    throw new RangeError(
      `${TITLE}: expected 'prfHz' in (0, ${
        formatNumber(atDepth.maxPrfHz, 6)
      }] Hz, the limit c/(2·d) for 'sampleDepthCm' = ${sampleDepthCm} cm (beyond it the mode is high-PRF and range-ambiguous), got ${prfHz}`,
    );
  }
  let lowerTransmitFrequencyMHz: number | undefined;
  if (lowerRaw !== undefined) {
    lowerTransmitFrequencyMHz = validateArguments(TITLE, {
      lowerTransmitFrequencyMHz: transmitFrequencyInput,
    }, { lowerTransmitFrequencyMHz: lowerRaw }).values.lowerTransmitFrequencyMHz;
    if (!(lowerTransmitFrequencyMHz < transmitFrequencyMHz)) {
      throw new RangeError(
        `${TITLE}: expected 'lowerTransmitFrequencyMHz' in (0, ${transmitFrequencyMHz}) MHz (below the current transmit frequency), got ${lowerTransmitFrequencyMHz}`,
      );
    }
  }
  const displays = (limit: number): boolean => velocity <= limit * (1 + RELATIVE_TOLERANCE);
  const current = nyquistVelocity.formula({ prfHz, transmitFrequencyMHz, angleDeg, soundSpeedMps })
    .nyquistVelocity;
  const options: AliasingOption[] = [];

  options.push({
    remedy: "maximumPrf",
    description: `Raise the PRF (velocity scale) to ${
      formatNumber(atDepth.maxPrfHz, 4)
    } Hz, the most a ${sampleDepthCm} cm sample depth allows`,
    setting: { name: "prfHz", value: atDepth.maxPrfHz, unit: "Hz" },
    nyquistVelocity: atDepth.nyquistVelocity,
    resolves: displays(atDepth.nyquistVelocity),
    tradeOff: "None in range; the scale cannot go higher at this depth",
  });

  options.push({
    remedy: "baselineShift",
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
    description: `Sample at ${
      formatNumber(targetDepth, 3)
    } cm or shallower (another window) with the PRF at ${formatNumber(atTarget.maxPrfHz, 4)} Hz`,
    setting: { name: "sampleDepthCm", value: targetDepth, unit: "cm" },
    nyquistVelocity: atTarget.nyquistVelocity,
    resolves: displays(atTarget.nyquistVelocity),
    tradeOff: "Only if the flow can be reached at that depth from another window",
  });

  const frequencyNeeded = velocity > 0 ? transmitFrequencyMHz * (current / velocity) : Infinity;
  const lower = lowerTransmitFrequencyMHz ?? Math.min(frequencyNeeded, transmitFrequencyMHz);
  const atLower = nyquistVelocity.formula({
    prfHz,
    transmitFrequencyMHz: lower,
    angleDeg,
    soundSpeedMps,
  }).nyquistVelocity;
  const practical = lower >= LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ;
  options.push({
    remedy: "lowerTransmitFrequency",
    description: `Transmit at ${formatNumber(lower, 3)} MHz${
      lowerTransmitFrequencyMHz === undefined ? " or lower" : ""
    } (current PRF)${
      practical ? "" : ", below the usual lowest cardiac probe frequency of about 1 MHz"
    }`,
    setting: { name: "transmitFrequencyMHz", value: lower, unit: "MHz" },
    nyquistVelocity: atLower,
    resolves: practical && displays(atLower),
    tradeOff:
      "Weaker blood echoes (scattering falls steeply with frequency), though better penetration",
  });

  options.push({
    remedy: "continuousWave",
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
    flags,
    [JUPYTER_DISPLAY]: () => displayAliasingCheck(result),
  };
  return result;
}

function displayAliasingCheck(r: AliasingCheck): MimeBundle {
  const head = `${TITLE}: ${formatNumber(r.velocity)} m/s ${
    r.aliases ? "aliases" : "does not alias"
  } (Nyquist limit ${formatNumber(r.nyquistVelocity)} m/s)`;
  const header = ["change", "Nyquist limit (m/s)", "resolves", "what to do", "trade-off"];
  const rows = r.options.map((o) => [
    o.remedy,
    Number.isFinite(o.nyquistVelocity) ? formatNumber(o.nyquistVelocity) : "no limit",
    o.resolves ? "yes" : "no",
    o.description,
    o.tradeOff,
  ]);
  return {
    "text/plain": [head, textTable(header, rows), ...r.flags.map((f) => `Flag: ${f}`)].join("\n"),
    "text/html": `<div><b>${escapeHtml(head)}</b>${htmlTable(header, rows)}${
      htmlNotes("Flags", r.flags)
    }</div>`,
  };
}
