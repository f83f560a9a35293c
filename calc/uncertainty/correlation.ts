/**
 * Correlation between inputs: building, checking (symmetric, unit diagonal, positive
 * semi-definite) and factorising (Cholesky) the correlation matrix.
 *
 * @module
 */

/** One correlation coefficient between two named inputs. */
export type CorrelationPair = readonly [string, string, number];

/** Correlations as pairs, or as a full matrix over named inputs. */
export type Correlations =
  | readonly CorrelationPair[]
  | { readonly names: readonly string[]; readonly matrix: readonly (readonly number[])[] };

const TOLERANCE = 1e-10;

/**
 * Builds and checks the correlation matrix over `names` (in that order).
 *
 * @param names Input names of the calculation.
 * @param correlations Pairs or a full matrix; inputs not mentioned are uncorrelated.
 * @param where Prefix for error messages.
 * @returns The matrix as rows.
 * @throws {TypeError} For an unknown input name or a matrix of the wrong shape.
 * @throws {RangeError} For a coefficient outside [−1, 1], a non-unit diagonal, an asymmetric or a
 * not positive semi-definite matrix.
 */
export function correlationMatrix(
  names: readonly string[],
  correlations: Correlations | undefined,
  where: string,
): number[][] {
  const r: number[][] = names.map((_, i) => names.map((_, j) => (i === j ? 1 : 0)));
  const index = (name: string) => {
    const i = names.indexOf(name);
    if (i < 0) {
      throw new TypeError(
        `${where}: unknown input '${name}' in correlations; expected one of ${names.join(", ")}`,
      );
    }
    return i;
  };
  if (correlations === undefined) return r;
  if (Array.isArray(correlations)) {
    for (const [a, b, rho] of correlations as readonly CorrelationPair[]) {
      const i = index(a);
      const j = index(b);
      if (!(rho >= -1 && rho <= 1)) {
        throw new RangeError(
          `${where}: expected correlation of '${a}' and '${b}' in [-1, 1], got ${rho}`,
        );
      }
      if (i === j) {
        if (rho !== 1) {
          throw new RangeError(
            `${where}: expected correlation of '${a}' with itself to be 1, got ${rho}`,
          );
        }
        continue;
      }
      r[i]![j] = rho;
      r[j]![i] = rho;
    }
  } else {
    const { names: given, matrix } = correlations as {
      names: readonly string[];
      matrix: readonly (readonly number[])[];
    };
    if (matrix.length !== given.length || matrix.some((row) => row.length !== given.length)) {
      throw new TypeError(
        `${where}: expected a ${given.length}×${given.length} correlation matrix, got ${matrix.length} rows`,
      );
    }
    const idx = given.map(index);
    for (let a = 0; a < given.length; a++) {
      for (let b = 0; b < given.length; b++) {
        const rho = matrix[a]![b]!;
        if (a === b && Math.abs(rho - 1) > TOLERANCE) {
          throw new RangeError(`${where}: expected a unit diagonal, got ${rho} for '${given[a]}'`);
        }
        if (!(rho >= -1 && rho <= 1)) {
          throw new RangeError(
            `${where}: expected correlation of '${given[a]}' and '${
              given[b]
            }' in [-1, 1], got ${rho}`,
          );
        }
        if (Math.abs(rho - matrix[b]![a]!) > TOLERANCE) {
          throw new RangeError(
            `${where}: expected a symmetric correlation matrix, got r('${given[a]}', '${
              given[b]
            }') = ${rho} and r('${given[b]}', '${given[a]}') = ${matrix[b]![a]}`,
          );
        }
        r[idx[a]!]![idx[b]!] = a === b ? 1 : rho;
      }
    }
  }
  choleskySemidefinite(r, names, where);
  return r;
}

/**
 * Lower-triangular L with L·Lᵀ = A for a symmetric positive semi-definite A (zero pivots allowed
 * where the remaining column is zero, as with perfectly correlated inputs).
 *
 * @throws {RangeError} When A is not positive semi-definite.
 */
export function choleskySemidefinite(
  a: readonly (readonly number[])[],
  names: readonly string[],
  where: string,
): number[][] {
  const n = a.length;
  const l = a.map(() => new Array<number>(n).fill(0));
  for (let j = 0; j < n; j++) {
    let d = a[j]![j]!;
    for (let k = 0; k < j; k++) d -= l[j]![k]! ** 2;
    const scale = Math.max(1, Math.abs(a[j]![j]!));
    if (d < -TOLERANCE * scale) {
      throw new RangeError(
        `${where}: expected a positive semi-definite correlation matrix, got a negative pivot ${
          d.toPrecision(3)
        } at '${names[j]}'`,
      );
    }
    if (d <= TOLERANCE * scale) {
      for (let i = j + 1; i < n; i++) {
        let s = a[i]![j]!;
        for (let k = 0; k < j; k++) s -= l[i]![k]! * l[j]![k]!;
        if (Math.abs(s) > 1e-7 * scale) {
          throw new RangeError(
            `${where}: expected a positive semi-definite correlation matrix, got an inconsistent row at '${
              names[i]
            }'`,
          );
        }
      }
      continue;
    }
    const ljj = Math.sqrt(d);
    l[j]![j] = ljj;
    for (let i = j + 1; i < n; i++) {
      let s = a[i]![j]!;
      for (let k = 0; k < j; k++) s -= l[i]![k]! * l[j]![k]!;
      l[i]![j] = s / ljj;
    }
  }
  return l;
}

/**
 * Correlation coefficient of two means estimated from simultaneous paired readings,
 * r(q̄, r̄) = s(q̄, r̄) / (s(q̄)·s(r̄)) (JCGM 100:2008 §5.2.3, eq. (17)), which equals the sample
 * Pearson coefficient of the readings.
 *
 * @param a Readings of the first quantity.
 * @param b Simultaneous readings of the second quantity (same length).
 * @returns The correlation coefficient.
 * @throws {RangeError} For unequal lengths, fewer than 2 pairs or zero variance.
 *
 * @example
 * ```ts
 * import { correlationFromReadings } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(correlationFromReadings([1, 2, 3], [2, 4, 6]), 1);
 * ```
 */
export function correlationFromReadings(a: readonly number[], b: readonly number[]): number {
  if (a.length !== b.length || a.length < 2) {
    throw new RangeError(
      `Correlation from readings: expected two equal-length series of at least 2 readings, got ${a.length} and ${b.length}`,
    );
  }
  const n = a.length;
  const ma = a.reduce((s, x) => s + x, 0) / n;
  const mb = b.reduce((s, x) => s + x, 0) / n;
  let sab = 0, saa = 0, sbb = 0;
  for (let i = 0; i < n; i++) {
    const da = a[i]! - ma, db = b[i]! - mb;
    sab += da * db;
    saa += da * da;
    sbb += db * db;
  }
  if (!(saa > 0 && sbb > 0)) {
    throw new RangeError(
      `Correlation from readings: expected non-constant readings, got a variance of 0`,
    );
  }
  return sab / Math.sqrt(saa * sbb);
}
