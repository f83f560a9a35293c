/**
 * Helpers of the physics tests.
 *
 * @module
 */
import assert from "node:assert/strict";

/** Asserts |actual − expected| ≤ tol, naming what was compared. */
export function close(actual: number, expected: number, tol: number, what: string): void {
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );
}
