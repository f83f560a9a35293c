/**
 * Quantities of ultrasound physics and scanner settings: transmit frequency, speed of sound,
 * depth, insonation angle, pulse repetition frequency, Doppler shift, and what is computed from
 * them (wavelength and pulse, resolution and beam, attenuation, impedance and reflection, timing
 * and frame rate, Nyquist limit, acoustic output).
 *
 * Valid ranges are what the physics allows; typical ranges are those of diagnostic cardiac
 * ultrasound. Both are common practice, no source, unless a range says otherwise. Quantities that
 * are computed from others (wavelength, beam width, timing) have an open upper bound: their
 * inputs' ranges already bound them.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

const NOTE = "common practice, no source";
const POSITIVE = { min: 0, max: Infinity, minExclusive: true, maxExclusive: true } as const;
const NON_NEGATIVE = { min: 0, max: Infinity, maxExclusive: true } as const;

// Settings and media

/**
 * Transmit (carrier) frequency of the probe.
 *
 * @example A frequency given in kHz is read in MHz
 * ```ts
 * import { checkValue, quantityField, TRANSMIT_FREQUENCY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = checkValue("f0", quantityField(TRANSMIT_FREQUENCY), "2500 kHz", { where: "Demo" });
 * assert.equal(r.value, 2.5);
 * ```
 */
export const TRANSMIT_FREQUENCY: Quantity = defineQuantity({
  id: "transmitFrequency",
  label: "Transmit frequency",
  symbol: "f₀",
  unit: "MHz",
  description: "Transmit (carrier) frequency of the probe",
  valid: { min: 0, max: 100, minExclusive: true },
  typical: { min: 1, max: 15 },
  resolution: 0.1,
  headers: ["frequency", "probe frequency", "f0"],
  rangeNote: NOTE,
});

/**
 * Speed of sound in the medium (the scanner assumes 1540 m/s in soft tissue).
 *
 * @example Water at 1480 m/s lies inside the typical range; air at 330 m/s is flagged
 * ```ts
 * import { checkValue, quantityField, SOUND_SPEED } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const field = quantityField(SOUND_SPEED);
 * assert.equal(checkValue("c", field, 1480, { where: "Demo" }).issues.length, 0);
 * assert.equal(checkValue("c", field, 330, { where: "Demo" }).issues[0]!.kind, "typical");
 * ```
 */
export const SOUND_SPEED: Quantity = defineQuantity({
  id: "soundSpeed",
  label: "Speed of sound",
  symbol: "c",
  unit: "m/s",
  description: "Speed of sound in the medium (scanner assumption for soft tissue: 1540 m/s)",
  valid: { min: 0, max: 10000, minExclusive: true },
  typical: { min: 1400, max: 1650 },
  resolution: 1,
  headers: ["c", "sound speed"],
  rangeNote: NOTE,
});

/**
 * Depth along the beam (imaging depth, sample-volume depth, focal depth, reflector depth).
 *
 * @example
 * ```ts
 * import { checkValue, DEPTH, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("depth", quantityField(DEPTH), "140 mm", { where: "Demo" }).value, 14);
 * ```
 */
export const DEPTH: Quantity = defineQuantity({
  id: "depth",
  label: "Depth",
  symbol: "d",
  unit: "cm",
  description: "Depth along the beam from the probe face",
  valid: { min: 0, max: 50, minExclusive: true },
  typical: { min: 0.5, max: 30 },
  resolution: 0.1,
  headers: ["imaging depth", "sample depth"],
  rangeNote: NOTE,
});

