/**
 * Chance-corrected agreement for categorical (graded) findings: Cohen's kappa, weighted kappa and
 * Fleiss' kappa, with standard errors.
 *
 * @module
 */
import {
  checkConfidence,
  displayed,
  type LabelOptions,
  measuredOf,
  namesOf,
  shown,
} from "./checks.ts";
import { normalCdf, normalQuantile } from "../stats/distributions.ts";
import { KAPPA_CAUTION } from "./cautions.ts";
import { displayCohenKappa, displayFleissKappa } from "../../display/agreement.ts";
import type { CohenKappaResult, FleissKappaResult, KappaWeights } from "./types.ts";

/** Options of {@linkcode cohenKappa}. */
export interface CohenKappaOptions extends LabelOptions {
  /** "none" (Cohen 1960), "linear" (wᵢⱼ = 1 − |i − j|/(c − 1)) or "quadratic"
   * (wᵢⱼ = 1 − (i − j)²/(c − 1)²). @default "none" */
  readonly weights?: KappaWeights;
  /** Confidence level of the interval κ ± z·SE. @default 0.95 */
  readonly confidence?: number;
  /** Names of rater A (table rows) and rater B (columns), for the display.
   * @default ["A", "B"] */
  readonly raterNames?: readonly [string, string];
}

function weightMatrix(c: number, weights: KappaWeights): number[][] {
  return Array.from({ length: c }, (_, i) =>
    Array.from({ length: c }, (_, j) => {
      if (weights === "none") return i === j ? 1 : 0;
      const d = Math.abs(i - j) / (c - 1);
      return weights === "linear" ? 1 - d : 1 - d * d;
    }));
}

function checkWeights(where: string, weights: unknown): KappaWeights {
  if (weights !== "none" && weights !== "linear" && weights !== "quadratic") {
    throw new TypeError(
      `${where}: expected 'weights' of "none", "linear" or "quadratic", got ${shown(weights)}`,
    );
  }
  return weights;
}

/**
 * Cohen's kappa (unweighted or weighted) from a square table of counts: rows are rater A's
 * categories, columns rater B's, in the same (ordered) category order.
 *
 * Formulas: pᵢⱼ = countᵢⱼ/n; p_o = ΣΣ wᵢⱼpᵢⱼ; p_e = ΣΣ wᵢⱼpᵢ.p.ⱼ; κ = (p_o − p_e)/(1 − p_e);
 * w̄ᵢ. = Σⱼ p.ⱼwᵢⱼ, w̄.ⱼ = Σᵢ pᵢ.wᵢⱼ;
 * var κ = [ΣΣ pᵢⱼ(wᵢⱼ − (w̄ᵢ. + w̄.ⱼ)(1 − κ))² − (κ − p_e(1 − κ))²] / (n(1 − p_e)²);
 * var₀ κ = [ΣΣ pᵢ.p.ⱼ(wᵢⱼ − (w̄ᵢ. + w̄.ⱼ))² − p_e²] / (n(1 − p_e)²).
 *
 * Sources: Cohen J (1960) A coefficient of agreement for nominal scales. Educ Psychol Meas
 * 20:37–46, doi:10.1177/001316446002000104; Cohen J (1968) Weighted kappa. Psychol Bull
 * 70:213–220, doi:10.1037/h0026256; Fleiss JL, Cohen J, Everitt BS (1969) Large sample standard
 * errors of kappa and weighted kappa. Psychol Bull 72:323–327, doi:10.1037/h0028106.
 *
 * @param table c × c counts (non-negative integers), c ≥ 2.
 * @param options Weights, confidence level, and category labels (default "1".."c").
 * @returns κ with standard errors, interval and test.
 * @throws {TypeError} When the table is not square or holds non-numbers.
 * @throws {RangeError} For negative or non-integer counts, fewer than 2 subjects, or chance
 * agreement p_e = 1 (both raters used a single category; κ undefined).
 *
 * @example Two raters, two categories
 * ```ts
 * import { cohenKappaFromTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * // p_o = 0.7, p_e = 0.5·0.6 + 0.5·0.4 = 0.5, κ = 0.4 (hand-checkable)
 * const r = cohenKappaFromTable([[20, 5], [10, 15]]);
 * assert.ok(Math.abs(r.kappa - 0.4) < 1e-12);
 * ```
 */
