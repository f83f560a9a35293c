/**
 * One chart of each function of each plot module, each asked to mark invented data: shared by the
 * chart tests (footnotes, labels).
 *
 * @module
 */
import {
  AORTIC_STENOSIS_2017,
  blandAltman,
  bsaHaycock,
  continuityValveArea,
  demingRegression,
  EJECTION_FRACTION,
  evaluateTable,
  gradeSeverity,
  methodValidation,
  normal,
  PHN_2017_MODELS,
  propagate,
  readTable,
  sensitivityCurve,
  singlePlaneDiscVolume,
  validationReadOptions,
} from "../../mod.ts";
import {
  adultLimitChart,
  angleUnderestimationChart,
  blandAltmanChart,
  budgetChart,
  type Chart,
  discMethodChart,
  histogramChart,
  methodComparisonChart,
  methodValidationChart,
  nyquistDepthChart,
  observerChart,
  resolutionPenetrationChart,
  sensitivityChart,
  severityProbabilityChart,
  tableZScoreChart,
  valveAreaDiameterErrorChart,
  zScoreChart,
} from "../../plot/mod.ts";

const AVA_INPUTS = {
  lvotDiameterCm: normal(2.0, 0.05),
  lvotVtiCm: normal(20, 1),
  avVtiCm: normal(80, 3),
};

/** One chart of each function of each plot module, each asked to mark invented data. */
export async function everyChart(): Promise<[string, Chart][]> {
  const f = { inventedData: true } as const;
  const ba = blandAltman([60, 52, 41, 66, 58], [58, 52, 44, 63, 59], {
    quantity: EJECTION_FRACTION,
    methodNames: ["auto", "manual"],
  });
  const x = [40, 52, 61, 35, 58];
  const y = [42, 51, 63, 36, 57];
  const { slope, intercept } = demingRegression(x, y);
  const report = methodValidation(
    readTable(await Deno.readFile("examples/data/validation_demo.csv"), {
      source: "validation_demo.csv",
      ...validationReadOptions(),
    }),
  );
  const mc = propagate(continuityValveArea, AVA_INPUTS, {
    method: "monteCarlo",
    trials: 2000,
    seed: 3,
  });
  const gum = propagate(continuityValveArea, AVA_INPUTS);
  const table = evaluateTable(
    readTable("id,height [cm],weight [kg],aortic root [cm]\nA,120,22,2.0\nB,150,40,2.5\n"),
    bsaHaycock,
  );
  return [
    // plot/agreement.ts
    ["blandAltmanChart", blandAltmanChart(ba, f)],
    [
      "methodComparisonChart",
      methodComparisonChart(x, y, [{ name: "Deming", slope, intercept }], f),
    ],
    ["observerChart", observerChart([{ subject: "P1", observer: "A", value: 50 }], f)],
    ["methodValidationChart", methodValidationChart(report, report.figures[0]!, f)],
    // plot/doppler.ts
    ["angleUnderestimationChart", angleUnderestimationChart({ maxAngleDeg: 40, ...f })],
    ["valveAreaDiameterErrorChart", valveAreaDiameterErrorChart(f)],
    [
      "severityProbabilityChart",
      severityProbabilityChart(gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 1.2]), f),
    ],
    // plot/physics.ts
    ["nyquistDepthChart", nyquistDepthChart({ transmitFrequenciesMHz: [2, 4], ...f })],
    ["resolutionPenetrationChart", resolutionPenetrationChart({ steps: 8, ...f })],
    // plot/reference.ts
    ["zScoreChart", zScoreChart(PHN_2017_MODELS.aorticRootSinus, f)],
    ["tableZScoreChart", tableZScoreChart(table, PHN_2017_MODELS.aorticRootSinus, f)],
    ["adultLimitChart", adultLimitChart("lvEjectionFraction", f)],
    // plot/uncertainty.ts
    ["histogramChart", histogramChart(mc, { gum, ...f })],
    ["budgetChart", budgetChart(gum, f)],
    [
      "sensitivityChart",
      sensitivityChart([
        sensitivityCurve(continuityValveArea, { lvotDiameterCm: 2, lvotVtiCm: 20, avVtiCm: 80 }, {
          vary: "lvotDiameterCm",
          from: 1.8,
          to: 2.2,
        }),
      ], f),
    ],
    // plot/chamber.ts
    [
      "discMethodChart",
      discMethodChart(singlePlaneDiscVolume([[-2, 0], [-2.2, 4], [0, 8], [2.2, 4], [2, 0]]), f),
    ],
  ];
}
