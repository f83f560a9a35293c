/**
 * A small table of acoustic properties of tissues and reference media, one published source per
 * row. Values are representative; published values for a tissue vary by several percent
 * (speed, density) and by a factor of two or more (attenuation).
 *
 * @module
 */
import type { Citation } from "../core/types.ts";
import { describeValue } from "../core/text.ts";
import { issueError } from "../core/issues.ts";
import { SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ } from "./attenuation.ts";
import { BUSHBERG, KREMKAU } from "./citations.ts";
import { DEFAULT_SOUND_SPEED_MPS } from "./shared.ts";

/** Names of the tissues in {@linkcode TISSUE_ACOUSTIC_PROPERTIES}. */
export type TissueName = "softTissue" | "blood" | "myocardium" | "fat" | "bone" | "water" | "air";

/** Acoustic properties of one tissue or medium. */
export interface TissueAcousticProperties {
  /** Key in the table. */
  readonly name: TissueName;
  /** Name a reader sees. */
  readonly label: string;
  /** Speed of sound, m/s. */
  readonly soundSpeedMps: number;
  /** Density, kg/m³. */
  readonly densityKgPerM3: number;
  /** Characteristic acoustic impedance as published, MRayl (≈ density × speed / 10⁶). */
  readonly impedanceMRayl: number;
  /** Representative attenuation coefficient at 1 MHz, dB/cm/MHz; null when not meaningful
   * (air: total reflection at any tissue/air interface). */
  readonly attenuationDbPerCmMHz: number | null;
  /** Published spread of the attenuation coefficient, dB/cm/MHz, when the source gives one. */
  readonly attenuationRangeDbPerCmMHz?: readonly [number, number];
  /** Caveats for this row. */
  readonly note: string;
  /** Where the numbers come from. */
  readonly citations: readonly Citation[];
}

const DUCK: Citation = {
  authors: "Duck FA",
  year: 1990,
  title: "Physical Properties of Tissue: A Comprehensive Reference Book",
  publication: "Academic Press, London",
  locator: "ch. 4 (acoustic properties)",
};

const CULJAT: Citation = {
  authors: "Culjat MO, Goldenberg D, Tewari P, Singh RS",
  year: 2010,
  title: "A review of tissue substitutes for ultrasound imaging",
  publication: "Ultrasound Med Biol 36(6):861-873",
  locator: "Table 1 (acoustic properties of human tissues)",
  doi: "10.1016/j.ultrasmedbio.2010.02.012",
};

/**
 * Acoustic properties of soft tissue, blood, myocardium, fat, bone, water and air.
 *
 * Sources (values from memory, see each row): Bushberg JT et al. The Essential Physics of Medical
 * Imaging, 3rd ed. 2012, ch. 14 (speed, density, impedance; attenuation ranges); Kremkau FW.
 * Sonography Principles and Instruments, 9th ed. 2015, ch. 2 (0.5 dB/cm/MHz soft-tissue rule);
 * Culjat MO et al. Ultrasound Med Biol 2010;36:861-873, Table 1 and Duck FA 1990 (myocardium).
 *
 * @example Z = ρ·c of the soft-tissue row agrees with its published impedance
 * ```ts
 * import { acousticImpedance, evaluate, TISSUE_ACOUSTIC_PROPERTIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = TISSUE_ACOUSTIC_PROPERTIES.softTissue;
 * const z = evaluate(acousticImpedance, {
 *   densityKgPerM3: t.densityKgPerM3, soundSpeedMps: t.soundSpeedMps }).outputs.impedanceMRayl;
 * assert.ok(Math.abs(z - t.impedanceMRayl) < 0.01); // 1050 · 1540 / 10⁶ = 1.617 MRayl
 * ```
 */
