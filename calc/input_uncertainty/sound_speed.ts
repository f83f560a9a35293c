/**
 * The speed-of-sound scale: the scanner converts echo times and Doppler shifts to distances and
 * velocities with c₀ = 1540 m/s, while the tissue's speed differs by a few percent. One shared
 * scale factor s = c_true/c₀, an uncertain value of a single source, multiplies every displayed
 * distance and velocity (a VTI is a distance), s² every area and s³ every volume; fed to every
 * corrected input, the same s makes them correlated, so it cancels in ratios (EF), enters a
 * Bernoulli gradient as s², LV mass as about s³ and a continuity valve area as s².
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import { chain, type ChainStep } from "../core/chain.ts";
import { defineFamily, type Family } from "../core/family.ts";
import { issueError } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import type { Calculation, Citation, Quantity } from "../core/types.ts";
import { QUANTITIES } from "../quantities/mod.ts";
import { BODY_QUANTITIES } from "../quantities/body.ts";
import { SOUND_SPEED, ULTRASOUND_QUANTITIES } from "../quantities/ultrasound.ts";
import { SOUND_SPEED_SCALE } from "../quantities/uncertainty.ts";
import {
  CHAMBER_AREA,
  LA_VOLUME,
  LV_END_DIASTOLIC_DIAMETER,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_DIAMETER,
  LV_END_SYSTOLIC_VOLUME,
  LVOT_DIAMETER,
  POSTERIOR_WALL_THICKNESS,
  SEPTAL_THICKNESS,
} from "../quantities/structure.ts";
import {
  AORTIC_PEAK_VELOCITY,
  AORTIC_VTI,
  LVOT_PEAK_VELOCITY,
  LVOT_VTI,
  PEAK_VELOCITY,
  TR_PEAK_VELOCITY,
} from "../quantities/flow.ts";
import { DEFAULT_SOUND_SPEED_MPS } from "../physics/shared.ts";
import { KREMKAU } from "../physics/citations.ts";
import { type TissueName, tissueProperties } from "../physics/tissues.ts";
import { type InputEstimate, rectangular } from "../uncertainty/distributions.ts";
import { propagate, type PropagateOptions } from "../uncertainty/propagate.ts";
import type { UncertainValue } from "../uncertainty/types.ts";

const RANGE_AND_DOPPLER_EQUATIONS: Citation = {
  ...KREMKAU,
  locator:
    "ch. 2 (1540 m/s assumed; range equation d = c·t/2), ch. 5 (Doppler equation v = c·Δf/(2·f₀·cos θ))",
};

const REFERENCE_RANGE_CAUTION =
  "Reference ranges and grading limits were measured on scanners assuming 1540 m/s: compare the displayed value with them, not the value at the true speed of sound";

const ONE_SCALE_CAUTION =
  "One scale for every path is a simplification: wall thickness crosses myocardium, a cavity crosses blood, a Doppler velocity depends on the speed in blood at the sample";

/**
 * The speed-of-sound scale factor: the true speed of sound over the speed the scanner assumes.
 *
 * Formula: s = c_true / c₀, c₀ = 1540 m/s unless given.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2 (the 1540 m/s
 * assumption and the range equation d = c·t/2) and ch. 5 (the Doppler equation, v ∝ c).
 *
 * @example Blood at 1560 m/s
 * ```ts
 * import { evaluate, soundSpeedScale } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const s = evaluate(soundSpeedScale, { trueSoundSpeedMps: 1560 }).outputs.soundSpeedScale;
 * assert.ok(Math.abs(s - 1560 / 1540) < 1e-15);
 * ```
 */
export const soundSpeedScale: Calculation<
  "trueSoundSpeedMps" | "assumedSoundSpeedMps",
  "soundSpeedScale"
> = defineCalculation({
  id: "soundSpeedScale",
  title: "Speed-of-sound scale factor",
  description:
    "The true speed of sound over the speed the scanner assumes: the factor that rescales displayed distances and velocities.",
  inputs: {
    trueSoundSpeedMps: {
      quantity: SOUND_SPEED,
      label: "True speed of sound",
      description: "Speed of sound in the tissue the measurement crosses",
    },
    assumedSoundSpeedMps: {
      quantity: SOUND_SPEED,
      label: "Assumed speed of sound",
      description: "Speed of sound the scanner assumes (1540 m/s for soft tissue)",
      default: DEFAULT_SOUND_SPEED_MPS,
    },
  },
  outputs: { soundSpeedScale: SOUND_SPEED_SCALE },
  formula: ({ trueSoundSpeedMps, assumedSoundSpeedMps }) => ({
    soundSpeedScale: trueSoundSpeedMps / assumedSoundSpeedMps,
  }),
  formulaText: "s = c_true / c₀",
  citations: [RANGE_AND_DOPPLER_EQUATIONS],
  cautions: [REFERENCE_RANGE_CAUTION, ONE_SCALE_CAUTION],
});