export function cohenKappaFromTable(
  table: readonly (readonly number[])[],
  options: CohenKappaOptions & { readonly categories?: readonly string[] } = {},
): CohenKappaResult {
  const where = "Cohen kappa";
  const weights = checkWeights(where, options.weights ?? "none");
  const confidence = checkConfidence(where, options.confidence ?? 0.95);
  const quantity = measuredOf(where, options.quantity);
  const raterNames = namesOf(where, "raterNames", options.raterNames, ["A", "B"]);
  if (!Array.isArray(table) || table.length < 2) {
    throw new TypeError(
      `${where}: expected 'table' as a square array of at least 2 rows, got ${shown(table)}`,
    );
  }
  const c = table.length;
  table.forEach((row, i) => {
    if (!Array.isArray(row) || row.length !== c) {
      throw new TypeError(
        `${where}: expected 'table[${i}]' with ${c} counts (square table), got ${shown(row)}`,
      );
    }
    row.forEach((v, j) => {
      if (typeof v !== "number") {
        throw new TypeError(`${where}: expected a count at 'table[${i}][${j}]', got ${shown(v)}`);
      }
      if (!(v >= 0 && Number.isInteger(v))) {
        throw new RangeError(
          `${where}: expected a non-negative integer count at 'table[${i}][${j}]', got ${v}`,
        );
      }
    });
  });
  const categories = options.categories ?? Array.from({ length: c }, (_, i) => String(i + 1));
  if (categories.length !== c) {
    throw new TypeError(`${where}: expected ${c} category labels, got ${categories.length}`);
  }
  const n = table.flat().reduce((s, v) => s + v, 0);
  if (n < 2) throw new RangeError(`${where}: expected at least 2 subjects, got ${n}`);
  const w = weightMatrix(c, weights);
  const p: number[][] = table.map((row) => row.map((v: number) => v / n));
  const rowP = p.map((row) => row.reduce((s, v) => s + v, 0));
  const colP = Array.from({ length: c }, (_, j) => p.reduce((s, row) => s + row[j]!, 0));
  let po = 0;
  let pe = 0;
  for (let i = 0; i < c; i++) {
    for (let j = 0; j < c; j++) {
      po += w[i]![j]! * p[i]![j]!;
      pe += w[i]![j]! * rowP[i]! * colP[j]!;
    }
  }
  if (!(pe < 1)) {
    throw new RangeError(
      `${where}: expected raters to use more than one category (chance agreement < 1), got ${pe}`,
    );
  }
  const kappa = (po - pe) / (1 - pe);
  const wRow = Array.from(
    { length: c },
    (_, i) => colP.reduce((s, pj, j) => s + pj * w[i]![j]!, 0),
  );
  const wCol = Array.from(
    { length: c },
    (_, j) => rowP.reduce((s, pi, i) => s + pi * w[i]![j]!, 0),
  );
  let a = 0;
  let a0 = 0;
  for (let i = 0; i < c; i++) {
    for (let j = 0; j < c; j++) {
      a += p[i]![j]! * (w[i]![j]! - (wRow[i]! + wCol[j]!) * (1 - kappa)) ** 2;
      a0 += rowP[i]! * colP[j]! * (w[i]![j]! - (wRow[i]! + wCol[j]!)) ** 2;
    }
  }
  const denom = n * (1 - pe) ** 2;
  const se = Math.sqrt(Math.max(0, (a - (kappa - pe * (1 - kappa)) ** 2) / denom));
  const se0 = Math.sqrt(Math.max(0, (a0 - pe * pe) / denom));
  const zq = normalQuantile(0.5 + confidence / 2);
  const z = se0 > 0 ? kappa / se0 : 0;
  return displayed({
    n,
    weights,
    categories: [...categories],
    table: table.map((r) => [...r]),
    observedAgreement: po,
    expectedAgreement: pe,
    kappa,
    standardError: se,
    standardErrorNull: se0,
    ci: { lower: Math.max(-1, kappa - zq * se), upper: Math.min(1, kappa + zq * se) },
    confidence,
    z,
    pValue: 2 * (1 - normalCdf(Math.abs(z))),
    quantity,
    raterNames,
    cautions: [KAPPA_CAUTION],
  }, displayCohenKappa);
}

