import assert from "node:assert/strict";
import { close } from "../close.ts";
import { concordanceCorrelation } from "../../calc/agreement/mod.ts";
import { MINI1, WRIGHT1 } from "./data.ts";

Deno.test("Lin's concordance correlation matches R epiR on the peak-flow data", () => {
  const r = concordanceCorrelation(WRIGHT1, MINI1);
  // R 4.2.2, epiR 2.0.57: epi.ccc(wright1, mini1, ci = "z-transform")$rho.c:
  // est 0.942742431427, lower 0.850491873169, upper 0.97872627917
  close(r.value, 0.942742431427, 1e-11, "rho_c");
  close(r.ci.lower, 0.850491873169, 1e-11, "lower");
  close(r.ci.upper, 0.97872627917, 1e-10, "upper");
  // same call: s.shift 0.972509121336 (epiR reports s_y/s_x... as 1/scaleShift), l.shift 0.0190302500916,
  // C.b 0.999430693136
  close(1 / r.scaleShift, 0.972509121336, 1e-11, "scale shift");
  close(Math.abs(r.locationShift), 0.0190302500916, 1e-12, "location shift");
  close(r.biasCorrectionFactor, 0.999430693136, 1e-11, "C_b");
});

Deno.test("concordance rejects constant series and tiny samples", () => {
  assert.throws(() => concordanceCorrelation([1, 1, 1], [1, 2, 3]), {
    name: "RangeError",
    message: /expected 'x' values that vary, got variance 0$/,
  });
  assert.throws(() => concordanceCorrelation([1, 2], [1, 2]), {
    name: "RangeError",
    message: /^Concordance correlation: expected 'x' with at least 3 values, got 2$/,
  });
});
