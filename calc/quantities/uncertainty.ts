/**
 * Quantities of the models of where measurement uncertainty comes from: the speed-of-sound scale
 * factor, the BSA formula factor, the display's pixel rows, a caliper's boundary placement
 * uncertainty, a traced perimeter, and relative uncertainties and error limits.
 *
 * Valid ranges are what the definitions allow; typical ranges are those of adult
 * echocardiography. Both are common practice, no source, unless a range says otherwise.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

const NOTE = "common practice, no source";

/**
 * The true speed of sound over the 1540 m/s the scanner assumes, s = c_true/c₀: every displayed
 * distance and velocity is low by the factor s, every area by s², every volume by s³.
 *
 * @example Blood at 1560 m/s: distances are 1.3 % longer than displayed
 * ```ts
 * import { checkValue, quantityField, SOUND_SPEED_SCALE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = checkValue("s", quantityField(SOUND_SPEED_SCALE), 1560 / 1540, { where: "Demo" });
 * assert.equal(r.issues.length, 0); // 1.013 lies in the typical range
 * assert.equal(checkValue("s", quantityField(SOUND_SPEED_SCALE), 0, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const SOUND_SPEED_SCALE: Quantity = defineQuantity({
  id: "soundSpeedScale",
  label: "Speed-of-sound scale factor",
  symbol: "s",
  unit: "1",
  description:
    "True speed of sound over the speed the scanner assumes (1540 m/s): displayed distances and velocities are multiplied by s, areas by s², volumes by s³",
  // soft tissues lie within about ±7 % of 1540 m/s; bone reaches 2.6
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.9, max: 1.1 },
  resolution: 0.0001,
  rangeNote: NOTE,
});

/**
 * The true body surface area over the estimate of a height–weight formula.
 *
 * @example
 * ```ts
 * import { BSA_FORMULA_FACTOR, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("f", quantityField(BSA_FORMULA_FACTOR), 1.2, { where: "Demo" }).issues[0]!.kind, "typical");
 * ```
 */
export const BSA_FORMULA_FACTOR: Quantity = defineQuantity({
  id: "bsaFormulaFactor",
  label: "BSA formula factor",
  symbol: "f_BSA",
  unit: "1",
  description: "True body surface area over the estimate of a height–weight formula",
  valid: { min: 0, max: 2, minExclusive: true },
  typical: { min: 0.9, max: 1.1 },
  resolution: 0.001,
  rangeNote: NOTE,
});

/**
 * Number of display pixel rows over which the image depth is drawn.
 *
 * @example A fraction of a row is refused
 * ```ts
 * import { checkValue, IMAGE_ROWS, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("rows", quantityField(IMAGE_ROWS), 600, { where: "Demo" }).value, 600);
 * assert.equal(checkValue("rows", quantityField(IMAGE_ROWS), 600.5, { where: "Demo" }).value, undefined);
 * ```
 */
export const IMAGE_ROWS: Quantity = defineQuantity({
  id: "imageRows",
  label: "Image rows",
  symbol: "N_rows",
  unit: "1",
  description: "Number of display pixel rows over which the image depth is drawn",
  valid: { min: 1, max: 100000 },
  typical: { min: 200, max: 2500 },
  resolution: 1,
  integer: true,
  rangeNote: NOTE,
});

/**
 * Standard uncertainty of placing one caliper on one boundary (an edge of a wall, a vessel or a
 * cavity).
 *
 * @example
 * ```ts
 * import { BOUNDARY_PLACEMENT_UNCERTAINTY, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const f = quantityField(BOUNDARY_PLACEMENT_UNCERTAINTY);
 * assert.equal(checkValue("u", f, "0.03 cm", { where: "Demo" }).value, 0.3);
 * ```
 */
export const BOUNDARY_PLACEMENT_UNCERTAINTY: Quantity = defineQuantity({
  id: "boundaryPlacementUncertainty",
  label: "Boundary placement uncertainty",
  symbol: "u_b",
  unit: "mm",
  description: "Standard uncertainty of placing one caliper on one boundary",
  valid: { min: 0, max: 20 },
  typical: { min: 0, max: 2 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Perimeter of a contour traced on the image (a cavity or an orifice).
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, TRACED_PERIMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("p", quantityField(TRACED_PERIMETER), "250 mm", { where: "Demo" }).value, 25);
 * ```
 */
export const TRACED_PERIMETER: Quantity = defineQuantity({
  id: "tracedPerimeter",
  label: "Traced perimeter",
  symbol: "P",
  unit: "cm",
  description: "Perimeter of a contour traced on the image",
  valid: { min: 0, max: 200, minExclusive: true },
  typical: { min: 2, max: 60 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * A standard uncertainty relative to the value, in percent.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, RELATIVE_STANDARD_UNCERTAINTY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const f = quantityField(RELATIVE_STANDARD_UNCERTAINTY);
 * assert.equal(checkValue("u", f, 100, { where: "Demo" }).issues[0]!.kind, "range");
 * ```
 */
export const RELATIVE_STANDARD_UNCERTAINTY: Quantity = defineQuantity({
  id: "relativeStandardUncertainty",
  label: "Relative standard uncertainty",
  symbol: "u_r",
  unit: "%",
  description: "Standard uncertainty as a percentage of the value",
  valid: { min: 0, max: 100, maxExclusive: true },
  typical: { min: 0, max: 20 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * The half-width of a relative error known only by its limits: the error lies anywhere within
 * ± this percentage of the value (a rectangular distribution).
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, RELATIVE_ERROR_LIMIT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("a", quantityField(RELATIVE_ERROR_LIMIT), 5, { where: "Demo" }).value, 5);
 * ```
 */
export const RELATIVE_ERROR_LIMIT: Quantity = defineQuantity({
  id: "relativeErrorLimit",
  label: "Relative error limit",
  symbol: "a_r",
  unit: "%",
  description: "Half-width of a relative error known only by its limits (± this percentage)",
  valid: { min: 0, max: 100, maxExclusive: true },
  typical: { min: 0, max: 25 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * The quantities of the uncertainty models, listed for the package's quantity lookup.
 *
 * @example
 * ```ts
 * import { QUANTITIES, UNCERTAINTY_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(UNCERTAINTY_QUANTITIES.every((q) => QUANTITIES.get(q.id) === q));
 * ```
 */
export const UNCERTAINTY_QUANTITIES: readonly Quantity[] = [
  SOUND_SPEED_SCALE,
  BSA_FORMULA_FACTOR,
  IMAGE_ROWS,
  BOUNDARY_PLACEMENT_UNCERTAINTY,
  TRACED_PERIMETER,
  RELATIVE_STANDARD_UNCERTAINTY,
  RELATIVE_ERROR_LIMIT,
];
