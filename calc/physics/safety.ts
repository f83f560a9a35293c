/**
 * Acoustic output: derated peak rarefactional pressure and the mechanical index.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation, Reference } from "../core/types.ts";
import { attenuationLoss } from "./attenuation.ts";
import { depthInput, transmitFrequencyInput } from "./shared.ts";

/** Upper limit of the mechanical index in the FDA Track 3 output-display scheme (all uses except
 * ophthalmic), the usual regulatory ceiling for cardiac imaging (common practice, from memory). *
 * @example
 * ```ts
 * import { MECHANICAL_INDEX_LIMIT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(MECHANICAL_INDEX_LIMIT, 1.9);
 * ```
 */
export const MECHANICAL_INDEX_LIMIT = 1.9;

/**
 * Derating attenuation coefficient of the output-display standards, dB/cm/MHz.
 *
 * @example
 * ```ts
 * import { DERATING_DB_PER_CM_MHZ } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DERATING_DB_PER_CM_MHZ, 0.3);
 * ```
 */
export const DERATING_DB_PER_CM_MHZ = 0.3;

const IEC_62359: Reference = {
  authors: "International Electrotechnical Commission",
  year: 2017,
  title:
    "IEC 62359 Ultrasonics - Field characterization - Test methods for the determination of thermal and mechanical indices related to medical diagnostic ultrasonic fields",
  publication: "Edition 2.1, IEC, Geneva",
  locator: "definitions of the mechanical index and of derating (0.3 dB/cm/MHz)",
};

const AIUM_NEMA_ODS: Reference = {
  authors:
    "American Institute of Ultrasound in Medicine, National Electrical Manufacturers Association",
  year: 2004,
  title:
    "Standard for Real-Time Display of Thermal and Mechanical Acoustic Output Indices on Diagnostic Ultrasound Equipment (NEMA UD 3-2004)",
  publication: "AIUM/NEMA, Laurel MD and Rosslyn VA",
};

const APFEL_HOLLAND: Reference = {
  authors: "Apfel RE, Holland CK",
  year: 1991,
  title:
    "Gauging the likelihood of cavitation from short-pulse, low-duty cycle diagnostic ultrasound",
  publication: "Ultrasound Med Biol 17(2):179-185",
  doi: "10.1016/0301-5629(91)90125-G",
};

const FDA_2019: Reference = {
  authors: "US Food and Drug Administration",
  year: 2019,
  title:
    "Marketing Clearance of Diagnostic Ultrasound Systems and Transducers: Guidance for Industry",
  publication: "FDA, Silver Spring MD",
  locator: "Track 3 acoustic output limits (MI 1.9)",
};

/**
 * Derated peak rarefactional pressure: the pressure measured in water reduced by the standard
 * tissue attenuation of 0.3 dB/cm/MHz to the depth of interest.
 *
 * Formula: L [dB] = 0.3 · f · z (one-way loss from {@linkcode attenuationLoss});
 * p_derated = p_water · 10^(−L / 20).
 *
 * Source: IEC 62359:2017 (derating); AIUM/NEMA UD 3-2004 output display standard.
 *
 * Inputs: `waterPressureMPa` (MPa, (0, 20]), `transmitFrequencyMHz` (MHz), `depthCm` (cm).
 * Output: `deratedPressureMPa` (MPa).
 *
 * @throws {RangeError} (through `evaluate`) for a pressure, frequency or depth ≤ 0.
 *
 * @example 3 MPa in water at 3 MHz, 5 cm deep: 4.5 dB less
 * ```ts
 * import { deratedPressure, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(deratedPressure, { waterPressureMPa: 3, transmitFrequencyMHz: 3, depthCm: 5 });
 * assert.ok(Math.abs(r.outputs.deratedPressureMPa - 3 * 10 ** (-4.5 / 20)) < 1e-12); // hand check
 * ```
 */
export const deratedPressure: Calculation<
  "waterPressureMPa" | "transmitFrequencyMHz" | "depthCm",
  "deratedPressureMPa"
