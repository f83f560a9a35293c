/**
 * Publications cited by more than one ultrasound-physics module, each written once. Those cited
 * by other domains too come from the package's shared list.
 *
 * @module
 */
import type { Citation } from "../core/types.ts";
import { HATLE_ANGELSEN_1985 as HATLE_ANGELSEN, QUINONES_2002 } from "../citations.ts";

export { HATLE_ANGELSEN, QUINONES_2002 };

/** Textbook of diagnostic ultrasound physics (wavelength, pulse, beam, timing, attenuation). */
export const KREMKAU: Citation = Object.freeze({
  authors: "Kremkau FW",
  year: 2015,
  title: "Sonography Principles and Instruments",
  publication: "9th ed. Elsevier, St Louis",
  locator: "ch. 2 (ultrasound), ch. 3 (transducers), ch. 5 (Doppler)",
});

/** Textbook of ultrasound physics and equipment. */
export const HOSKINS: Citation = Object.freeze({
  authors: "Hoskins PR, Martin K, Thrush A",
  year: 2019,
  title: "Diagnostic Ultrasound: Physics and Equipment",
  publication: "3rd ed. CRC Press, Boca Raton",
  locator: "ch. 2 (physics), ch. 3 (transducers and beam forming), ch. 8 (Doppler)",
});

/** Physics text: beam and pulse formulas. */
export const SZABO: Citation = Object.freeze({
  authors: "Szabo TL",
  year: 2014,
  title: "Diagnostic Ultrasound Imaging: Inside Out",
  publication: "2nd ed. Academic Press, Oxford",
  locator: "ch. 6 (beams), ch. 11 (Doppler)",
});

/** Medical-imaging physics text: tables of speed of sound, impedance and attenuation. */
export const BUSHBERG: Citation = Object.freeze({
  authors: "Bushberg JT, Seibert JA, Leidholdt EM Jr, Boone JM",
  year: 2012,
  title: "The Essential Physics of Medical Imaging",
  publication: "3rd ed. Lippincott Williams & Wilkins, Philadelphia",
  locator: "ch. 14 (ultrasound), tables of acoustic properties and of attenuation coefficients",
});
