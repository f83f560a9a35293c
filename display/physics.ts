/**
 * Notebook displays of the ultrasound-physics results that give several answers: the aliasing
 * check and range ambiguity. Labels and units come from the arguments' and outputs' quantities;
 * numbers are rounded to each quantity's display resolution; flags follow the table.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type {
  AliasingCheck,
  AliasingOption,
  CheckedArguments,
  RangeAmbiguity,
} from "../calc/physics/types.ts";
import { withUnit } from "../calc/core/text.ts";
import { tableBundle } from "./mime.ts";
import { formatResolution } from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";

export { JUPYTER_DISPLAY } from "./mime.ts";

/** A value with its unit, rounded to a quantity's display resolution. */
function shown(
  value: number,
  q: { readonly unit: string; readonly quantity: { resolution: number } },
) {
  return withUnit(formatResolution(value, q.quantity.resolution), q.unit);
}

/** The checked arguments as notes: "Pulse repetition frequency = 4000 Hz" (defaults included). */
function settingNotes<I extends string>(checked: CheckedArguments<I>): string[] {
  const notes: string[] = [];
  for (const name of Object.keys(checked.definitions) as I[]) {
    const value = checked.values[name];
    if (value === undefined) continue;
    const d = checked.definitions[name];
    notes.push(`${d.label} = ${shown(value, d)}`);
  }
  return notes;
}

function settingCell(o: AliasingOption): string {
  return o.setting === null ? "" : `${o.setting.label} = ${shown(o.setting.value, o.setting)}`;
}

/**
 * The MIME bundle of an aliasing check: whether the velocity aliases at the current Nyquist
 * limit, then each change of settings with the setting to use, the Nyquist velocity it gives,
 * whether it resolves the aliasing, what to do and what it costs; the settings checked and the
 * flags below.
 *
 * @param r The result of `aliasingCheck`.
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { aliasingCheck, displayAliasingCheck } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = aliasingCheck({ velocity: 1.5, prfHz: 4000, transmitFrequencyMHz: 2, sampleDepthCm: 15 });
 * const text = String(displayAliasingCheck(r)["text/plain"]);
 * // Nyquist velocity 2000 · 1540 / (2 · 2e6) = 0.77 m/s (hand check)
 * assert.match(text, /1\.50 m\/s aliases \(Nyquist velocity 0\.77 m\/s\)/);
 * assert.match(text, /Continuous-wave Doppler\s+no limit\s+yes/);
 * ```
 */
export function displayAliasingCheck(r: AliasingCheck): MimeBundle {
  const velocity = r.arguments.definitions.velocity;
  const limit = r.outputDefinitions.nyquistVelocity;
  const title = `${r.arguments.title}: ${shown(r.velocity, velocity)} ${
    r.aliases ? "aliases" : "does not alias"
  } (${limit.label} ${shown(r.nyquistVelocity, limit)})`;
  const header = [
    "Change",
    "Setting",
    labelWithUnit(limit.label, limit.unit),
    "Resolves",
    "What to do",
    "Trade-off",
  ];
  const rows = r.options.map((o) => [
    o.label,
    settingCell(o),
    Number.isFinite(o.nyquistVelocity)
      ? formatResolution(o.nyquistVelocity, limit.quantity.resolution)
      : "no limit",
    o.resolves ? "yes" : "no",
    o.description,
    o.tradeOff,
  ]);
  return tableBundle(title, header, rows, {
    Settings: settingNotes(r.arguments),
    Flags: r.flags,
  });
}

/**
 * The MIME bundle of a range-ambiguity result: the mode, the pulses in flight and the spacing,
 * then every sample-volume depth marked intended or ambiguous; the settings checked and the flags
 * below.
 *
 * @param r The result of `rangeAmbiguity`.
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { displayRangeAmbiguity, rangeAmbiguity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = rangeAmbiguity({ sampleDepthCm: 12, prfHz: 10000, imagingDepthCm: 16 });
 * const text = String(displayRangeAmbiguity(r)["text/plain"]);
 * // spacing c/(2·PRF) = 1540 / 20000 m = 7.7 cm; 12 − 7.7 = 4.3 cm (hand check)
 * assert.match(text, /Unambiguous depth 7\.7 cm/);
 * assert.match(text, /4\.3\s+ambiguous/);
 * assert.match(text, /12\.0\s+intended/);
 * ```
 */
export function displayRangeAmbiguity(r: RangeAmbiguity): MimeBundle {
  const spacing = r.outputDefinitions.unambiguousDepthCm;
  const depth = r.arguments.definitions.sampleDepthCm;
  const mode = r.highPrf
    ? `high-PRF, ${r.pulsesInFlight} pulses in flight`
    : "the sample volume lies within the unambiguous depth";
  const title = `${r.arguments.title}: ${mode}; ${spacing.label} ${
    shown(r.unambiguousDepthCm, spacing)
  }`;
  const rows = r.sampleVolumeDepthsCm.map((d) => [
    formatResolution(d, depth.quantity.resolution),
    d === r.sampleDepthCm ? "intended" : "ambiguous",
  ]);
  return tableBundle(title, [labelWithUnit(depth.label, depth.unit), "Echo"], rows, {
    Settings: settingNotes(r.arguments),
    Flags: r.flags,
  });
}