/**
 * Cohen's kappa (unweighted or weighted) from two raters' category labels on the same subjects.
 * Builds the table and calls {@linkcode cohenKappaFromTable}.
 *
 * Source: as {@linkcode cohenKappaFromTable} (Cohen 1960, 1968; Fleiss, Cohen & Everitt 1969,
 * doi:10.1037/h0028106).
 *
 * @param raterA Category given by rater A to each subject (string or number).
 * @param raterB Category given by rater B, same subjects and order.
 * @param options Weights, confidence, and `categories`: the ordered list of categories (required
 * for weighted kappa with text labels; numbers are otherwise ordered ascending, text labels
 * alphabetically).
 * @returns As {@linkcode cohenKappaFromTable}.
 * @throws {TypeError} For arrays of unequal length, labels that are neither strings nor finite
 * numbers, a label not in `categories`, or weighted kappa on text labels without `categories`.
 * @throws {RangeError} As {@linkcode cohenKappaFromTable}.
 *
 * @example Severity grades by two readers
 * ```ts
 * import { cohenKappa } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const a = ["mild", "mild", "moderate", "severe", "moderate", "mild"];
 * const b = ["mild", "moderate", "moderate", "severe", "moderate", "mild"];
 * const r = cohenKappa(a, b, { weights: "linear", categories: ["mild", "moderate", "severe"] });
 * assert.ok(r.kappa > 0.7 && r.kappa < 1);
 * ```
 */
export function cohenKappa(
  raterA: readonly (string | number)[],
  raterB: readonly (string | number)[],
  options: CohenKappaOptions & { readonly categories?: readonly (string | number)[] } = {},
): CohenKappaResult {
  const where = "Cohen kappa";
  if (!Array.isArray(raterA) || !Array.isArray(raterB) || raterA.length !== raterB.length) {
    throw new TypeError(
      `${where}: expected 'raterA' and 'raterB' as arrays of equal length, got ${
        shown(raterA)
      } and ${shown(raterB)}`,
    );
  }
  const all = [...raterA, ...raterB];
  all.forEach((v, i) => {
    if (!(typeof v === "string" || (typeof v === "number" && Number.isFinite(v)))) {
      throw new TypeError(
        `${where}: expected a category label at position ${i % raterA.length}, got ${shown(v)}`,
      );
    }
  });
  let categories: string[];
  if (options.categories) {
    categories = options.categories.map(String);
  } else {
    const weights = options.weights ?? "none";
    const numeric = all.every((v) => typeof v === "number");
    if (weights !== "none" && !numeric) {
      throw new TypeError(
        `${where}: expected 'categories' (the order of the grades) for weighted kappa, got none`,
      );
    }
    const distinct = [...new Set(all)];
    distinct.sort((
      p,
      q,
    ) => (numeric ? (p as number) - (q as number) : String(p).localeCompare(String(q))));
    categories = distinct.map(String);
  }
  const index = new Map(categories.map((c, i) => [c, i]));
  const table = categories.map(() => categories.map(() => 0));
  raterA.forEach((v, i) => {
    const r = index.get(String(v));
    const c = index.get(String(raterB[i]));
    if (r === undefined) {
      throw new TypeError(`${where}: expected 'raterA[${i}]' in the categories, got ${shown(v)}`);
    }
    if (c === undefined) {
      throw new TypeError(
        `${where}: expected 'raterB[${i}]' in the categories, got ${shown(raterB[i])}`,
      );
    }
    table[r]![c]!++;
  });
  const { categories: _ignored, ...rest } = options;
  return cohenKappaFromTable(table, { ...rest, categories });
}

/** Options of {@linkcode fleissKappa}. */
export interface FleissKappaOptions extends LabelOptions {
  /** Category labels in column order, for the display. @default "1".."c" */
  readonly categories?: readonly string[];
}

