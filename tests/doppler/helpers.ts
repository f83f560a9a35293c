/**
 * Helpers shared by the Doppler tests.
 *
 * @module
 */
import assert from "node:assert/strict";

/** Asserts |actual − expected| ≤ tol, naming what was checked. */
export function close(actual: number, expected: number, tol: number, what = ""): void {
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what} expected ${expected} ± ${tol}, got ${actual}`,
  );
}

/** Radians per degree. */
export const DEG = Math.PI / 180;