/**
 * Insonation angle between the ultrasound beam and the flow direction (0° = parallel).
 *
 * @example An angle in radians is read in degrees; 90° is outside the valid range
 * ```ts
 * import { checkValue, INSONATION_ANGLE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const field = quantityField(INSONATION_ANGLE);
 * assert.ok(Math.abs(checkValue("angle", field, "0.5236 rad", { where: "Demo" }).value! - 30) < 1e-3);
 * assert.equal(checkValue("angle", field, 90, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const INSONATION_ANGLE: Quantity = defineQuantity({
  id: "insonationAngle",
  label: "Insonation angle",
  symbol: "θ",
  unit: "deg",
  description: "Angle between the ultrasound beam and the flow direction (0° = parallel)",
  valid: { min: 0, max: 90, maxExclusive: true },
  typical: { min: 0, max: 20 },
  resolution: 1,
  headers: ["angle", "theta"],
  rangeNote: NOTE,
});

/**
 * Signed insonation angle: the beam on either side of the flow direction (0° = parallel).
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, SIGNED_INSONATION_ANGLE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = checkValue("angle", quantityField(SIGNED_INSONATION_ANGLE), -15, { where: "Demo" });
 * assert.deepEqual([r.value, r.issues.length], [-15, 0]);
 * ```
 */