> = defineCalculation({
  id: "deratedPressure",
  title: "Derated peak rarefactional pressure",
  description:
    "Peak rarefactional pressure measured in water, derated by 0.3 dB/cm/MHz to estimate it in tissue at a depth.",
  inputs: {
    waterPressureMPa: {
      unit: "MPa",
      description: "Peak rarefactional pressure measured in water",
      range: { min: 0, max: 20, minExclusive: true },
    },
    transmitFrequencyMHz: transmitFrequencyInput,
    depthCm: depthInput("Depth along the beam"),
  },
  outputs: {
    deratedPressureMPa: { unit: "MPa", description: "Derated peak rarefactional pressure" },
  },
  formula: ({ waterPressureMPa, transmitFrequencyMHz, depthCm }) => {
    const { oneWayLossDb } = attenuationLoss.formula({
      attenuationDbPerCmMHz: DERATING_DB_PER_CM_MHZ,
      transmitFrequencyMHz,
      depthCm,
    });
    return { deratedPressureMPa: waterPressureMPa * 10 ** (-oneWayLossDb / 20) };
  },
  formulaText: "p_derated = p_water · 10^(−0.3·f·z / 20)",
  sources: [IEC_62359, AIUM_NEMA_ODS],
  cautions: ["Derating is a convention; real tissue paths may attenuate less (e.g. through fluid)"],
});

/**
 * Mechanical index: the output-display index for the likelihood of inertial cavitation.
 *
 * Formula: MI = p_r,derated [MPa] / √(f [MHz]) (with the normalising constant 1 MPa·MHz^−1/2);
 * percent of the regulatory limit = 100 · MI / 1.9.
 *
 * Source: Apfel RE, Holland CK. Ultrasound Med Biol 1991;17:179-185; AIUM/NEMA UD 3-2004; IEC
 * 62359:2017; FDA 2019 guidance (Track 3 limit MI 1.9).
 *
 * Inputs: `peakRarefactionalPressureMPa` (derated, MPa, (0, 20], typical (0, 4]),
 * `transmitFrequencyMHz` (acoustic working frequency, MHz). Outputs: `mechanicalIndex`,
 * `percentOfRegulatoryLimit` (%).
 *
 * @throws {RangeError} (through `evaluate`) for a pressure or frequency ≤ 0.
 *
 * @example 2 MPa at 4 MHz: MI 1.0
 * ```ts
 * import { evaluate, mechanicalIndex } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(mechanicalIndex, { peakRarefactionalPressureMPa: 2, transmitFrequencyMHz: 4 });
 * assert.equal(r.outputs.mechanicalIndex, 1); // 2 / √4 (hand check)
 * ```
 */
export const mechanicalIndex: Calculation<
  "peakRarefactionalPressureMPa" | "transmitFrequencyMHz",
  "mechanicalIndex" | "percentOfRegulatoryLimit"
> = defineCalculation({
  id: "mechanicalIndex",
  title: "Mechanical index",
  description:
    "Index of the likelihood of inertial cavitation from the derated peak rarefactional pressure and the frequency.",
  inputs: {
    peakRarefactionalPressureMPa: {
      unit: "MPa",
      description: "Derated peak rarefactional pressure at the point of maximum MI",
      range: { min: 0, max: 20, minExclusive: true },
      typical: { min: 0, max: 4, minExclusive: true },
    },
    transmitFrequencyMHz: { ...transmitFrequencyInput, description: "Acoustic working frequency" },
  },
  outputs: {
    mechanicalIndex: { unit: "1", description: "Mechanical index" },
    percentOfRegulatoryLimit: { unit: "%", description: "Mechanical index as a share of 1.9" },
  },
  formula: ({ peakRarefactionalPressureMPa, transmitFrequencyMHz }) => {
    const mi = peakRarefactionalPressureMPa / Math.sqrt(transmitFrequencyMHz);
    return { mechanicalIndex: mi, percentOfRegulatoryLimit: (100 * mi) / MECHANICAL_INDEX_LIMIT };
  },
  formulaText: "MI = p_r,derated / √f",
  sources: [APFEL_HOLLAND, AIUM_NEMA_ODS, IEC_62359, FDA_2019],
  cautions: [
    "Regulatory ceiling MI 1.9 (FDA Track 3); keep exposure as low as reasonably achievable (ALARA)",
    "The MI estimates the likelihood of inertial cavitation, not a threshold of harm; with contrast agents or gas bodies (lung, bowel) effects occur at lower values",
  ],
  clinical: true,
});
