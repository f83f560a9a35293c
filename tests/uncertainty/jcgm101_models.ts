/**
 * Models of the JCGM 101:2008 examples shared by the uncertainty tests.
 *
 * @module
 */
import { expressionModel } from "../../mod.ts";

const wide = { min: -1e6, max: 1e6 };

/** JCGM 101:2008 §9.4 comparison loss: δY = X₁² + X₂². */
export const comparisonLoss = expressionModel({
  expression: "x1^2 + x2^2",
  inputs: {
    x1: { unit: "1", description: "real part of the reflection coefficient", range: wide },
    x2: { unit: "1", description: "imaginary part of the reflection coefficient", range: wide },
  },
  output: { name: "dY", unit: "1", description: "comparison loss correction" },
});