/** How a canonical unit scales with the speed of sound: the power of length in it. Units of
 * measurands read from echo timing or Doppler shifts only; a test checks each against the unit
 * engine's dimensions. */
const LENGTH_POWER_BY_UNIT: ReadonlyMap<string, number> = new Map([
  ["mm", 1],
  ["cm", 1],
  ["m/s", 1],
  ["cm/s", 1],
  ["m/s^2", 1],
  ["cm^2", 2],
  ["mL", 3],
  ["mL/s", 3],
  ["L/min", 3],
]);

/** Quantities that are not read from echoes: body size, the scanner's settings and the physics
 * computed from them (among them the speed of sound itself). */
const NOT_FROM_ECHOES: ReadonlySet<Quantity> = new Set([
  ...BODY_QUANTITIES,
  ...ULTRASOUND_QUANTITIES,
]);

const SCALED_UNITS = [...LENGTH_POWER_BY_UNIT.keys()].join(", ");

/** Why a quantity is not rescaled (what it is), or null when it is. */
function unscaledReason(q: Quantity): string | null {
  if (NOT_FROM_ECHOES.has(q)) {
    return `${q.label}, a body size, scanner setting or physics quantity, not read from echoes`;
  }
  if (!LENGTH_POWER_BY_UNIT.has(q.unit)) return `${q.label} in ${q.unit}`;
  return null;
}

/**
 * The power k with which a displayed quantity scales with the speed of sound: 1 for a distance
 * or a velocity (a VTI is a distance), 2 for an area, 3 for a volume (or a flow: a volume per
 * time), from the quantity's unit.
 *
 * Formula: k = the power of length in the unit (distance = c·t/2; Doppler velocity =
 * c·Δf/(2·f₀·cos θ); times are read directly and do not scale).
 *
 * Source: Kremkau 2015, ch. 2 and 5 (range and Doppler equations).
 *
 * @param q A quantity read from echoes.
 * @returns k, 1 to 3.
 * @throws {TypeError} For a body size, a scanner setting, the speed of sound itself, or a unit
 * that is not a distance, velocity, area or volume.
 *
 * @example
 * ```ts
 * import { LV_END_DIASTOLIC_VOLUME, LVOT_VTI, soundSpeedPower } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(soundSpeedPower(LVOT_VTI), 1); // cm
 * assert.equal(soundSpeedPower(LV_END_DIASTOLIC_VOLUME), 3); // mL
 * ```
 */
export function soundSpeedPower(q: Quantity): number {
  const reason = unscaledReason(q);
  if (reason !== null) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where: "At the true speed of sound",
      field: "quantity",
      received: reason,
      expected: `a distance, velocity, area or volume read from echoes (${SCALED_UNITS})`,
    }]);
  }
  return LENGTH_POWER_BY_UNIT.get(q.unit)!;
}

/** The quantities the family documents: the dimensions, velocities, VTIs, areas and volumes of
 * the package's echo calculations. */
const MEMBERS: readonly Quantity[] = [
  LVOT_DIAMETER,
  LV_END_DIASTOLIC_DIAMETER,
  LV_END_SYSTOLIC_DIAMETER,
  SEPTAL_THICKNESS,
  POSTERIOR_WALL_THICKNESS,
  PEAK_VELOCITY,
  LVOT_PEAK_VELOCITY,
  AORTIC_PEAK_VELOCITY,
  TR_PEAK_VELOCITY,
  LVOT_VTI,
  AORTIC_VTI,
  CHAMBER_AREA,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME,
  LA_VOLUME,
];

const POWER_TEXT = ["", "s", "s²", "s³"];

/** The output name of a member: the quantity's id with "AtTrueSoundSpeed". */
function correctedName(name: string): string {
  return `${name}AtTrueSoundSpeed`;
}