/**
 * Fleiss' kappa for several raters assigning each subject to one of c categories; raters need not
 * be the same people for every subject, but every subject has the same number m of ratings.
 *
 * Formulas: nᵢⱼ = raters putting subject i in category j; pⱼ = Σᵢ nᵢⱼ/(N m);
 * Pᵢ = (Σⱼ nᵢⱼ² − m)/(m(m − 1)); P̄ = mean Pᵢ; P̄_e = Σ pⱼ²; κ = (P̄ − P̄_e)/(1 − P̄_e);
 * SE₀ = √(2/(N m(m − 1))) · √((Σpⱼqⱼ)² − Σpⱼqⱼ(qⱼ − pⱼ)) / Σpⱼqⱼ, qⱼ = 1 − pⱼ.
 *
 * Sources: Fleiss JL (1971) Measuring nominal scale agreement among many raters. Psychol Bull
 * 76:378–382, doi:10.1037/h0031619; Fleiss JL, Nee JCM, Landis JR (1979) Large sample variance of
 * kappa in the case of different sets of raters. Psychol Bull 86:974–977,
 * doi:10.1037/0033-2909.86.5.974.
 *
 * @param counts N rows (subjects) × c columns (categories): how many raters chose each category.
 * @param options Category labels and what was rated, for the display.
 * @returns κ with its null standard error and test.
 * @throws {TypeError} When rows differ in length or hold non-numbers.
 * @throws {RangeError} For fewer than 2 subjects, negative or non-integer counts, rows with
 * different totals (unbalanced: each subject needs the same number of ratings), fewer than 2
 * ratings per subject, or all ratings in one category.
 *
 * @example
 * ```ts
 * import { fleissKappa } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = fleissKappa([[3, 0], [0, 3], [2, 1], [3, 0]]);
 * assert.ok(r.kappa > 0.4 && r.kappa < 0.7);
 * ```
 */
export function fleissKappa(
  counts: readonly (readonly number[])[],
  options: FleissKappaOptions = {},
): FleissKappaResult {
  const where = "Fleiss kappa";
  const quantity = measuredOf(where, options.quantity);
  if (!Array.isArray(counts)) {
    throw new TypeError(
      `${where}: expected 'counts' as an array of rows (subjects), got ${shown(counts)}`,
    );
  }
  const N = counts.length;
  if (N < 2) throw new RangeError(`${where}: expected at least 2 subjects, got ${N}`);
  const c = Array.isArray(counts[0]) ? counts[0].length : 0;
  let m = -1;
  counts.forEach((row, i) => {
    if (!Array.isArray(row) || row.length !== c || c < 2) {
      throw new TypeError(
        `${where}: expected 'counts[${i}]' with ${Math.max(c, 2)} category counts, got ${
          shown(row)
        }`,
      );
    }
    let total = 0;
    row.forEach((v, j) => {
      if (typeof v !== "number") {
        throw new TypeError(`${where}: expected a count at 'counts[${i}][${j}]', got ${shown(v)}`);
      }
      if (!(v >= 0 && Number.isInteger(v))) {
        throw new RangeError(
          `${where}: expected a non-negative integer at 'counts[${i}][${j}]', got ${v}`,
        );
      }
      total += v;
    });
    if (m === -1) m = total;
    else if (total !== m) {
      throw new RangeError(
        `${where}: expected the same number of ratings (${m}) for every subject, 'counts[${i}]' has ${total}`,
      );
    }
  });
  if (m < 2) throw new RangeError(`${where}: expected at least 2 ratings per subject, got ${m}`);
  const categories = options.categories ?? Array.from({ length: c }, (_, i) => String(i + 1));
  if (categories.length !== c) {
    throw new TypeError(`${where}: expected ${c} category labels, got ${categories.length}`);
  }
  const pj = Array.from({ length: c }, (_, j) => counts.reduce((s, r) => s + r[j]!, 0) / (N * m));
  const pBar = counts.reduce(
    (s, r) => s + (r.reduce((t: number, v: number) => t + v * v, 0) - m) / (m * (m - 1)),
    0,
  ) / N;
  const pe = pj.reduce((s, p) => s + p * p, 0);
  if (!(pe < 1)) {
    throw new RangeError(
      `${where}: expected ratings in more than one category, got chance agreement ${pe}`,
    );
  }
  const kappa = (pBar - pe) / (1 - pe);
  const pq = pj.reduce((s, p) => s + p * (1 - p), 0);
  const pqqp = pj.reduce((s, p) => s + p * (1 - p) * (1 - 2 * p), 0);
  const se0 = (Math.sqrt(2 / (N * m * (m - 1))) * Math.sqrt(Math.max(0, pq * pq - pqqp))) / pq;
  const z = kappa / se0;
  return displayed({
    subjects: N,
    ratersPerSubject: m,
    observedAgreement: pBar,
    expectedAgreement: pe,
    kappa,
    standardErrorNull: se0,
    z,
    pValue: 2 * (1 - normalCdf(Math.abs(z))),
    quantity,
    categories: [...categories],
    cautions: [KAPPA_CAUTION],
  }, displayFleissKappa);
}
