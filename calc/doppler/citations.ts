/**
 * Citations shared by the Doppler hemodynamics calculations and the severity tables.
 *
 * Bibliographic details were checked against the publication's record where a public copy could
 * be found (each citation says what was checked); "from memory" marks what was recalled and not
 * re-checked. The mark is part of the citation's locator; `defineCalculation` turns such a
 * citation into a caution of the calculation, so it reaches every result and display that cites
 * it.
 *
 * @module
 */
import type { Citation } from "../core/types.ts";
import { HATLE_ANGELSEN_1985, QUINONES_2002, RUDSKI_2010 } from "../citations.ts";

/** Publications shared with other domains, and the caution helper, re-exported under this
 * module's names. */
export { HATLE_ANGELSEN_1985, QUINONES_2002, RUDSKI_2010 };

/** Hatle et al. 1979: mitral valve area = 220 / pressure half-time. */
export const HATLE_1979: Citation = {
  authors: "Hatle L, Angelsen B, Tromsdal A",
  year: 1979,
  title: "Noninvasive assessment of atrioventricular pressure half-time by Doppler ultrasound",
  publication: "Circulation 60(5):1096-1104",
  doi: "10.1161/01.CIR.60.5.1096",
};

/** Baumgartner et al. 2009, EAE/ASE recommendations on valve stenosis. */
export const BAUMGARTNER_2009: Citation = {
  authors: "Baumgartner H, Hung J, Bermejo J, Chambers JB, Evangelista A, Griffin BP, et al.",
  year: 2009,
  title:
    "Echocardiographic assessment of valve stenosis: EAE/ASE recommendations for clinical practice",
  publication: "J Am Soc Echocardiogr 22(1):1-23; Eur J Echocardiogr 10(1):1-25",
  doi: "10.1016/j.echo.2008.11.029",
};

/** Baumgartner et al. 2017, EACVI/ASE focused update on aortic stenosis. */
export const BAUMGARTNER_2017: Citation = {
  authors: "Baumgartner H, Hung J, Bermejo J, Chambers JB, Edvardsen T, Goldstein S, et al.",
  year: 2017,
  title:
    "Recommendations on the echocardiographic assessment of aortic valve stenosis: a focused update from the European Association of Cardiovascular Imaging and the American Society of Echocardiography",
  publication: "J Am Soc Echocardiogr 30(4):372-392; Eur Heart J Cardiovasc Imaging 18(3):254-275",
  doi: "10.1016/j.echo.2017.02.009",
};

/** Zoghbi et al. 2017, ASE recommendations on native valvular regurgitation. */
export const ZOGHBI_2017: Citation = {
  authors: "Zoghbi WA, Adams D, Bonow RO, Enriquez-Sarano M, Foster E, Grayburn PA, et al.",
  year: 2017,
  title:
    "Recommendations for noninvasive evaluation of native valvular regurgitation: a report from the American Society of Echocardiography developed in collaboration with the Society for Cardiovascular Magnetic Resonance",
  publication: "J Am Soc Echocardiogr 30(4):303-371",
  doi: "10.1016/j.echo.2017.01.007",
};

/** Pu et al. 1995: the α/180 geometric correction of PISA flow for a constrained surface. */
export const PU_1995: Citation = {
  authors: "Pu M, Vandervoort PM, Griffin BP, Leung DY, Stewart WJ, Cosgrove DM, Thomas JD",
  year: 1995,
  title:
    "Quantification of mitral regurgitation by the proximal convergence method using transesophageal echocardiography: clinical validation of a geometric correction for proximal flow constraint",
  publication: "Circulation 92(8):2169-2177",
  locator: "from memory",
  doi: "10.1161/01.CIR.92.8.2169",
};

/** Galiè et al. 2015 ESC/ERS pulmonary hypertension guidelines. */
export const GALIE_2015: Citation = {
  authors: "Galiè N, Humbert M, Vachiery JL, Gibbs S, Lang I, Torbicki A, et al.",
  year: 2015,
  title: "2015 ESC/ERS Guidelines for the diagnosis and treatment of pulmonary hypertension",
  publication: "Eur Heart J 2016;37(1):67-119; co-published in Eur Respir J 2015;46(4):903-975",
  locator: "Table 8, echocardiographic probability of pulmonary hypertension (from memory)",
  doi: "10.1093/eurheartj/ehv317",
};