export const SIGNED_INSONATION_ANGLE: Quantity = defineQuantity({
  id: "signedInsonationAngle",
  label: "Signed insonation angle",
  symbol: "θ",
  unit: "deg",
  description:
    "Angle between the ultrasound beam and the flow direction, signed by the side of the beam (0° = parallel)",
  valid: { min: -90, max: 90, minExclusive: true, maxExclusive: true },
  typical: { min: -20, max: 20 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Pulse repetition frequency.
 *
 * @example
 * ```ts
 * import { checkValue, PULSE_REPETITION_FREQUENCY, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = checkValue("prf", quantityField(PULSE_REPETITION_FREQUENCY), "4 kHz", { where: "Demo" });
 * assert.equal(r.value, 4000);
 * ```
 */
export const PULSE_REPETITION_FREQUENCY: Quantity = defineQuantity({
  id: "pulseRepetitionFrequency",
  label: "Pulse repetition frequency",
  symbol: "PRF",
  unit: "Hz",
  description: "Pulses transmitted per second",
  valid: { min: 0, max: 1e6, minExclusive: true },
  typical: { min: 100, max: 50000 },
  resolution: 1,
  headers: ["prf"],
  rangeNote: NOTE,
});

/**
 * Doppler frequency shift (negative: flow away from the probe).
 *
 * @example
 * ```ts
 * import { checkValue, DOPPLER_SHIFT, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("shift", quantityField(DOPPLER_SHIFT), "-2.6 kHz", { where: "Demo" }).value, -2600);
 * ```
 */
export const DOPPLER_SHIFT: Quantity = defineQuantity({
  id: "dopplerShift",
  label: "Doppler shift",
  symbol: "Δf",
  unit: "Hz",
  description: "Doppler frequency shift of the echoes (negative: flow away from the probe)",
  valid: { min: -1e6, max: 1e6 },
  typical: { min: -20000, max: 20000 },
  resolution: 1,
  rangeNote: NOTE,
});

// Wave and pulse

/**
 * Wavelength of the transmitted wave in the medium.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, WAVELENGTH } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("lambda", quantityField(WAVELENGTH), "770 um", { where: "Demo" }).value, 0.77);
 * ```
 */
export const WAVELENGTH: Quantity = defineQuantity({
  id: "wavelength",
  label: "Wavelength",
  symbol: "λ",
  unit: "mm",
  description: "Distance the wave travels in one cycle, in the medium",
  valid: POSITIVE,
  typical: { min: 0.1, max: 1.6 },
  resolution: 0.001,
  headers: ["lambda"],
  rangeNote: NOTE,
});

/**
 * Period of one cycle of the transmitted wave.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, WAVE_PERIOD } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("T", quantityField(WAVE_PERIOD), "500 ns", { where: "Demo" }).value, 0.5);
 * ```
 */
export const WAVE_PERIOD: Quantity = defineQuantity({
  id: "wavePeriod",
  label: "Period",
  symbol: "T",
  unit: "us",
  description: "Duration of one cycle of the transmitted wave",
  valid: POSITIVE,
  typical: { min: 0.06, max: 1 },
  resolution: 0.001,
  rangeNote: NOTE,
});

/**
 * Number of cycles in a transmitted pulse.
 *
 * @example Half a cycle is the shortest pulse (accepted, flagged as unusual); less is an error
 * ```ts
 * import { checkValue, CYCLES_PER_PULSE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const field = quantityField(CYCLES_PER_PULSE);
 * assert.equal(checkValue("n", field, 0.5, { where: "Demo" }).value, 0.5);
 * assert.equal(checkValue("n", field, 0.4, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const CYCLES_PER_PULSE: Quantity = defineQuantity({
  id: "cyclesPerPulse",
  label: "Cycles per pulse",
  symbol: "n",
  unit: "1",
  description: "Number of cycles in the transmitted pulse (imaging 1-4, pulsed Doppler longer)",
  valid: { min: 0.5, max: 100 },
  typical: { min: 1, max: 30 },
  resolution: 0.1,
  headers: ["cycles"],
  rangeNote: NOTE,
});

/**
 * Spatial pulse length: the length in the medium of one transmitted pulse.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, SPATIAL_PULSE_LENGTH } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("spl", quantityField(SPATIAL_PULSE_LENGTH), "0.231 cm", { where: "Demo" }).value, 2.31);
 * ```
 */
export const SPATIAL_PULSE_LENGTH: Quantity = defineQuantity({
  id: "spatialPulseLength",
  label: "Spatial pulse length",
  symbol: "SPL",
  unit: "mm",
  description: "Length in the medium of one transmitted pulse (cycles × wavelength)",
  valid: POSITIVE,
  typical: { min: 0.1, max: 20 },
  resolution: 0.01,
  headers: ["spl"],
  rangeNote: NOTE,
});

/**
 * Axial (range) resolution: the smallest separation along the beam at which two reflectors show
 * as two echoes.
 *
 * @example
 * ```ts
 * import { AXIAL_RESOLUTION, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("axial", quantityField(AXIAL_RESOLUTION), 0, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const AXIAL_RESOLUTION: Quantity = defineQuantity({
  id: "axialResolution",
  label: "Axial resolution",
  symbol: "Δz",
  unit: "mm",
  description:
    "Smallest separation along the beam at which two reflectors give two echoes (half the pulse length)",
  valid: POSITIVE,
  typical: { min: 0.05, max: 3 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Pulse duration: the time one transmitted pulse lasts.
 *
 * @example
 * ```ts
 * import { checkValue, PULSE_DURATION, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("pd", quantityField(PULSE_DURATION), "1.5e-6 s", { where: "Demo" }).value, 1.5);
 * ```
 */
export const PULSE_DURATION: Quantity = defineQuantity({
  id: "pulseDuration",
  label: "Pulse duration",
  symbol: "PD",
  unit: "us",
  description: "Time one transmitted pulse lasts (cycles × period)",
  valid: POSITIVE,
  typical: { min: 0.1, max: 30 },
  resolution: 0.01,
  rangeNote: NOTE,
});

// Beam

/**
 * Active aperture of the probe: its width in the scan plane, or the diameter of a disc.
 *
 * @example
 * ```ts
 * import { APERTURE, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("D", quantityField(APERTURE), "2 cm", { where: "Demo" }).value, 20);
 * ```
 */
export const APERTURE: Quantity = defineQuantity({
  id: "aperture",
  label: "Aperture",
  symbol: "D",
  unit: "mm",
  description: "Active aperture of the probe: width in the scan plane, or diameter of a disc",
  valid: { min: 0, max: 200, minExclusive: true },
  typical: { min: 5, max: 40 },
  resolution: 0.1,
  headers: ["aperture width"],
  rangeNote: NOTE,
});

/**
 * Beam width: the pulse-echo −6 dB width of the beam, the lateral resolution at that depth.
 *
 * @example
 * ```ts
 * import { BEAM_WIDTH, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("w", quantityField(BEAM_WIDTH), "1800 um", { where: "Demo" }).value, 1.8);
 * ```
 */
export const BEAM_WIDTH: Quantity = defineQuantity({
  id: "beamWidth",
  label: "Beam width",
  symbol: "w",
  unit: "mm",
  description: "Pulse-echo −6 dB width of the beam: the lateral resolution at that depth",
  valid: POSITIVE,
  typical: { min: 0.2, max: 10 },
  resolution: 0.01,
  headers: ["lateral resolution"],
  rangeNote: NOTE,
});

/**
 * F-number of a focused aperture: focal depth over aperture.
 *
 * @example
 * ```ts
 * import { checkValue, F_NUMBER, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("F#", quantityField(F_NUMBER), "4", { where: "Demo" }).value, 4);
 * ```
 */
export const F_NUMBER: Quantity = defineQuantity({
  id: "fNumber",
  label: "F-number",
  symbol: "F#",
  unit: "1",
  description: "Focal depth divided by the aperture",
  valid: POSITIVE,
  typical: { min: 1, max: 10 },
  resolution: 0.1,
  headers: ["f#"],
  rangeNote: NOTE,
});

/**
 * Near-field (Fresnel zone) length of an unfocused aperture.
 *
 * @example
 * ```ts
 * import { checkValue, NEAR_FIELD_LENGTH, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("N", quantityField(NEAR_FIELD_LENGTH), "81 mm", { where: "Demo" }).value, 8.1);
 * ```
 */
export const NEAR_FIELD_LENGTH: Quantity = defineQuantity({
  id: "nearFieldLength",
  label: "Near-field length",
  symbol: "N",
  unit: "cm",
  description: "Length of the near field (Fresnel zone) of an unfocused aperture",
  valid: POSITIVE,
  typical: { min: 0.5, max: 30 },
  resolution: 0.01,
  headers: ["fresnel zone length"],
  rangeNote: NOTE,
});

/**
 * Far-field divergence half-angle of an unfocused aperture (to the first zero of the beam).
 *
 * @example
 * ```ts
 * import { checkValue, DIVERGENCE_ANGLE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("theta", quantityField(DIVERGENCE_ANGLE), 91, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const DIVERGENCE_ANGLE: Quantity = defineQuantity({
  id: "divergenceAngle",
  label: "Divergence half-angle",
  symbol: "θ_d",
  unit: "deg",
  description: "Half-angle at which the beam spreads beyond the near field (to its first zero)",
  valid: { min: 0, max: 90 },
  typical: { min: 0, max: 20 },
  resolution: 0.1,
  rangeNote: NOTE,
});

// Attenuation

/**
 * Attenuation coefficient per cm and per MHz (soft-tissue rule of thumb 0.5 dB/cm/MHz).
 *
 * @example mathjs does not know the unit: the label is accepted after the number
 * ```ts
 * import { ATTENUATION_COEFFICIENT, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = checkValue("alpha", quantityField(ATTENUATION_COEFFICIENT), "0.5 dB/cm/MHz", { where: "Demo" });
 * assert.equal(r.value, 0.5);
 * ```
 */
export const ATTENUATION_COEFFICIENT: Quantity = defineQuantity({
  id: "attenuationCoefficient",
  label: "Attenuation coefficient",
  symbol: "α",
  unit: "dB/cm/MHz",
  description: "Attenuation per cm of path and per MHz of frequency (soft tissue about 0.5)",
  valid: { min: 0, max: 50, minExclusive: true },
  typical: { min: 0.1, max: 1.5 },
  resolution: 0.01,
  headers: ["alpha"],
  rangeNote: NOTE,
});

/**
 * Attenuation of a pulse along a path, in decibels.
 *
 * @example
 * ```ts
 * import { ATTENUATION_LOSS, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("loss", quantityField(ATTENUATION_LOSS), "25 dB", { where: "Demo" }).value, 25);
 * ```
 */
export const ATTENUATION_LOSS: Quantity = defineQuantity({
  id: "attenuationLoss",
  label: "Attenuation",
  symbol: "L",
  unit: "dB",
  description: "Loss of pulse amplitude along a path, in decibels",
  valid: NON_NEGATIVE,
  typical: { min: 0, max: 150 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Dynamic range the system has for attenuation: from the transmit level to the noise floor.
 *
 * @example
 * ```ts
 * import { checkValue, DYNAMIC_RANGE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("DR", quantityField(DYNAMIC_RANGE), 30, { where: "Demo" }).issues[0]!.kind, "typical");
 * ```
 */
export const DYNAMIC_RANGE: Quantity = defineQuantity({
  id: "dynamicRange",
  label: "Dynamic range",
  symbol: "DR",
  unit: "dB",
  description:
    "Range of echo levels the system can use, from the transmit level to the noise floor",
  valid: { min: 0, max: 200, minExclusive: true },
  typical: { min: 40, max: 120 },
  resolution: 1,
  headers: ["dr"],
  rangeNote: NOTE,
});

/**
 * Penetration depth: the deepest depth from which echoes return within the dynamic range.
 *
 * @example
 * ```ts
 * import { checkValue, PENETRATION_DEPTH, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("dmax", quantityField(PENETRATION_DEPTH), "0.2 m", { where: "Demo" }).value, 20);
 * ```
 */
export const PENETRATION_DEPTH: Quantity = defineQuantity({
  id: "penetrationDepth",
  label: "Penetration depth",
  symbol: "d_max",
  unit: "cm",
  description: "Deepest depth from which echoes still return within the dynamic range",
  valid: POSITIVE,
  typical: { min: 2, max: 40 },
  resolution: 0.1,
  rangeNote: NOTE,
});

// Impedance and reflection

/**
 * Density of the medium the sound travels in.
 *
 * @example
 * ```ts
 * import { checkValue, MEDIUM_DENSITY, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("rho", quantityField(MEDIUM_DENSITY), "1.05 g/cm^3", { where: "Demo" }).value, 1050);
 * ```
 */
export const MEDIUM_DENSITY: Quantity = defineQuantity({
  id: "mediumDensity",
  label: "Density",
  symbol: "ρ",
  unit: "kg/m^3",
  description: "Mass per volume of the medium the sound travels in",
  valid: { min: 0, max: 25000, minExclusive: true },
  typical: { min: 900, max: 2000 },
  resolution: 1,
  headers: ["density", "rho"],
  rangeNote: NOTE,
});

/**
 * Characteristic acoustic impedance of a medium (density × speed of sound).
 *
 * @example
 * ```ts
 * import { ACOUSTIC_IMPEDANCE, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("Z", quantityField(ACOUSTIC_IMPEDANCE), "1.62 MRayl", { where: "Demo" }).value, 1.62);
 * ```
 */
export const ACOUSTIC_IMPEDANCE: Quantity = defineQuantity({
  id: "acousticImpedance",
  label: "Acoustic impedance",
  symbol: "Z",
  unit: "MRayl",
  description: "Characteristic acoustic impedance of a medium: density × speed of sound",
  valid: { min: 0, max: 100, minExclusive: true },
  typical: { min: 1.3, max: 8 },
  resolution: 0.01,
  headers: ["impedance"],
  rangeNote: NOTE,
});

/**
 * Pressure (amplitude) reflection coefficient at an interface; negative when the phase inverts.
 *
 * @example
 * ```ts
 * import { checkValue, PRESSURE_REFLECTION_COEFFICIENT, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const field = quantityField(PRESSURE_REFLECTION_COEFFICIENT);
 * assert.equal(checkValue("r", field, -1, { where: "Demo" }).issues.length, 0);
 * assert.equal(checkValue("r", field, 1.2, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const PRESSURE_REFLECTION_COEFFICIENT: Quantity = defineQuantity({
  id: "pressureReflectionCoefficient",
  label: "Pressure reflection coefficient",
  symbol: "r",
  unit: "1",
  description: "Reflected over incident pressure amplitude (negative: phase inversion)",
  valid: { min: -1, max: 1 },
  resolution: 0.001,
  rangeNote: NOTE,
});

/**
 * Share of the incident intensity reflected at an interface.
 *
 * @example
 * ```ts
 * import { checkValue, INTENSITY_REFLECTED, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("R", quantityField(INTENSITY_REFLECTED), "40 %", { where: "Demo" }).value, 40);
 * ```
 */
export const INTENSITY_REFLECTED: Quantity = defineQuantity({
  id: "intensityReflected",
  label: "Intensity reflected",
  symbol: "R",
  unit: "%",
  description: "Share of the incident intensity reflected at an interface",
  valid: { min: 0, max: 100 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Share of the incident intensity transmitted through an interface.
 *
 * @example
 * ```ts
 * import { checkValue, INTENSITY_TRANSMITTED, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("T", quantityField(INTENSITY_TRANSMITTED), 101, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const INTENSITY_TRANSMITTED: Quantity = defineQuantity({
  id: "intensityTransmitted",
  label: "Intensity transmitted",
  symbol: "T",
  unit: "%",
  description: "Share of the incident intensity transmitted through an interface",
  valid: { min: 0, max: 100 },
  resolution: 0.01,
  rangeNote: NOTE,
});

// Timing and frame rate

/**
 * Round-trip time of a pulse to a depth and back.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, ROUND_TRIP_TIME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("t", quantityField(ROUND_TRIP_TIME), "0.195 ms", { where: "Demo" }).value, 195);
 * ```
 */
export const ROUND_TRIP_TIME: Quantity = defineQuantity({
  id: "roundTripTime",
  label: "Round-trip time",
  symbol: "t",
  unit: "us",
  description: "Time a pulse takes to reach a depth and its echo to return (about 13 µs per cm)",
  valid: POSITIVE,
  typical: { min: 6, max: 400 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Unambiguous depth (range) at a PRF: the deepest depth whose echo returns before the next pulse.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, UNAMBIGUOUS_DEPTH } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("dmax", quantityField(UNAMBIGUOUS_DEPTH), "154 mm", { where: "Demo" }).value, 15.4);
 * ```
 */
export const UNAMBIGUOUS_DEPTH: Quantity = defineQuantity({
  id: "unambiguousDepth",
  label: "Unambiguous depth",
  symbol: "d_u",
  unit: "cm",
  description: "Deepest depth whose echo returns before the next pulse is sent",
  valid: POSITIVE,
  typical: { min: 1, max: 80 },
  resolution: 0.1,
  headers: ["unambiguous range"],
  rangeNote: NOTE,
});

/**
 * Sector (field-of-view) angle of a 2D image.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, SECTOR_ANGLE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("sector", quantityField(SECTOR_ANGLE), 0, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const SECTOR_ANGLE: Quantity = defineQuantity({
  id: "sectorAngle",
  label: "Sector angle",
  symbol: "Φ",
  unit: "deg",
  description: "Width of the 2D field of view as an angle",
  valid: { min: 0, max: 180, minExclusive: true },
  typical: { min: 15, max: 100 },
  resolution: 1,
  headers: ["sector width", "field of view"],
  rangeNote: NOTE,
});

/**
 * Scan-line density of a sector image.
 *
 * @example
 * ```ts
 * import { checkValue, LINE_DENSITY, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("density", quantityField(LINE_DENSITY), "1.6 lines/deg", { where: "Demo" }).value, 1.6);
 * ```
 */
export const LINE_DENSITY: Quantity = defineQuantity({
  id: "lineDensity",
  label: "Line density",
  symbol: "ρ_L",
  unit: "lines/deg",
  description: "Scan lines per degree of sector",
  valid: { min: 0, max: 20, minExclusive: true },
  typical: { min: 0.5, max: 4 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Number of transmit focal zones per scan line.
 *
 * @example A count: a fraction is an error
 * ```ts
 * import { checkValue, FOCAL_ZONES, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("zones", quantityField(FOCAL_ZONES), 1.5, { where: "Demo" }).issues[0]!.kind, "integer");
 * ```
 */
export const FOCAL_ZONES: Quantity = defineQuantity({
  id: "focalZones",
  label: "Focal zones",
  symbol: "n_f",
  unit: "1",
  description: "Number of transmit focal zones per scan line",
  valid: { min: 1, max: 16 },
  resolution: 1,
  integer: true,
  rangeNote: NOTE,
});

/**
 * Receive lines formed per transmit pulse (multi-line acquisition).
 *
 * @example
 * ```ts
 * import { checkValue, PARALLEL_RECEIVE_BEAMS, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("beams", quantityField(PARALLEL_RECEIVE_BEAMS), "4", { where: "Demo" }).value, 4);
 * ```
 */
export const PARALLEL_RECEIVE_BEAMS: Quantity = defineQuantity({
  id: "parallelReceiveBeams",
  label: "Parallel receive beams",
  symbol: "n_p",
  unit: "1",
  description: "Receive lines formed per transmit pulse (multi-line acquisition)",
  valid: { min: 1, max: 64 },
  resolution: 1,
  integer: true,
  headers: ["mla"],
  rangeNote: NOTE,
});

/**
 * Scan lines in one frame of a 2D image.
 *
 * @example
 * ```ts
 * import { checkValue, LINES_PER_FRAME, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("lines", quantityField(LINES_PER_FRAME), 0, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const LINES_PER_FRAME: Quantity = defineQuantity({
  id: "linesPerFrame",
  label: "Lines per frame",
  symbol: "N",
  unit: "1",
  description: "Scan lines in one frame of the 2D image",
  valid: POSITIVE,
  typical: { min: 32, max: 512 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Frame time of a 2D image: its temporal resolution.
 *
 * @example
 * ```ts
 * import { checkValue, FRAME_TIME, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("frame", quantityField(FRAME_TIME), "0.025 s", { where: "Demo" }).value, 25);
 * ```
 */
export const FRAME_TIME: Quantity = defineQuantity({
  id: "frameTime",
  label: "Frame time",
  symbol: "T_F",
  unit: "ms",
  description: "Time to acquire one frame: the temporal resolution of the image",
  valid: POSITIVE,
  typical: { min: 2, max: 100 },
  resolution: 0.1,
  headers: ["temporal resolution"],
  rangeNote: NOTE,
});

/**
 * Frame rate of a 2D image.
 *
 * @example
 * ```ts
 * import { checkValue, FRAME_RATE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("fr", quantityField(FRAME_RATE), 5, { where: "Demo" }).issues[0]!.kind, "typical");
 * ```
 */
export const FRAME_RATE: Quantity = defineQuantity({
  id: "frameRate",
  label: "Frame rate",
  symbol: "FR",
  unit: "Hz",
  description: "Frames acquired per second",
  valid: POSITIVE,
  typical: { min: 10, max: 500 },
  resolution: 1,
  headers: ["fps", "frames per second"],
  rangeNote: NOTE,
});

// Doppler limit

/**
 * Nyquist velocity: the highest velocity pulsed Doppler displays without aliasing.
 *
 * @example
 * ```ts
 * import { checkValue, NYQUIST_VELOCITY, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("vN", quantityField(NYQUIST_VELOCITY), "77 cm/s", { where: "Demo" }).value, 0.77);
 * ```
 */
export const NYQUIST_VELOCITY: Quantity = defineQuantity({
  id: "nyquistVelocity",
  label: "Nyquist velocity",
  symbol: "v_N",
  unit: "m/s",
  description: "Highest velocity pulsed Doppler displays without aliasing",
  valid: POSITIVE,
  typical: { min: 0.2, max: 4 },
  resolution: 0.01,
  headers: ["nyquist limit"],
  rangeNote: NOTE,
});

// Acoustic output

/**
 * Peak rarefactional (negative) acoustic pressure of a pulse.
 *
 * @example
 * ```ts
 * import { checkValue, PEAK_RAREFACTIONAL_PRESSURE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("pr", quantityField(PEAK_RAREFACTIONAL_PRESSURE), "1500 kPa", { where: "Demo" }).value, 1.5);
 * ```
 */
export const PEAK_RAREFACTIONAL_PRESSURE: Quantity = defineQuantity({
  id: "peakRarefactionalPressure",
  label: "Peak rarefactional pressure",
  symbol: "p_r",
  unit: "MPa",
  description: "Peak negative acoustic pressure of a pulse",
  valid: { min: 0, max: 20, minExclusive: true },
  typical: { min: 0, max: 4, minExclusive: true },
  resolution: 0.01,
  headers: ["pr", "peak negative pressure"],
  rangeNote: NOTE,
});

/**
 * Mechanical index: the output-display index of the likelihood of inertial cavitation. The upper
 * end of its typical range is the regulatory ceiling of 1.9 (FDA guidance "Marketing Clearance of
 * Diagnostic Ultrasound Systems and Transducers", February 2023; the value confirmed in secondary
 * summaries, not verified against the guidance text), the one place that number is written.
 *
 * @example Above the regulatory ceiling is flagged as atypical
 * ```ts
 * import { checkValue, MECHANICAL_INDEX, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("mi", quantityField(MECHANICAL_INDEX), 2.1, { where: "Demo" }).issues[0]!.kind, "typical");
 * ```
 */
export const MECHANICAL_INDEX: Quantity = defineQuantity({
  id: "mechanicalIndex",
  label: "Mechanical index",
  symbol: "MI",
  unit: "1",
  description: "Derated peak rarefactional pressure (MPa) over the square root of frequency (MHz)",
  valid: POSITIVE,
  typical: { min: 0, max: 1.9, minExclusive: true },
  resolution: 0.01,
  headers: ["mi"],
  rangeNote:
    "typical upper end: the FDA ceiling of 1.9 (2023 guidance on diagnostic ultrasound; value not verified against the guidance text)",
});

/**
 * A mechanical index as a percentage of the regulatory ceiling.
 *
 * @example
 * ```ts
 * import { checkValue, MECHANICAL_INDEX_OF_LIMIT, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("share", quantityField(MECHANICAL_INDEX_OF_LIMIT), "50 %", { where: "Demo" }).value, 50);
 * ```
 */
export const MECHANICAL_INDEX_OF_LIMIT: Quantity = defineQuantity({
  id: "mechanicalIndexOfLimit",
  label: "Mechanical index, share of the limit",
  symbol: "MI/MI_max",
  unit: "%",
  description: "Mechanical index as a percentage of the regulatory ceiling (FDA 2023 guidance)",
  valid: POSITIVE,
  typical: { min: 0, max: 100, minExclusive: true },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * The ultrasound-physics quantities, listed for the package's quantity lookup.
 *
 * @example Every id is unique and every typical range lies inside its valid range
 * ```ts
 * import { rangeWithin, ULTRASOUND_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(new Set(ULTRASOUND_QUANTITIES.map((q) => q.id)).size, ULTRASOUND_QUANTITIES.length);
 * assert.ok(ULTRASOUND_QUANTITIES.every((q) => !q.typical || rangeWithin(q.typical, q.valid)));
 * ```
 */
export const ULTRASOUND_QUANTITIES: readonly Quantity[] = [
  TRANSMIT_FREQUENCY,
  SOUND_SPEED,
  DEPTH,
  INSONATION_ANGLE,
  SIGNED_INSONATION_ANGLE,
  PULSE_REPETITION_FREQUENCY,
  DOPPLER_SHIFT,
  WAVELENGTH,
  WAVE_PERIOD,
  CYCLES_PER_PULSE,
  SPATIAL_PULSE_LENGTH,
  AXIAL_RESOLUTION,
  PULSE_DURATION,
  APERTURE,
  BEAM_WIDTH,
  F_NUMBER,
  NEAR_FIELD_LENGTH,
  DIVERGENCE_ANGLE,
  ATTENUATION_COEFFICIENT,
  ATTENUATION_LOSS,
  DYNAMIC_RANGE,
  PENETRATION_DEPTH,
  MEDIUM_DENSITY,
  ACOUSTIC_IMPEDANCE,
  PRESSURE_REFLECTION_COEFFICIENT,
  INTENSITY_REFLECTED,
  INTENSITY_TRANSMITTED,
  ROUND_TRIP_TIME,
  UNAMBIGUOUS_DEPTH,
  SECTOR_ANGLE,
  LINE_DENSITY,
  FOCAL_ZONES,
  PARALLEL_RECEIVE_BEAMS,
  LINES_PER_FRAME,
  FRAME_TIME,
  FRAME_RATE,
  NYQUIST_VELOCITY,
  PEAK_RAREFACTIONAL_PRESSURE,
  MECHANICAL_INDEX,
  MECHANICAL_INDEX_OF_LIMIT,
];