export const TISSUE_ACOUSTIC_PROPERTIES: Readonly<Record<TissueName, TissueAcousticProperties>> =
  Object.freeze({
    softTissue: {
      name: "softTissue",
      label: "Soft tissue (average)",
      soundSpeedMps: DEFAULT_SOUND_SPEED_MPS,
      densityKgPerM3: 1050,
      impedanceMRayl: 1.62,
      attenuationDbPerCmMHz: SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ,
      attenuationRangeDbPerCmMHz: [0.3, 0.8],
      note:
        "Speed, density, impedance and attenuation range from Bushberg (from memory); 0.5 dB/cm/MHz is the textbook rule of thumb (Kremkau)",
      citations: [BUSHBERG, KREMKAU],
    },
    blood: {
      name: "blood",
      label: "Blood",
      soundSpeedMps: 1560,
      densityKgPerM3: 1058,
      impedanceMRayl: 1.65,
      attenuationDbPerCmMHz: 0.18,
      note: "Bushberg (from memory); attenuation rises faster than in proportion to frequency",
      citations: [BUSHBERG],
    },
    myocardium: {
      name: "myocardium",
      label: "Myocardium (heart muscle)",
      soundSpeedMps: 1576,
      densityKgPerM3: 1060,
      impedanceMRayl: 1.67,
      attenuationDbPerCmMHz: 0.52,
      note:
        "Culjat et al. Table 1 after Duck (from memory); attenuation varies with fibre direction and contraction",
      citations: [CULJAT, DUCK],
    },
    fat: {
      name: "fat",
      label: "Fat",
      soundSpeedMps: 1450,
      densityKgPerM3: 924,
      impedanceMRayl: 1.34,
      attenuationDbPerCmMHz: 0.6,
      attenuationRangeDbPerCmMHz: [0.5, 1.8],
      note:
        "Bushberg (from memory); the representative attenuation 0.6 dB/cm/MHz is Kremkau's table value (from memory)",
      citations: [BUSHBERG, KREMKAU],
    },
    bone: {
      name: "bone",
      label: "Bone (skull, cortical)",
      soundSpeedMps: 4080,
      densityKgPerM3: 1912,
      impedanceMRayl: 7.8,
      attenuationDbPerCmMHz: 20,
      attenuationRangeDbPerCmMHz: [13, 26],
      note:
        "Bushberg skull-bone row (from memory); cortical bone speeds of 3200-4100 m/s are published",
      citations: [BUSHBERG],
    },
    water: {
      name: "water",
      label: "Water (about 20 °C)",
      soundSpeedMps: 1480,
      densityKgPerM3: 1000,
      impedanceMRayl: 1.48,
      attenuationDbPerCmMHz: 0.0022,
      note:
        "Bushberg (from memory); the attenuation is the value at 1 MHz and grows as f² in water, not in proportion to f",
      citations: [BUSHBERG, KREMKAU],
    },
    air: {
      name: "air",
      label: "Air",
      soundSpeedMps: 330,
      densityKgPerM3: 1.2,
      impedanceMRayl: 0.0004,
      attenuationDbPerCmMHz: null,
      note:
        "Bushberg (from memory); attenuation not tabulated: a tissue/air interface reflects about 99.9 % of the intensity",
      citations: [BUSHBERG],
    },
  });

/**
 * Looks up a tissue's acoustic properties by name.
 *
 * @param name One of "softTissue", "blood", "myocardium", "fat", "bone", "water", "air".
 * @returns The row of {@linkcode TISSUE_ACOUSTIC_PROPERTIES}.
 * @throws {TypeError} For a name that is not in the table, listing the valid names.
 *
 * @example
 * ```ts
 * import { tissueProperties } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(tissueProperties("bone").soundSpeedMps, 4080);
 * assert.throws(() => tissueProperties("liver"), TypeError);
 * ```
 */
export function tissueProperties(name: string): TissueAcousticProperties {
  if (typeof name === "string" && Object.hasOwn(TISSUE_ACOUSTIC_PROPERTIES, name)) {
    return TISSUE_ACOUSTIC_PROPERTIES[name as TissueName];
  }
  throw issueError([{
    kind: "type",
    severity: "error",
    where: "Tissue properties",
    field: "name",
    received: describeValue(name),
    expected: `to be one of ${Object.keys(TISSUE_ACOUSTIC_PROPERTIES).join(", ")}`,
  }]);
}

for (const row of Object.values(TISSUE_ACOUSTIC_PROPERTIES)) Object.freeze(row);