/**
 * The family "displayed value at the true speed of sound", one member per quantity: inputs named
 * by the quantity's id (the displayed value) and `soundSpeedScale`, output named by the id with
 * "AtTrueSoundSpeed". Give every member the same scale value (an uncertain value from
 * {@linkcode trueSoundSpeedScale}) so that the corrected values share its source.
 *
 * Formula: x_true = x_displayed · s^k, k from {@linkcode soundSpeedPower} (1 distance or
 * velocity, 2 area, 3 volume).
 *
 * Source: Kremkau 2015, ch. 2 (range equation) and ch. 5 (Doppler equation).
 *
 * @example A 2.0 cm LVOT diameter at s = 1.02
 * ```ts
 * import { AT_TRUE_SOUND_SPEED, evaluate, LVOT_DIAMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(AT_TRUE_SOUND_SPEED.calculation(LVOT_DIAMETER),
 *   { lvotDiameter: 2, soundSpeedScale: 1.02 });
 * assert.ok(Math.abs(r.outputs.lvotDiameterAtTrueSoundSpeed! - 2.04) < 1e-12);
 * ```
 */
export const AT_TRUE_SOUND_SPEED: Family<Quantity> = defineFamily<Quantity>({
  id: "atTrueSoundSpeed",
  title: "At the true speed of sound",
  description:
    "A displayed distance, velocity, area or volume rescaled from the 1540 m/s the scanner assumes to the true speed of sound (× s, s² or s³), one calculation per quantity.",
  members: MEMBERS,
  key: (q) => q.id,
  toData: (q) => q.id,
  fromData: (id) => {
    const q = typeof id === "string" ? QUANTITIES.get(id) : undefined;
    if (q === undefined) {
      throw issueError([{
        kind: "type",
        severity: "error",
        where: "At the true speed of sound",
        field: "quantity",
        received: describeValue(id),
        expected: "the id of a quantity the package declares",
      }]);
    }
    return q;
  },
  define: (q) => {
    const k = soundSpeedPower(q);
    const out = correctedName(q.id);
    return {
      id: `atTrueSoundSpeed(${q.id})`,
      title: `${q.label} at the true speed of sound`,
      description: `${q.label} as displayed (c₀ = 1540 m/s) rescaled to the true speed of sound.`,
      inputs: {
        [q.id]: {
          quantity: q,
          label: `${q.label} as displayed`,
          description: `${q.label} as the scanner displays it, computed with c₀ = 1540 m/s`,
        },
        soundSpeedScale: SOUND_SPEED_SCALE,
      },
      outputs: {
        [out]: {
          quantity: q,
          label: `${q.label} at the true speed of sound`,
          description: `${q.label} rescaled by ${POWER_TEXT[k]}`,
        },
      },
      formula: (x: Record<string, number>) => ({ [out]: x[q.id]! * x.soundSpeedScale! ** k }),
      formulaText: `${q.symbol}_true = ${q.symbol}·${POWER_TEXT[k]}`,
      citations: [RANGE_AND_DOPPLER_EQUATIONS],
      cautions: [REFERENCE_RANGE_CAUTION, ONE_SCALE_CAUTION],
      clinical: true,
    };
  },
});

/**
 * The calculation "q at the true speed of sound" (a member of {@linkcode AT_TRUE_SOUND_SPEED}).
 *
 * @param q A distance, velocity, area or volume read from echoes.
 * @returns The member: inputs `q.id` and `soundSpeedScale`, output `q.id + "AtTrueSoundSpeed"`.
 * @throws {TypeError} As {@linkcode soundSpeedPower}.
 *
 * @example An EDV of 150 mL at s = 1.01: × 1.01³
 * ```ts
 * import { atTrueSoundSpeed, evaluate, LV_END_DIASTOLIC_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(atTrueSoundSpeed(LV_END_DIASTOLIC_VOLUME),
 *   { lvEndDiastolicVolume: 150, soundSpeedScale: 1.01 });
 * assert.ok(Math.abs(r.outputs.lvEndDiastolicVolumeAtTrueSoundSpeed! - 150 * 1.01 ** 3) < 1e-9);
 * ```
 */
export function atTrueSoundSpeed(q: Quantity): Calculation {
  return AT_TRUE_SOUND_SPEED.calculation(q);
}

