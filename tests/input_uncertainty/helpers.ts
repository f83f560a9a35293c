/**
 * Helpers shared by the tests of the uncertainty models.
 *
 * @module
 */
import assert from "node:assert/strict";
import { JUPYTER_DISPLAY } from "../../mod.ts";

export { close } from "../close.ts";

/** The plain-text notebook display of a result. */
export function shownText(result: object): string {
  const shown = result as { [JUPYTER_DISPLAY]?: () => Record<string, unknown> };
  assert.equal(typeof shown[JUPYTER_DISPLAY], "function", "the result displays itself");
  return String(shown[JUPYTER_DISPLAY]!()["text/plain"]);
}

/** ∫ₐᵇ f by the composite Simpson rule with n (even) intervals: an independent numerical check
 * of closed forms. */
export function simpson(f: (x: number) => number, a: number, b: number, n = 2000): number {
  const h = (b - a) / n;
  let s = f(a) + f(b);
  for (let i = 1; i < n; i++) s += (i % 2 === 1 ? 4 : 2) * f(a + i * h);
  return (s * h) / 3;
}
