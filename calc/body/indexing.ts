/**
 * Indexing a measurement to body size: value / BSA, one family member per quantity. Chained after
 * a BSA formula (`chain([bsaHaycock, indexedToBsa(LV_MASS)])`), the uncertainty of height and
 * weight reaches the indexed value.
 *
 * @module
 */
import type { Calculation, Citation, Quantity } from "../core/types.ts";
import { defineQuantity } from "../core/quantity.ts";
import { defineFamily, type Family } from "../core/family.ts";
import { BODY_SURFACE_AREA } from "../quantities/body.ts";
import {
  LA_VOLUME,
  LA_VOLUME_INDEX,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_DIASTOLIC_VOLUME_INDEX,
  LV_END_SYSTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME_INDEX,
  LV_MASS,
  LV_MASS_INDEX,
} from "../quantities/structure.ts";
import {
  AORTIC_VALVE_AREA,
  AORTIC_VALVE_AREA_INDEX,
  CARDIAC_INDEX,
  CARDIAC_OUTPUT,
  STROKE_VOLUME,
  STROKE_VOLUME_INDEX,
} from "../quantities/flow.ts";
import { LANG_2015 } from "../citations.ts";

/** Quantities whose indexed form the guidelines name and range (declared with them). */
const NAMED_INDICES: ReadonlyMap<Quantity, Quantity> = new Map([
  [LV_MASS, LV_MASS_INDEX],
  [LA_VOLUME, LA_VOLUME_INDEX],
  [LV_END_DIASTOLIC_VOLUME, LV_END_DIASTOLIC_VOLUME_INDEX],
  [LV_END_SYSTOLIC_VOLUME, LV_END_SYSTOLIC_VOLUME_INDEX],
  [STROKE_VOLUME, STROKE_VOLUME_INDEX],
  [CARDIAC_OUTPUT, CARDIAC_INDEX],
  [AORTIC_VALVE_AREA, AORTIC_VALVE_AREA_INDEX],
]);

const derived = new Map<string, Quantity>();

/**
 * The quantity "Q per m² of body surface area": the one the guidelines name where there is one
 * (LV mass index, LA volume index, cardiac index, …), otherwise derived from Q's declaration
 * (label "Q indexed to BSA", unit "Q's unit/m²", valid range from Q's over a positive BSA).
 *
 * @param q The quantity indexed.
 * @returns Its indexed quantity.
 *
 * @example
 * ```ts
 * import { defineQuantity, indexedQuantity, LV_END_DIASTOLIC_VOLUME, LV_MASS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(indexedQuantity(LV_MASS).label, "LV mass index");
 * assert.equal(indexedQuantity(LV_END_DIASTOLIC_VOLUME).unit, "mL/m^2");
 * // a quantity without a named index: any value over a positive BSA, never zero or infinite
 * const area = defineQuantity({ id: "demoJetArea", label: "Jet area", unit: "cm^2",
 *   description: "Colour jet area", valid: { min: 0, max: 50, minExclusive: true }, resolution: 0.1 });
 * assert.deepEqual(indexedQuantity(area).valid,
 *   { min: 0, max: Infinity, minExclusive: true, maxExclusive: true });
 * ```
 */
export function indexedQuantity(q: Quantity): Quantity {
  const named = NAMED_INDICES.get(q);
  if (named) return named;
  let d = derived.get(q.id);
  if (d === undefined) {
    d = defineQuantity({
      id: `${q.id}Index`,
      label: `${q.label} indexed to BSA`,
      symbol: `${q.symbol}i`,
      unit: `${q.unit}/m^2`,
      description: `${q.label} per m² of body surface area`,
      // any value over a positive BSA: zero only where Q may be zero, no infinite value
      valid: q.valid.min >= 0
        ? {
          min: 0,
          max: Infinity,
          minExclusive: q.valid.min > 0 || Boolean(q.valid.minExclusive),
          maxExclusive: true,
        }
        : { min: -Infinity, max: Infinity, minExclusive: true, maxExclusive: true },
      resolution: q.resolution,
      rangeNote: `derived from ${q.label}: any value over a positive body surface area`,
    });
    derived.set(q.id, d);
  }
  return d;
}

const LANG_2015_INDEXING: Citation = { ...LANG_2015, locator: "indexing of chamber size to BSA" };

/** Quantities registered for the indexing family (its documented members). */
const MEMBERS: readonly Quantity[] = [
  LV_MASS,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME,
  LA_VOLUME,
  STROKE_VOLUME,
  CARDIAC_OUTPUT,
  AORTIC_VALVE_AREA,
];

/**
 * The family "measurement / BSA", one member per quantity: input named by the quantity's id and
 * `bsaM2`, output named by the indexed quantity's id.
 *
 * Formula: indexed [unit/m²] = measurement [unit] / BSA [m²]
 *
 * Source: indexing of chamber size to BSA as recommended by Lang RM et al., J Am Soc
 * Echocardiogr 2015;28:1–39.
 *
 * @example
 * ```ts
 * import { evaluate, INDEXED_TO_BSA, LV_MASS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 190 g / 1.9 m² = 100 g/m² (hand-checkable arithmetic)
 * const r = evaluate(INDEXED_TO_BSA.calculation(LV_MASS), { lvMass: 190, bsaM2: 1.9 });
 * assert.equal(r.outputs.lvMassIndex, 100);
 * ```
 */
export const INDEXED_TO_BSA: Family<Quantity> = defineFamily<Quantity>({
  id: "indexedToBsa",
  title: "Indexed to body surface area",
  description: "A measurement divided by body surface area, one calculation per quantity.",
  members: MEMBERS,
  key: (q) => q.id,
  toData: (q) => q.id,
  fromData: (id) => {
    const q = MEMBERS.find((m) => m.id === id);
    if (q === undefined) {
      throw new TypeError(
        `Indexed to BSA: expected a registered quantity (${
          MEMBERS.map((m) => m.id).join(", ")
        }), got ${JSON.stringify(id)}`,
      );
    }
    return q;
  },
  define: (q) => {
    const out = indexedQuantity(q);
    return {
      id: `indexedToBsa(${q.id})`,
      title: `${out.label}`,
      description: `${q.label} divided by body surface area.`,
      inputs: { [q.id]: q, bsaM2: BODY_SURFACE_AREA },
      outputs: { [out.id]: out },
      formula: (x: Record<string, number>) => ({ [out.id]: x[q.id]! / x.bsaM2! }),
      formulaText: `${out.symbol} = ${q.symbol} / BSA`,
      citations: [LANG_2015_INDEXING],
      cautions: [
        "Ratio indexing assumes the measurement scales linearly with BSA; in obesity and in children this overcorrects",
      ],
      clinical: true,
    };
  },
});

/**
 * The calculation "q / BSA" (a member of {@linkcode INDEXED_TO_BSA}).
 *
 * @param q The quantity to index.
 * @returns The calculation with inputs `q.id` and `bsaM2` and output the indexed quantity's id.
 *
 * @example
 * ```ts
 * import { evaluate, indexedToBsa, LA_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 60 mL / 2 m² = 30 mL/m²
 * assert.equal(evaluate(indexedToBsa(LA_VOLUME), { laVolume: 60, bsaM2: 2 }).outputs.laVolumeIndex, 30);
 * ```
 */
export function indexedToBsa(q: Quantity): Calculation {
  return INDEXED_TO_BSA.calculation(q);
}
