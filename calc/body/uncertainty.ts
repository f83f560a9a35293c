/**
 * Uncertainty of BSA from scale and stadiometer error, carried into indexed values with the GUM
 * law (JCGM 100:2008) through the one definitions of the BSA formulas and of indexing.
 *
 * @module
 */
import { gum, type GumOptions, type GumResult } from "../uncertainty/gum.ts";
import { type InputEstimate, normal, type NormalInput } from "../uncertainty/inputs.ts";
import { bsaCalculation, type BsaMethod } from "./bsa.ts";
import { bodySizeIndexCalculation } from "./indexing.ts";

/** Standard uncertainties of the body-size measurements. */
export interface BodySizeUncertainty {
  /** Standard uncertainty of height (stadiometer or length board), cm, ≥ 0. */
  readonly heightCm: number;
  /** Standard uncertainty of weight (scale), kg, ≥ 0. */
  readonly weightKg: number;
}

/**
 * Height and weight as normal uncertain inputs for a BSA or indexing calculation.
 *
 * @param heightCm Measured height, cm.
 * @param weightKg Measured weight, kg.
 * @param uncertainty Standard uncertainties (stadiometer, scale); choose them from the
 * instruments' calibration and reading resolution.
 * @returns `{ heightCm, weightKg }` as normal inputs.
 * @throws {RangeError} For a negative or non-finite standard uncertainty.
 *
 * @example
 * ```ts
 * import { bodySizeInputs } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = bodySizeInputs(180, 80, { heightCm: 1, weightKg: 0.5 });
 * assert.deepEqual(x.heightCm, { kind: "normal", value: 180, standardUncertainty: 1 });
 * ```
 */
export function bodySizeInputs(
  heightCm: number,
  weightKg: number,
  uncertainty: BodySizeUncertainty,
): { heightCm: NormalInput; weightKg: NormalInput } {
  for (const key of ["heightCm", "weightKg"] as const) {
    const u = uncertainty?.[key];
    if (!(typeof u === "number" && u >= 0 && Number.isFinite(u))) {
      throw new RangeError(
        `Body size uncertainty: expected standard uncertainty '${key}' >= 0 ${
          key === "heightCm" ? "cm" : "kg"
        }, got ${u}`,
      );
    }
  }
  return {
    heightCm: normal(heightCm, uncertainty.heightCm),
    weightKg: normal(weightKg, uncertainty.weightKg),
  };
}

/**
 * BSA with its GUM uncertainty from height and weight uncertainty.
 *
 * Formula: u_c²(BSA) = (∂BSA/∂H)²·u²(H) + (∂BSA/∂W)²·u²(W) (JCGM 100:2008 eq. (10)); for a
 * power law c·W^a·H^b this is (u_c/BSA)² = (a·u(W)/W)² + (b·u(H)/H)² (eq. (12)).
 *
 * Source: JCGM 100:2008 (GUM) §5.1; the BSA formula's own paper.
 *
 * @param heightCm Height, cm.
 * @param weightKg Weight, kg.
 * @param uncertainty Standard uncertainties of height and weight.
 * @param options BSA method (default "mosteller") and GUM options.
 * @returns The GUM result with output `bsaM2`.
 * @throws {RangeError} For height, weight or uncertainties outside their domains.
 *
 * @example
 * ```ts
 * import { bsaWithUncertainty } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Mosteller, 180 ± 1 cm, 80 ± 0.5 kg: u/BSA = ½·√((1/180)² + (0.5/80)²) = 0.004181
 * // (JCGM 100:2008 eq. (12), hand computation) → u = 0.00836 m²
 * const r = bsaWithUncertainty(180, 80, { heightCm: 1, weightKg: 0.5 });
 * assert.ok(Math.abs(r.outputs.bsaM2.standardUncertainty - 0.008362) < 1e-5);
 * ```
 */
export function bsaWithUncertainty(
  heightCm: number,
  weightKg: number,
  uncertainty: BodySizeUncertainty,
  options: GumOptions & { readonly method?: BsaMethod } = {},
): GumResult<"bsaM2"> {
  const { method = "mosteller", ...gumOptions } = options;
  return gum(bsaCalculation(method), bodySizeInputs(heightCm, weightKg, uncertainty), gumOptions);
}

/**
 * A measurement indexed to BSA with GUM uncertainty from the measurement and from height and
 * weight (through BSA).
 *
 * Formula: indexed = X / BSA(H, W); for a power-law BSA c·W^a·H^b,
 * (u/indexed)² = (u(X)/X)² + (a·u(W)/W)² + (b·u(H)/H)² (JCGM 100:2008 eq. (12)).
 *
 * @param inputs `measurement`, `heightCm`, `weightKg` as uncertain inputs (e.g. `normal(...)`)
 * or exact values.
 * @param options `unit` of the measurement (required), BSA `method` (default "mosteller") and
 * GUM options.
 * @returns The GUM result with outputs `bsaM2` and `indexed`.
 * @throws {TypeError} For a missing unit, unknown method or mistyped input.
 * @throws {RangeError} For values or uncertainties outside their domains.
 *
 * @example
 * ```ts
 * import { indexedWithUncertainty, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // LVEDV 120 ± 6 mL, 180 ± 1 cm, 80 ± 0.5 kg (Mosteller BSA 2 m²): indexed 60 mL/m²,
 * // u/60 = √(0.05² + 0.004181²) = 0.050175 → u = 3.0105 mL/m² (JCGM 100 eq. (12), by hand)
 * const r = indexedWithUncertainty(
 *   { measurement: normal(120, 6), heightCm: normal(180, 1), weightKg: normal(80, 0.5) },
 *   { unit: "mL" },
 * );
 * assert.ok(Math.abs(r.outputs.indexed.value - 60) < 1e-12);
 * assert.ok(Math.abs(r.outputs.indexed.standardUncertainty - 3.0105) < 1e-3);
 * ```
 */
export function indexedWithUncertainty(
  inputs: {
    readonly measurement: InputEstimate;
    readonly heightCm: InputEstimate;
    readonly weightKg: InputEstimate;
  },
  options: GumOptions & { readonly unit: string; readonly method?: BsaMethod },
): GumResult<"bsaM2" | "indexed"> {
  const { unit, method = "mosteller", ...gumOptions } = options ?? ({} as never);
  return gum(bodySizeIndexCalculation(unit, method), inputs, gumOptions);
}
