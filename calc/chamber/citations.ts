/**
 * Publications cited by the chamber calculations, each declared once.
 *
 * @module
 */
import type { Citation } from "../core/types.ts";
import { LANG_2015, RUDSKI_2010 } from "../citations.ts";

/** Shared publications, re-exported under this module's names. */
export { LANG_2015, RUDSKI_2010 };

/** Teichholz LE et al. 1976: volume from one LV diameter. */
export const TEICHHOLZ_1976: Citation = {
  authors: "Teichholz LE, Kreulen T, Herman MV, Gorlin R",
  year: 1976,
  title:
    "Problems in echocardiographic volume determinations: echocardiographic-angiographic correlations in the presence or absence of asynergy",
  publication: "Am J Cardiol 1976;37:7–11",
  doi: "10.1016/0002-9149(76)90491-4",
};

/** Devereux RB et al. 1986: the cube-formula LV mass validated at necropsy. */
export const DEVEREUX_1986: Citation = {
  authors: "Devereux RB, Alonso DR, Lutas EM, Gottlieb GJ, Campo E, Sachs I, Reichek N",
  year: 1986,
  title:
    "Echocardiographic assessment of left ventricular hypertrophy: comparison to necropsy findings",
  publication: "Am J Cardiol 1986;57:450–458",
  doi: "10.1016/0002-9149(86)90771-x",
};

/** Ganau A et al. 1992: the four patterns of LV geometry. */
export const GANAU_1992: Citation = {
  authors: "Ganau A, Devereux RB, Roman MJ, de Simone G, Pickering TG, Saba PS, et al.",
  year: 1992,
  title:
    "Patterns of left ventricular hypertrophy and geometric remodeling in essential hypertension",
  publication: "J Am Coll Cardiol 1992;19:1550–1558",
  doi: "10.1016/0735-1097(92)90617-v",
};

/** Schiller NB et al. 1989: the method of discs and the area–length method. */
export const SCHILLER_1989: Citation = {
  authors: "Schiller NB, Shah PM, Crawford M, DeMaria A, Devereux R, Feigenbaum H, et al.",
  year: 1989,
  title:
    "Recommendations for quantitation of the left ventricle by two-dimensional echocardiography",
  publication: "J Am Soc Echocardiogr 1989;2:358–367",
  doi: "10.1016/s0894-7317(89)80014-8",
};

/** Tei C et al. 1995: the myocardial performance index. */
export const TEI_1995: Citation = {
  authors: "Tei C, Ling LH, Hodge DO, Bailey KR, Oh JK, Rodeheffer RJ, Tajik AJ, Seward JB",
  year: 1995,
  title:
    "New index of combined systolic and diastolic myocardial performance: a simple and reproducible measure of cardiac function. A study in normals and dilated cardiomyopathy",
  publication: "J Cardiol 1995;26:357–366",
};

/** Kaul S et al. 1984: tricuspid annular plane systolic excursion. */
export const KAUL_1984: Citation = {
  authors: "Kaul S, Tei C, Hopkins JM, Shah PM",
  year: 1984,
  title: "Assessment of right ventricular function using two-dimensional echocardiography",
  publication: "Am Heart J 1984;107:526–531",
  doi: "10.1016/0002-8703(84)90095-4",
};

/** Hu K et al. 2013: mitral annular plane systolic excursion. */
export const HU_2013: Citation = {
  authors: "Hu K, Liu D, Herrmann S, Niemann M, Gaudron PD, Voelker W, et al.",
  year: 2013,
  title:
    "Clinical implication of mitral annular plane systolic excursion for patients with cardiovascular disease",
  publication: "Eur Heart J Cardiovasc Imaging 2013;14:205–212",
};

/** Voigt JU et al. 2015: common standard for 2D speckle-tracking deformation imaging. */
export const VOIGT_2015: Citation = {
  authors: "Voigt JU, Pedrizzetti G, Lysyansky P, Marwick TH, Houle H, Baumann R, et al.",
  year: 2015,
  title:
    "Definitions for a common standard for 2D speckle tracking echocardiography: consensus document of the EACVI/ASE/Industry Task Force to standardize deformation imaging",
  publication: "Eur Heart J Cardiovasc Imaging 2015;16:1–11",
  doi: "10.1093/ehjci/jeu184",
};