/**
 * A calculation with its displayed inputs rescaled to the true speed of sound, as one chain: a
 * member of {@linkcode AT_TRUE_SOUND_SPEED} for each rescaled input, then the calculation. The
 * chain keeps the calculation's input names for the displayed values and adds one input,
 * `soundSpeedScale`, shared by every rescaled input; its outputs are the calculation's. So
 * correlated inputs of the calculation (shared boundaries) and the scale propagate in one run.
 *
 * Formula: y = f(x₁·s^k₁, x₂·s^k₂, …), kᵢ from {@linkcode soundSpeedPower}.
 *
 * Source: Kremkau 2015, ch. 2 and 5.
 *
 * @param calc The calculation.
 * @param inputs The inputs to rescale. @default every input read from echoes with a distance,
 * velocity, area or volume unit
 * @returns The chain (relations between inputs of one power are kept on the displayed values).
 * @throws {TypeError} For an unknown input, an input that cannot be rescaled, none to rescale, or
 * a relation between inputs of different powers.
 *
 * @example The Bernoulli gradient scales as s²
 * ```ts
 * import { atTrueSoundSpeedChain, evaluate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const g = atTrueSoundSpeedChain(simplifiedBernoulli);
 * const r = evaluate(g, { peakVelocity: 4, soundSpeedScale: 1.01 });
 * assert.ok(Math.abs(r.outputs.gradient! - 64 * 1.01 ** 2) < 1e-9);
 * ```
 */
export function atTrueSoundSpeedChain<I extends string, O extends string>(
  typed: Calculation<I, O>,
  inputs?: readonly I[],
): Calculation<I | "soundSpeedScale", O> {
  const calc = typed as unknown as Calculation;
  const where = "At the true speed of sound";
  const names: readonly string[] = inputs ??
    calc.inputNames.filter((n) => unscaledReason(calc.inputs[n]!.quantity) === null);
  for (const n of names) {
    const def = calc.inputs[n];
    if (def === undefined) {
      throw issueError([{
        kind: "unknown",
        severity: "error",
        where,
        field: n,
        received: describeValue(n),
        expected: `one of ${calc.inputNames.join(", ")}`,
      }]);
    }
    soundSpeedPower(def.quantity);
  }
  if (names.length === 0) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where,
      field: "inputs",
      received: `no input of '${calc.id}' to rescale`,
      expected: "at least one distance, velocity, area or volume read from echoes",
    }]);
  }
  const power = (n: string) => names.includes(n) ? soundSpeedPower(calc.inputs[n]!.quantity) : 0;
  for (const c of calc.constraints) {
    if (new Set(c.inputs.map(power)).size > 1) {
      throw issueError([{
        kind: "type",
        severity: "error",
        where,
        field: c.inputs.join(", "),
        received: `the relation ${c.description} between inputs rescaled by different powers`,
        expected: "relations only between inputs rescaled alike",
      }]);
    }
  }
  const steps: ChainStep[] = names.map((n) => {
    const q = calc.inputs[n]!.quantity;
    return {
      calculation: atTrueSoundSpeed(q),
      inputs: { [q.id]: n },
      outputs: { [correctedName(q.id)]: correctedName(n) },
    };
  });
  steps.push({
    calculation: calc,
    inputs: Object.fromEntries(names.map((n) => [n, correctedName(n)])),
  });
  const chained = chain(steps, {
    id: `atTrueSoundSpeed(${calc.id})`,
    title: `${calc.title} at the true speed of sound`,
    description: `${calc.title} with ${
      names.join(", ")
    } rescaled from the displayed values to the true speed of sound.`,
    outputs: [...calc.outputNames],
  });
  if (calc.constraints.length === 0) return chained as Calculation<I | "soundSpeedScale", O>;
  // a relation between inputs rescaled alike holds on the displayed values as on the true ones
  return defineCalculation({
    id: chained.id,
    title: chained.title,
    description: chained.description,
    inputs: chained.inputs,
    outputs: chained.outputs,
    formula: chained.formula,
    formulaText: chained.formulaText,
    citations: chained.citations,
    cautions: chained.cautions,
    constraints: calc.constraints,
    clinical: chained.clinical,
    recipe: chained.recipe,
  }) as Calculation<I | "soundSpeedScale", O>;
}

/** Options of {@linkcode trueSoundSpeedScale}. */
export interface TrueSoundSpeedOptions
  extends Pick<PropagateOptions, "method" | "trials" | "seed" | "coverage"> {
  /** Tissues of the physics module's table whose speeds bound the true speed (rectangular
   * between the lowest and the highest). @default ["blood", "myocardium"] */
  readonly tissues?: readonly TissueName[];
  /** Your own distribution of the true speed, m/s (replaces the tissues). */
  readonly trueSoundSpeed?: InputEstimate;
  /** Where your own distribution comes from, for the budget label. @default "given" */
  readonly source?: string;
}