/** Humbert et al. 2022 ESC/ERS pulmonary hypertension guidelines. */
export const HUMBERT_2022: Citation = {
  authors: "Humbert M, Kovacs G, Hoeper MM, Badagliacca R, Berger RMF, Brida M, et al.",
  year: 2022,
  title: "2022 ESC/ERS Guidelines for the diagnosis and treatment of pulmonary hypertension",
  publication: "Eur Heart J 43(38):3618-3731",
  locator: "figure on echocardiographic probability of pulmonary hypertension (from memory)",
  doi: "10.1093/eurheartj/ehac237",
};

/**
 * Nishimura et al. 2014 AHA/ACC valvular heart disease guideline: the full guideline, which holds
 * the stages of mitral stenosis (its executive summary, cited here before, does not hold the
 * table). Checked: the JACC pages e57–e185 and the title (guideline clearinghouse record of the
 * full guideline), the DOI (a public copy of the Circulation full text). The Circulation pages
 * were recalled.
 *
 * @example
 * ```ts
 * import { NISHIMURA_2014 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.doesNotMatch(NISHIMURA_2014.title, /executive summary/i);
 * ```
 */
export const NISHIMURA_2014: Citation = Object.freeze({
  authors: "Nishimura RA, Otto CM, Bonow RO, Carabello BA, Erwin JP 3rd, Guyton RA, et al.",
  year: 2014,
  title:
    "2014 AHA/ACC Guideline for the Management of Patients With Valvular Heart Disease: a report of the American College of Cardiology/American Heart Association Task Force on Practice Guidelines",
  publication:
    "J Am Coll Cardiol 2014;63(22):e57–e185; Circulation 2014;129(23):e521–e643 (Circulation pages from memory)",
  doi: "10.1161/CIR.0000000000000031",
});

/**
 * Otto et al. 2020 ACC/AHA valvular heart disease guideline, the full guideline (stages of mitral
 * stenosis in its Table 16). Checked: the JACC citation as printed on the first page of a public
 * copy of the JACC edition; the Circulation pages and the DOI as given by a secondary
 * reproduction of Table 16 that links the DOI.
 *
 * @example
 * ```ts
 * import { OTTO_2020 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(OTTO_2020.doi, "10.1161/CIR.0000000000000923");
 * ```
 */
export const OTTO_2020: Citation = Object.freeze({
  authors: "Otto CM, Nishimura RA, Bonow RO, Carabello BA, Erwin JP 3rd, Gentile F, et al.",
  year: 2020,
  title:
    "2020 ACC/AHA Guideline for the Management of Patients With Valvular Heart Disease: a report of the American College of Cardiology/American Heart Association Joint Committee on Clinical Practice Guidelines",
  publication: "Circulation 2021;143(5):e72–e227; J Am Coll Cardiol 2021;77(4):e25–e197",
  doi: "10.1161/CIR.0000000000000923",
});

/** Rodriguez et al. 1993: mitral valve area in stenosis by the proximal flow convergence (PISA)
 * method, MVA = 2πr²·Va/Vpeak·α/180. */
export const RODRIGUEZ_1993: Citation = {
  authors: "Rodriguez L, Thomas JD, Monterroso V, Weyman AE, Harrigan P, Mueller LN, Levine RA",
  year: 1993,
  title:
    "Validation of the proximal flow convergence method: calculation of orifice area in patients with mitral stenosis",
  publication: "Circulation 88(3):1157-1165",
  locator: "PISA mitral valve area with the α/180 funnel correction (from memory)",
  doi: "10.1161/01.CIR.88.3.1157",
};

/**
 * Garcia et al. 2000: the energy loss coefficient EOA·AA/(AA − EOA) and its index to BSA, with
 * the cut-off 0.52 cm²/m². Checked against the article's record and abstract (authors, journal,
 * volume, first page, formula, indexing to BSA, the cut-off as the best predictor of death or
 * valve replacement, positive predictive value 67 %, 138 patients); the last page and the DOI's
 * ending were recalled.
 */
export const GARCIA_2000: Citation = {
  authors: "Garcia D, Pibarot P, Dumesnil JG, Sakr F, Durand LG",
  year: 2000,
  title:
    "Assessment of aortic valve stenosis severity: a new index based on the energy loss concept",
  publication: "Circulation 101(7):765-771",
  locator: "abstract: energy loss coefficient (EOA×AA)/(AA−EOA), indexed to BSA; ELI ≤ 0.52 cm²/m²",
  doi: "10.1161/01.CIR.101.7.765",
};
