/**
 * Publications the uncertainty models cite, each written once. Bibliographic details were checked
 * against a public record where one could be found (each says what was checked); "from memory"
 * or "not verified" in a locator marks what was recalled, and `recalledSourceCautions` carries
 * that mark to every result that cites it.
 *
 * @module
 */
import type { Citation } from "../core/types.ts";

/** JCGM 100:2008, the Guide to the expression of uncertainty in measurement. */
export const JCGM_100: Citation = Object.freeze({
  authors: "Joint Committee for Guides in Metrology (JCGM/WG 1)",
  year: 2008,
  title: "Evaluation of measurement data — Guide to the expression of uncertainty in measurement",
  publication: "JCGM 100:2008 (GUM 1995 with minor corrections), BIPM",
});

/** JCGM 101:2008, the GUM's Supplement 1 (Monte Carlo propagation of distributions). */
export const JCGM_101: Citation = Object.freeze({
  authors: "Joint Committee for Guides in Metrology (JCGM/WG 1)",
  year: 2008,
  title:
    "Evaluation of measurement data — Supplement 1 to the GUM — Propagation of distributions using a Monte Carlo method",
  publication: "JCGM 101:2008, BIPM",
});

/** Verbraecken et al. 2006: BSA formulas compared in normal-weight, overweight and obese adults
 * (authors, title, journal, volume and pages checked against a public copy of the first page;
 * the size of the formulas' error in obesity is recalled, not checked). */
export const VERBRAECKEN_2006: Citation = Object.freeze({
  authors: "Verbraecken J, Van de Heyning P, De Backer W, Van Gaal L",
  year: 2006,
  title: "Body surface area in normal-weight, overweight, and obese adults. A comparison study",
  publication: "Metabolism 55:515–524",
  locator:
    "DuBois and Mosteller against other formulas in obese adults (size of the error from memory)",
});

/** Livingston & Lee: the DuBois formula in obese patients (authors, title and the abstract's
 * "as much as 20 %" checked against a public copy; journal, year and pages from memory). */
export const LIVINGSTON_LEE_2001: Citation = Object.freeze({
  authors: "Livingston EH, Lee S",
  year: 2001,
  title: "Body surface area prediction in normal-weight and obese patients",
  publication: "Am J Physiol Endocrinol Metab 281:E586–E591",
  locator:
    "abstract: DuBois underestimated BSA in obese patients by as much as 20 % (journal details from memory)",
});
