/**
 * Acoustic output: derated peak rarefactional pressure and the mechanical index.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation, Citation } from "../core/types.ts";
import {
  MECHANICAL_INDEX,
  MECHANICAL_INDEX_OF_LIMIT,
  PEAK_RAREFACTIONAL_PRESSURE,
  TRANSMIT_FREQUENCY,
} from "../quantities/ultrasound.ts";
import { attenuationLoss } from "./attenuation.ts";
import { depthInput } from "./shared.ts";

/**
 * Upper limit of the mechanical index in the FDA Track 3 output-display scheme (all uses except
 * ophthalmic), the regulatory ceiling for cardiac imaging: FDA guidance "Marketing Clearance of
 * Diagnostic Ultrasound Systems and Transducers", February 2023 revision (value as given by
 * secondary summaries of the guidance; not verified against the guidance text). It is the upper
 * end of {@linkcode MECHANICAL_INDEX}'s typical range, where the number is written once.
 *
 * @example An MI at the limit is 100 % of it
 * ```ts
 * import { evaluate, MECHANICAL_INDEX_LIMIT, mechanicalIndex } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(mechanicalIndex, {
 *   peakRarefactionalPressureMPa: MECHANICAL_INDEX_LIMIT * 2, transmitFrequencyMHz: 4 });
 * assert.ok(Math.abs(r.outputs.percentOfRegulatoryLimit - 100) < 1e-12);
 * ```
 */
export const MECHANICAL_INDEX_LIMIT: number = MECHANICAL_INDEX.typical!.max;

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

/** The caution every mechanical-index result carries: the ceiling, where it comes from, and
 * that it was not verified against the guidance text. */
const MECHANICAL_INDEX_CEILING =
  `Regulatory ceiling MI ${MECHANICAL_INDEX_LIMIT} (US FDA diagnostic ultrasound guidance, February 2023 revision, Track 3; value not verified against the guidance text); keep exposure as low as reasonably achievable (ALARA)`;

const IEC_62359: Citation = {
  authors: "International Electrotechnical Commission",
  year: 2017,
  title:
    "IEC 62359 Ultrasonics - Field characterization - Test methods for the determination of thermal and mechanical indices related to medical diagnostic ultrasonic fields",
  publication: "Edition 2.1, IEC, Geneva",
  locator: "definitions of the mechanical index and of derating (0.3 dB/cm/MHz)",
};

const AIUM_NEMA_ODS: Citation = {
  authors:
    "American Institute of Ultrasound in Medicine, National Electrical Manufacturers Association",
  year: 2004,
  title:
    "Standard for Real-Time Display of Thermal and Mechanical Acoustic Output Indices on Diagnostic Ultrasound Equipment (NEMA UD 3-2004)",
  publication: "AIUM/NEMA, Laurel MD and Rosslyn VA",
};

const APFEL_HOLLAND: Citation = {
  authors: "Apfel RE, Holland CK",
  year: 1991,
  title:
    "Gauging the likelihood of cavitation from short-pulse, low-duty cycle diagnostic ultrasound",
  publication: "Ultrasound Med Biol 17(2):179-185",
  doi: "10.1016/0301-5629(91)90125-G",
};

/** The current revision of the FDA guidance (checked: title, February 2023 date, final status
 * and docket on the FDA guidance page; the June 27, 2019 issue had the same docket). The MI
 * ceiling 1.9 of Track 3 agrees with secondary summaries of the guidance; its own table was not
 * read here. */
const FDA_2023: Citation = {
  authors: "US Food and Drug Administration, Center for Devices and Radiological Health",
  year: 2023,
  title:
    "Marketing Clearance of Diagnostic Ultrasound Systems and Transducers: Guidance for Industry and Food and Drug Administration Staff",
  publication:
    "FDA, Silver Spring MD, February 2023 (final guidance, docket FDA-2017-D-5372; revises the guidance of June 27, 2019)",
  locator:
    "Track 3 global maximum mechanical index 1.9 (value from secondary summaries; not verified against the guidance text)",
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
 * Inputs: `waterPressureMPa`, `transmitFrequencyMHz`, `depthCm`. Output: `deratedPressureMPa`.
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
      quantity: PEAK_RAREFACTIONAL_PRESSURE,
      label: "Peak rarefactional pressure in water",
      description: "Peak rarefactional pressure measured in water",
    },
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    depthCm: depthInput("Depth", "Depth along the beam of the point of interest"),
  },
  outputs: {
    deratedPressureMPa: {
      quantity: PEAK_RAREFACTIONAL_PRESSURE,
      label: "Derated peak rarefactional pressure",
      description: "Peak rarefactional pressure in tissue estimated by derating",
    },
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
  citations: [IEC_62359, AIUM_NEMA_ODS],
  cautions: ["Derating is a convention; real tissue paths may attenuate less (e.g. through fluid)"],
});

/**
 * Mechanical index: the output-display index for the likelihood of inertial cavitation.
 *
 * Formula: MI = p_r,derated [MPa] / √(f [MHz]) (with the normalising constant 1 MPa·MHz^−1/2);
 * percent of the regulatory limit = 100 · MI / {@linkcode MECHANICAL_INDEX_LIMIT}.
 *
 * Source: Apfel RE, Holland CK. Ultrasound Med Biol 1991;17:179-185; AIUM/NEMA UD 3-2004; IEC
 * 62359:2017; FDA diagnostic ultrasound guidance, February 2023 revision (Track 3 limit 1.9, not
 * verified against the guidance text).
 *
 * Inputs: `peakRarefactionalPressureMPa` (derated), `transmitFrequencyMHz` (acoustic working
 * frequency). Outputs: `mechanicalIndex`, `percentOfRegulatoryLimit`.
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
      quantity: PEAK_RAREFACTIONAL_PRESSURE,
      label: "Derated peak rarefactional pressure",
      description: "Derated peak rarefactional pressure at the point of maximum MI",
    },
    transmitFrequencyMHz: {
      quantity: TRANSMIT_FREQUENCY,
      label: "Acoustic working frequency",
      description: "Acoustic working frequency of the pulse",
    },
  },
  outputs: {
    mechanicalIndex: MECHANICAL_INDEX,
    percentOfRegulatoryLimit: MECHANICAL_INDEX_OF_LIMIT,
  },
  formula: ({ peakRarefactionalPressureMPa, transmitFrequencyMHz }) => {
    const mi = peakRarefactionalPressureMPa / Math.sqrt(transmitFrequencyMHz);
    return { mechanicalIndex: mi, percentOfRegulatoryLimit: (100 * mi) / MECHANICAL_INDEX_LIMIT };
  },
  formulaText: `MI = p_r,derated / √f; share of the limit = 100·MI / ${MECHANICAL_INDEX_LIMIT} %`,
  citations: [APFEL_HOLLAND, AIUM_NEMA_ODS, IEC_62359, FDA_2023],
  cautions: [
    MECHANICAL_INDEX_CEILING,
    "The MI estimates the likelihood of inertial cavitation, not a threshold of harm; with contrast agents or gas bodies (lung, bowel) effects occur at lower values",
  ],
  clinical: true,
});
