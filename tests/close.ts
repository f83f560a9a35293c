/**
 * The tolerance assertion shared by the tests of every domain.
 *
 * @module
 */
import assert from "node:assert/strict";

/** Asserts |actual − expected| ≤ tol, naming what is compared. */
export function close(actual: number, expected: number, tol: number, what = ""): void {
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what ? `${what}: ` : ""}expected ${expected} ± ${tol}, got ${actual}`,
  );
}
