/**
 * Publications cited by more than one domain, defined once. Domain modules import them from here
 * (their own `citations.ts` re-exports them under the names they use).
 *
 * @module
 */
import type { Citation } from "./core/types.ts";

/**
 * Lang et al. 2015, ASE/EACVI recommendations for cardiac chamber quantification in adults.
 *
 * @example
 * ```ts
 * import { LANG_2015 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LANG_2015.year, 2015);
 * ```
 */
export const LANG_2015: Citation = Object.freeze({
  authors: "Lang RM, Badano LP, Mor-Avi V, Afilalo J, Armstrong A, Ernande L, et al.",
  year: 2015,
  title:
    "Recommendations for cardiac chamber quantification by echocardiography in adults: an update from the American Society of Echocardiography and the European Association of Cardiovascular Imaging",
  publication: "J Am Soc Echocardiogr 28(1):1–39.e14",
  doi: "10.1016/j.echo.2014.10.003",
});

/** Rudski et al. 2010, ASE guidelines for the echocardiographic assessment of the right heart. */
export const RUDSKI_2010: Citation = Object.freeze({
  authors: "Rudski LG, Lai WW, Afilalo J, Hua L, Handschumacher MD, Chandrasekaran K, et al.",
  year: 2010,
  title:
    "Guidelines for the echocardiographic assessment of the right heart in adults: a report from the American Society of Echocardiography",
  publication: "J Am Soc Echocardiogr 23(7):685–713",
  doi: "10.1016/j.echo.2010.05.010",
});

/** Quiñones et al. 2002, ASE recommendations for quantification of Doppler echocardiography. */
export const QUINONES_2002: Citation = Object.freeze({
  authors: "Quiñones MA, Otto CM, Stoddard M, Waggoner A, Zoghbi WA",
  year: 2002,
  title:
    "Recommendations for quantification of Doppler echocardiography: a report from the Doppler Quantification Task Force of the Nomenclature and Standards Committee of the American Society of Echocardiography",
  publication: "J Am Soc Echocardiogr 15(2):167–184",
  doi: "10.1067/mje.2002.120202",
});

/** Hatle & Angelsen 1985, the textbook of Doppler physics and its cardiac applications (cited
 * as a whole: the chapter number once given here was recalled, not checked, so it is not
 * claimed). */
export const HATLE_ANGELSEN_1985: Citation = Object.freeze({
  authors: "Hatle L, Angelsen B",
  year: 1985,
  title: "Doppler Ultrasound in Cardiology: Physical Principles and Clinical Applications",
  publication: "2nd ed. Lea & Febiger, Philadelphia",
});

/** Re-exported for modules that list recalled-source cautions themselves (defineCalculation
 * already adds them to every calculation). */
export { recalledSourceCautions } from "./core/calculation.ts";