const WHERE_SCALE = "True speed-of-sound scale";

/**
 * The speed-of-sound scale s = c_true/c₀ as an uncertain value of one source (the true speed),
 * to be fed to every member of {@linkcode AT_TRUE_SOUND_SPEED} or
 * {@linkcode atTrueSoundSpeedChain} of one analysis. By default the true speed lies anywhere
 * between the blood and myocardium speeds of the physics module's tissue table (rectangular):
 * cardiac distances cross those two tissues and Doppler velocities are measured in blood.
 *
 * Formula: c_true ~ rectangular(min cᵢ, max cᵢ) over the chosen tissues; s = c_true/1540
 * ({@linkcode soundSpeedScale}); u(s) = (max − min)/(√12·1540).
 *
 * Source: the tissue speeds of {@linkcode TISSUE_ACOUSTIC_PROPERTIES} (blood 1560 m/s, Bushberg
 * et al. 2012; myocardium 1576 m/s, Culjat et al. 2010 after Duck 1990; both entered from
 * memory, a mark the budget label carries). Checked with search: a literature compilation gives
 * 1526–1623 m/s for heart tissue and an ex vivo study 1586 ± 24 m/s for myocardium, and a
 * textbook glossary 1570 m/s for blood; the table's values lie inside these, but the published
 * spread of heart tissue is wider than the blood–myocardium interval (give `trueSoundSpeed` to
 * use it).
 *
 * @param options The tissues, or your own distribution of the true speed and its source; the
 * propagation's method options.
 * @returns The scale as an uncertain value whose source label names the speeds and their source.
 * @throws {TypeError} For an unknown tissue or options of the wrong type.
 * @throws {RangeError} For tissues that do not bound an interval (one speed), or a speed outside
 * its valid range.
 *
 * @example Blood and myocardium: s = 1568/1540, u(s) = 16/(√12·1540)
 * ```ts
 * import { trueSoundSpeedScale } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const s = trueSoundSpeedScale();
 * assert.ok(Math.abs(s.value - 1568 / 1540) < 1e-12);
 * assert.ok(Math.abs(s.standardUncertainty - 16 / (Math.sqrt(12) * 1540)) < 1e-9);
 * assert.match(s.budget[0]!.label, /from memory/);
 * ```
 */
export function trueSoundSpeedScale(options: TrueSoundSpeedOptions = {}): UncertainValue {
  if (typeof options !== "object" || options === null) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where: WHERE_SCALE,
      field: "options",
      received: describeValue(options),
      expected: "as an object of options",
    }]);
  }
  const { tissues, trueSoundSpeed, source, ...method } = options;
  let speed: InputEstimate;
  let label: string;
  if (trueSoundSpeed !== undefined) {
    speed = trueSoundSpeed;
    label = `True speed of sound (${source ?? "given"})`;
  } else {
    const rows = (tissues ?? ["blood", "myocardium"]).map((t) => tissueProperties(t));
    const speeds = rows.map((r) => r.soundSpeedMps);
    const lower = speeds.reduce((a, b) => Math.min(a, b), Infinity);
    const upper = speeds.reduce((a, b) => Math.max(a, b), -Infinity);
    if (!(upper > lower)) {
      throw issueError([{
        kind: "range",
        severity: "error",
        where: WHERE_SCALE,
        field: "tissues",
        received: `${rows.map((r) => r.name).join(", ")} (${lower} m/s)`,
        expected: "tissues of at least two different speeds, or your own trueSoundSpeed",
      }]);
    }
    const cited = [...new Set(rows.flatMap((r) => r.citations))].map((c) =>
      `${c.authors.split(/[ ,]/)[0]} ${c.year}`
    );
    const recalled = rows.some((r) => /from memory/i.test(r.note));
    speed = rectangular(lower, upper);
    label = `${rows.map((r) => r.label).join("–")} ${lower}–${upper} m/s (${cited.join(", ")}${
      recalled ? "; from memory" : ""
    })`;
  }
  return propagate(soundSpeedScale, { trueSoundSpeedMps: speed }, { ...method, label })
    .outputs.soundSpeedScale;
}
