/**
 * Benchmark models shared by the `deno bench` files and the side-by-side numpy comparison.
 * Every model is composed from the library's own definitions; no formula is restated.
 *
 * @module
 */
import {
  angleCorrectedVelocity,
  type Calculation,
  continuityValveArea,
  defineCalculation,
  normal,
  randomStream,
  readTable,
  rectangular,
  type Table,
  type UncertainInputs,
  type UncertaintyModel,
} from "../mod.ts";

/** Continuity valve area (VTI form) with the aortic-jet VTI corrected for an uncertain CW beam
 * angle: the 4-input model of the performance issue. */
export const continuityWithJetAngle: Calculation<
  "lvotDiameterCm" | "lvotVtiCm" | "avVtiCm" | "avAngleDeg",
  "avaCm2"
> = defineCalculation({
  id: "benchContinuityWithJetAngle",
  title: "Continuity valve area with jet angle (benchmark)",
  description: "continuity VTI form with the aortic VTI corrected for the beam angle",
  inputs: {
    lvotDiameterCm: continuityValveArea.inputs.lvotDiameterCm,
    lvotVtiCm: continuityValveArea.inputs.lvotVtiCm,
    avVtiCm: continuityValveArea.inputs.avVtiCm,
    avAngleDeg: { unit: "deg", description: "beam angle", range: { min: -89, max: 89 } },
  },
  outputs: { avaCm2: continuityValveArea.outputs.avaCm2 },
  formula: ({ lvotDiameterCm, lvotVtiCm, avVtiCm, avAngleDeg }) =>
    continuityValveArea.formula({
      lvotDiameterCm,
      lvotVtiCm,
      avVtiCm: angleCorrectedVelocity.formula({ measuredVelocity: avVtiCm, angleDeg: avAngleDeg })
        .trueVelocity,
    }),
  formulaText: "AVA = π·d²/4 · VTI_LVOT / (VTI_AV / cos θ)",
  citations: continuityValveArea.citations,
  cautions: [],
});

/** Inputs of {@linkcode continuityWithJetAngle} (the same in bench/peer_numpy.py). */
export const continuityInputs: UncertainInputs<
  "lvotDiameterCm" | "lvotVtiCm" | "avVtiCm" | "avAngleDeg"
> = {
  lvotDiameterCm: normal(2.1, 0.08),
  lvotVtiCm: normal(21, 1.5),
  avVtiCm: normal(95, 4),
  avAngleDeg: rectangular(-15, 15),
};

const names = ["a", "b", "c", "d", "e", "f", "g", "h", "i", "j"] as const;
type Ten = (typeof names)[number];

/** A smooth nonlinear model of ten inputs for timing the GUM law. */
export const tenInputModel: Calculation<Ten, "y"> = defineCalculation({
  id: "benchTenInputs",
  title: "Ten-input model (benchmark)",
  description: "a smooth nonlinear model of ten inputs",
  inputs: Object.fromEntries(
    names.map((n) => [n, { unit: "1", description: n, range: { min: -1e3, max: 1e3 } }]),
  ) as Calculation<Ten, "y">["inputs"],
  outputs: { y: { unit: "1", description: "y" } },
  formula: (x) => ({
    y: x.a * x.b + x.c / x.d + Math.sqrt(x.e * x.e + x.f * x.f) + x.g * Math.cos(x.h / 10) +
      x.i ** 2 - x.j,
  }),
  formulaText: "y = ab + c/d + √(e² + f²) + g·cos(h/10) + i² − j",
  citations: [{ authors: "benchmark", year: 2026, title: "synthetic model", publication: "bench" }],
  cautions: [],
});

/** Inputs of {@linkcode tenInputModel}. */
export const tenUncertain: UncertainInputs<Ten> = Object.fromEntries(
  names.map((n, i) => [n, normal(1 + i, 0.01 * (1 + i))]),
) as UncertainInputs<Ten>;

/** The 3-input calculation of the per-row GUM benchmark: the catalog's continuity valve area. */
export const threeInputCalculation: typeof continuityValveArea = continuityValveArea;

/** Uncertainty of the three input columns of {@linkcode gumRowsTable}. */
export const gumRowsUncertainty: Readonly<Record<string, UncertaintyModel>> = {
  lvotDiameter: { standardUncertainty: "0.8 mm" },
  lvotVti: { relative: 0.06 },
  avVti: { relative: 0.05 },
};

/** A table of `rows` invented rows (LVOT diameter, LVOT VTI, aortic VTI), the same for the same
 * number of rows: the input of the per-row GUM benchmark. */
export function gumRowsTable(rows: number): Table {
  const rng = randomStream(2718);
  const lines = ["lvot diameter [mm],lvot vti [cm],av vti [cm]"];
  for (let i = 0; i < rows; i++) {
    lines.push(
      `${(17 + 8 * rng.uniform()).toFixed(1)},${(15 + 10 * rng.uniform()).toFixed(1)},${
        (40 + 80 * rng.uniform()).toFixed(1)
      }`,
    );
  }
  return readTable(lines.join("\n") + "\n");
}
