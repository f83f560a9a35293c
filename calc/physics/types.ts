/**
 * The shapes of the ultrasound-physics functions that give several answers (the aliasing check,
 * range ambiguity): their results, the options they list and the checked arguments behind them.
 * Types only, so the display module reads them without importing any computation.
 *
 * @module
 */
import type { InputDefinition, MimeBundle, OutputDefinition, Quantity } from "../core/types.ts";
import type { JUPYTER_DISPLAY } from "../../display/mime.ts";

/**
 * The validated arguments of a plain (multi-answer) function, with the definitions that label
 * them: what its result shows in a notebook next to the answers.
 */
export interface CheckedArguments<I extends string> {
  /** Who checked: the function's title, as in its error messages. */
  readonly title: string;
  /** Values in canonical units, defaults filled in; an optional argument not given is absent. */
  readonly values: { readonly [K in I]?: number };
  /** Each argument's definition: label, unit, ranges and the quantity. */
  readonly definitions: { readonly [K in I]: InputDefinition };
  /** Values outside their typical range, as messages. */
  readonly flags: readonly string[];
}

/**
 * What every result of a plain physics function carries besides its answers: the flags, the
 * checked arguments, the definitions that label its numbers, and its notebook display.
 */
export interface CheckedResult<I extends string, O extends string> {
  /** Arguments outside their typical range. */
  readonly flags: readonly string[];
  /** The checked arguments (defaults filled in) with their labels and units. */
  readonly arguments: CheckedArguments<I>;
  /** Labels and units of the numbers reported. */
  readonly outputDefinitions: { readonly [K in O]: OutputDefinition };
  /** Notebook display. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** A change of settings that could stop a velocity aliasing. */
export type AliasingRemedy =
  | "maximumPrf"
  | "baselineShift"
  | "shallowerSampleVolume"
  | "lowerTransmitFrequency"
  | "continuousWave";

/** Arguments of the aliasing check, by name. */
export type AliasingArgument =
  | "velocity"
  | "prfHz"
  | "transmitFrequencyMHz"
  | "sampleDepthCm"
  | "angleDeg"
  | "soundSpeedMps"
  | "lowerTransmitFrequencyMHz";

/** The one setting a change of settings would use. */
export interface AliasingSetting {
  /** The argument of the aliasing check it replaces, e.g. "prfHz". */
  readonly name: AliasingArgument;
  /** Its label, e.g. "Pulse repetition frequency". */
  readonly label: string;
  /** The value to use, in the canonical unit. */
  readonly value: number;
  /** The canonical unit. */
  readonly unit: string;
  /** The quantity (display resolution, ranges). */
  readonly quantity: Quantity;
}

/** One change of settings and the Nyquist limit it would give. */
export interface AliasingOption {
  /** Which change. */
  readonly remedy: AliasingRemedy;
  /** The change in a few words, e.g. "Shift the baseline". */
  readonly label: string;
  /** What to do, in words. */
  readonly description: string;
  /** The setting to use (null when the change has no single number). */
  readonly setting: AliasingSetting | null;
  /** Nyquist velocity after the change, m/s, in the direction of the flow (Infinity: no limit). */
  readonly nyquistVelocity: number;
  /** True when the velocity would no longer alias (and the setting is practical). */
  readonly resolves: boolean;
  /** What the change costs. */
  readonly tradeOff: string;
}

/** Result of the aliasing check; its display shows the verdict and a table of the options. */
export interface AliasingCheck
  extends CheckedResult<AliasingArgument, "nyquistVelocity" | "maxPrfHz"> {
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
}

/** Arguments of the range-ambiguity function, by name. */
export type RangeAmbiguityArgument = "sampleDepthCm" | "prfHz" | "imagingDepthCm" | "soundSpeedMps";

/** Result of the range-ambiguity function; its display shows the mode and a table of the
 * sample-volume depths. */
export interface RangeAmbiguity
  extends CheckedResult<RangeAmbiguityArgument, "unambiguousDepthCm"> {
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
}
