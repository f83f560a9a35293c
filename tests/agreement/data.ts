/**
 * Published data sets used as outside checks by the agreement tests.
 *
 * @module
 */

/** Peak expiratory flow rate (l/min), 17 subjects, two readings with the Wright peak flow meter
 * and two with the mini Wright meter: columns wright1, wright2, mini1, mini2. Printed in
 * Bland JM, Altman DG (1986) Lancet 327:307–310, Table 1 (typed in from memory of the table;
 * the bias and SD it yields match the paper's −2.1 and 38.8 l/min). */
export const PEAK_FLOW: readonly (readonly [number, number, number, number])[] = [
  [494, 490, 512, 525],
  [395, 397, 430, 415],
  [516, 512, 520, 508],
  [434, 401, 428, 444],
  [476, 470, 500, 500],
  [557, 611, 600, 625],
  [413, 415, 364, 460],
  [442, 431, 380, 390],
  [650, 638, 658, 642],
  [433, 429, 445, 432],
  [417, 420, 432, 420],
  [656, 633, 626, 605],
  [267, 275, 260, 227],
  [478, 492, 477, 467],
  [178, 165, 259, 268],
  [423, 372, 350, 370],
  [427, 421, 451, 443],
];

/** Wright meter, first reading. */
export const WRIGHT1: number[] = PEAK_FLOW.map((r) => r[0]);
/** Wright meter, second reading. */
export const WRIGHT2: number[] = PEAK_FLOW.map((r) => r[1]);
/** Mini Wright meter, first reading. */
export const MINI1: number[] = PEAK_FLOW.map((r) => r[2]);
/** Mini Wright meter, second reading. */
export const MINI2: number[] = PEAK_FLOW.map((r) => r[3]);

/** Shrout PE, Fleiss JL (1979) Psychol Bull 86:420–428, Table 2: 6 targets rated by 4 judges. */
export const SHROUT_FLEISS: readonly (readonly number[])[] = [
  [9, 2, 5, 8],
  [6, 1, 3, 2],
  [8, 4, 6, 8],
  [7, 1, 2, 6],
  [10, 5, 6, 9],
  [6, 2, 4, 7],
];

/** Husbands' (rows) and wives' (columns) ratings of sexual fun, 4 ordered categories ("Never
 * fun" … "Always fun"), 91 couples: the `SexualFun` table shipped with R package vcd 1.4.11
 * (from Agresti A, Categorical Data Analysis, Table 10.5), printed by `print(SexualFun)`. */
export const SEXUAL_FUN: readonly (readonly number[])[] = [
  [7, 7, 2, 3],
  [2, 8, 3, 7],
  [1, 5, 4, 9],
  [2, 8, 9, 14],
];

/** Fleiss' kappa worked example: 10 subjects, 14 raters, 5 categories (counts per category), as
 * in the Wikipedia article "Fleiss' kappa" (from memory), which gives P̄ = 0.378,
 * P̄e = 0.213, κ = 0.210. */
export const FLEISS_EXAMPLE: readonly (readonly number[])[] = [
  [0, 0, 0, 0, 14],
  [0, 2, 6, 4, 2],
  [0, 0, 3, 5, 6],
  [0, 3, 9, 2, 0],
  [2, 2, 8, 1, 1],
  [7, 7, 0, 0, 0],
  [3, 2, 6, 3, 0],
  [2, 5, 3, 2, 2],
  [6, 5, 2, 1, 0],
  [0, 2, 2, 3, 7],
];

/** The peak-flow data as a long table (subject, meter, replicate, peak flow in L/min): the
 * Wright meter as "wright", the mini Wright meter as "mini", two readings each. */
export function peakFlowCsv(): string {
  const lines = ["subject,meter,replicate,peak flow [L/min]"];
  PEAK_FLOW.forEach((r, i) => {
    lines.push(`s${i + 1},wright,1,${r[0]}`, `s${i + 1},wright,2,${r[1]}`);
    lines.push(`s${i + 1},mini,1,${r[2]}`, `s${i + 1},mini,2,${r[3]}`);
  });
  return lines.join("\n") + "\n";
}

/** Shrout & Fleiss (1979) Table 2 as a long table: target, judge (j1..j4), rating. */
export function shroutFleissCsv(): string {
  const lines = ["target,judge,rating"];
  SHROUT_FLEISS.forEach((row, i) => row.forEach((v, j) => lines.push(`t${i + 1},j${j + 1},${v}`)));
  return lines.join("\n") + "\n";
}

/** The categories of {@linkcode SEXUAL_FUN} in order. */
export const FUN_GRADES = ["never", "fairly", "very", "always"] as const;

/** The sexual-fun table as a long table of graded findings: couple, rater (husband, wife),
 * grade; one couple per count of the table. */
export function sexualFunCsv(): string {
  const lines = ["couple,rater,grade"];
  let k = 0;
  SEXUAL_FUN.forEach((row, i) =>
    row.forEach((count, j) => {
      for (let c = 0; c < count; c++) {
        k++;
        lines.push(`c${k},husband,${FUN_GRADES[i]}`, `c${k},wife,${FUN_GRADES[j]}`);
      }
    })
  );
  return lines.join("\n") + "\n";
}

/** The Fleiss example as a long table: subject, rater (r1..r14), category (1..5); raters are
 * assigned to the counts in order (Fleiss' kappa depends only on the counts per subject). */
export function fleissExampleCsv(): string {
  const lines = ["subject,rater,category"];
  FLEISS_EXAMPLE.forEach((counts, i) => {
    let r = 0;
    counts.forEach((n, c) => {
      for (let k = 0; k < n; k++) lines.push(`s${i + 1},r${++r},${c + 1}`);
    });
  });
  return lines.join("\n") + "\n";
}
