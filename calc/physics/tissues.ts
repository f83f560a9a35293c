/**
 * A small table of acoustic properties of tissues and reference media, one published source per
 * row. Values are representative; published values for a tissue vary by several percent
 * (speed, density) and by a factor of two or more (attenuation).
 *
 * @module
 */
import type { Reference } from "../core/types.ts";
import { BUSHBERG, KREMKAU } from "./shared.ts";

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
  readonly sources: readonly Reference[];
}

const DUCK: Reference = {
  authors: "Duck FA",
  year: 1990,
  title: "Physical Properties of Tissue: A Comprehensive Reference Book",
  publication: "Academic Press, London",
  locator: "ch. 4 (acoustic properties)",
};

const CULJAT: Reference = {
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
 * @example The soft-tissue row matches the 1540 m/s scanner assumption
 * ```ts
 * import { TISSUE_ACOUSTIC_PROPERTIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(TISSUE_ACOUSTIC_PROPERTIES.softTissue.soundSpeedMps, 1540);
 * assert.equal(TISSUE_ACOUSTIC_PROPERTIES.softTissue.attenuationDbPerCmMHz, 0.5);
 * ```
 */
export const TISSUE_ACOUSTIC_PROPERTIES: Readonly<Record<TissueName, TissueAcousticProperties>> =
  Object.freeze({
    softTissue: {
      name: "softTissue",
      label: "Soft tissue (average)",
      soundSpeedMps: 1540,
      densityKgPerM3: 1050,
      impedanceMRayl: 1.62,
      attenuationDbPerCmMHz: 0.5,
      attenuationRangeDbPerCmMHz: [0.3, 0.8],
      note:
        "Speed, density, impedance and attenuation range from Bushberg (from memory); 0.5 dB/cm/MHz is the textbook rule of thumb (Kremkau)",
      sources: [BUSHBERG, KREMKAU],
    },
    blood: {
      name: "blood",
      label: "Blood",
      soundSpeedMps: 1560,
      densityKgPerM3: 1058,
      impedanceMRayl: 1.65,
      attenuationDbPerCmMHz: 0.18,
      note: "Bushberg (from memory); attenuation rises faster than in proportion to frequency",
      sources: [BUSHBERG],
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
      sources: [CULJAT, DUCK],
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
      sources: [BUSHBERG, KREMKAU],
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
      sources: [BUSHBERG],
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
      sources: [BUSHBERG, KREMKAU],
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
      sources: [BUSHBERG],
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
 * ```
 */
export function tissueProperties(name: string): TissueAcousticProperties {
  if (typeof name === "string" && Object.hasOwn(TISSUE_ACOUSTIC_PROPERTIES, name)) {
    return TISSUE_ACOUSTIC_PROPERTIES[name as TissueName];
  }
  throw new TypeError(
    `Tissue properties: expected 'name' to be one of ${
      Object.keys(TISSUE_ACOUSTIC_PROPERTIES).join(", ")
    }, got ${typeof name === "string" ? `"${name}"` : String(name)}`,
  );
}

for (const row of Object.values(TISSUE_ACOUSTIC_PROPERTIES)) Object.freeze(row);
