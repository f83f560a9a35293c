/**
 * The bundled demo: the main job on invented data, end to end.
 *
 * Scenario (invented): three clinics send their lists. The valve clinic wants every patient's
 * continuity valve area with an honest interval and severity class; one borderline patient is
 * looked into (budget, Monte Carlo, probability of each class, an uncertain beam angle). The
 * pediatric clinic wants BSA and Z-scores for every child; the adult clinic wants LVEF and LA
 * volume index against the adult limits by sex. Every table goes through the same pipeline
 * (read → evaluate with uncertainty → grade → write), the charts go to out/demo/, and every
 * notebook is executed on the real Deno kernel into out/demo/notebooks/.
 *
 * Run: `deno task demo` (or `npx -y deno@2.9.6 task demo`). Optional argument: the output folder.
 *
 * @module
 */
import {
  adultSeverityBySex,
  AORTIC_STENOSIS_2017,
  bsaHaycock,
  CLINICAL_CAUTION,
  continuityValveArea,
  continuityValveAreaWithAngles,
  displayTable,
  evaluateTable,
  formatShare,
  formatUncertainValue,
  gradeSeverity,
  gradeTable,
  normal,
  PHN_2017_MODELS,
  propagate,
  propagateRow,
  readTable,
  rectangular,
  rowLabels,
  selectColumns,
  sensitivityCurve,
  type Table,
  validateGumWithMonteCarlo,
  writeTableCsv,
  zScoreCalculation,
} from "../mod.ts";
import {
  adultLimitChart,
  budgetChart,
  histogramChart,
  sensitivityChart,
  severityProbabilityChart,
  tableZScoreChart,
} from "../plot/mod.ts";
import { findNotebooks, runNotebook } from "@sonorigor/notebook-runner";

const outDir = Deno.args[0] ?? "out/demo";
await Deno.mkdir(outDir, { recursive: true });
const say = (text = "") => console.log(text);
const data = (name: string) => new URL(`./data/${name}`, import.meta.url);
const show = (table: Table) => String(displayTable(table)["text/plain"]);
const save = async (name: string, table: Table) => {
  await Deno.writeTextFile(`${outDir}/${name}`, writeTableCsv(table));
  return `${outDir}/${name}`;
};

say(
  "sonorigor demo: three invented clinic lists through one table pipeline, with honest error bars",
);
say(CLINICAL_CAUTION);
say();

// 1. The valve clinic: continuity valve area of every patient, GUM per row, and its class.
const valves = readTable(await Deno.readFile(data("valve_clinic.csv")), {
  source: "valve_clinic.csv",
});
const uncertainty = {
  lvotDiameter: { standardUncertainty: "0.8 mm" }, // caliper repeatability
  lvotVti: { relative: 0.06 }, // beat-to-beat variation of the averaged VTI
  aorticVti: { relative: 0.05 },
};
const areas = gradeTable(
  evaluateTable(valves, continuityValveArea, { uncertainty }),
  "aorticValveArea",
  AORTIC_STENOSIS_2017.valveArea,
);
say("1. Valve clinic: continuity valve area (GUM law per row) and aortic stenosis class");
say(
  show(selectColumns(areas, [
    "patient",
    "aorticValveArea",
    "aorticValveArea u",
    "aorticValveArea lower",
    "aorticValveArea upper",
    "aorticValveArea class",
  ])),
);
say(`   written to ${await save("valve_clinic_areas.csv", areas)}`);
say();

// 2. The most borderline patient: budget, Monte Carlo, JCGM 101 §8 check, class probabilities.
const monteCarlo = { uncertainty, method: "monteCarlo", trials: 200_000, seed: 2026 } as const;
const labels = rowLabels(valves);
const graded = labels.map((patient, row) => {
  const mc = propagateRow(valves, continuityValveArea, row, monteCarlo);
  return {
    patient,
    row,
    mc,
    grade: gradeSeverity(AORTIC_STENOSIS_2017.valveArea, mc.outputs.avaCm2),
  };
});
const likeliest = (g: (typeof graded)[number]) =>
  g.grade.probabilities.reduce((m, p) => Math.max(m, p.probability), 0);
const borderline = graded.reduce((a, b) => (likeliest(a) <= likeliest(b) ? a : b));
const gum = propagateRow(valves, continuityValveArea, borderline.row, { uncertainty });
const ava = gum.outputs.avaCm2;
const [verdict] = validateGumWithMonteCarlo(gum, borderline.mc, 2);
say(`2. The most borderline patient, ${borderline.patient}`);
say(`   GUM: ${formatUncertainValue(ava)}`);
say(
  `   budget, share of u²: ${
    [...ava.budget].sort((a, b) => b.share - a.share)
      .map((b) => `${b.label} ${formatShare(b.share)}`).join(", ")
  }`,
);
say(
  `   Monte Carlo (${borderline.mc.monteCarlo!.trials} trials, seed ${
    borderline.mc.monteCarlo!.seed
  }): ${formatUncertainValue(borderline.mc.outputs.avaCm2)}`,
);
say(`   ${verdict!.verdict}`);
say(
  `   class probabilities (${AORTIC_STENOSIS_2017.valveArea.title}): ${
    borderline.grade.probabilities
      .map((p) => `${p.grade} (${p.printed}) ${formatShare(p.probability)}`).join(", ")
  }`,
);
for (const c of borderline.grade.cautions) say(`   caution: ${c}`);
say();

// 3. An uncertain beam angle: the first-order law fails at 0°, Monte Carlo does not.
const angleInputs = {
  lvotDiameterCm: normal(2.1, 0.08),
  lvotPeakVelocity: normal(1.0, 0.05),
  lvotAngleDeg: 0,
  avPeakVelocity: normal(4.1, 0.1),
  avAngleDeg: rectangular(-20, 20), // the beam somewhere within ±20° of the jet
};
const angleGum = propagate(continuityValveAreaWithAngles, angleInputs);
const angleMc = propagate(continuityValveAreaWithAngles, angleInputs, {
  method: "monteCarlo",
  seed: 2027,
  interval: "shortest",
});
say("3. Beam angle uncertain within ±20° of the jet (peak-velocity form)");
say(`   GUM: ${formatUncertainValue(angleGum.outputs.avaCm2)}`);
for (const w of angleGum.warnings) say(`   warning: ${w}`);
say(`   Monte Carlo: ${formatUncertainValue(angleMc.outputs.avaCm2)}`);
say();

// 4. The pediatric clinic: BSA and PHN Z-scores for every child.
const children = readTable(await Deno.readFile(data("pediatric_clinic.csv")), {
  source: "pediatric_clinic.csv",
  population: "pediatric",
});
const models = [PHN_2017_MODELS.lvEndDiastolicDimension, PHN_2017_MODELS.aorticRootSinus];
const zColumns = models.map((m) => `zScore.${m.id}`);
const zScores = evaluateTable(children, [bsaHaycock, ...models.map(zScoreCalculation)], {
  population: "pediatric",
});
say("4. Pediatric clinic: BSA (Haycock) and Z-scores (PHN 2017)");
say(show(selectColumns(zScores, ["patient", "bsa", ...zColumns])));
say(`   written to ${await save("pediatric_clinic_z_scores.csv", zScores)}`);
say();

// 5. The adult clinic: LVEF and LA volume index against the adult limits, by sex.
const adults = readTable(await Deno.readFile(data("adult_clinic.csv")), {
  source: "adult_clinic.csv",
});
const adultClasses = gradeTable(
  gradeTable(adults, "ejectionFraction", adultSeverityBySex("lvEjectionFraction")),
  "laVolumeIndex",
  adultSeverityBySex("laVolumeIndex"),
);
say("5. Adult clinic: LVEF and LA volume index classes by sex (Lang 2015 limits)");
say(show(adultClasses));
say(`   written to ${await save("adult_clinic_classes.csv", adultClasses)}`);
say();

// 6. Charts, each marked as drawing invented data (the mark stays in the exported SVG).
const INVENTED = { inventedData: true } as const;
const files: [string, { writeSVG(path: string): Promise<void> }][] = [
  ["ava-histogram.svg", histogramChart(borderline.mc, { gum, ...INVENTED })],
  ["ava-budget.svg", budgetChart(gum, INVENTED)],
  ["ava-classes.svg", severityProbabilityChart(borderline.grade, INVENTED)],
  ["ava-angle-histogram.svg", histogramChart(angleMc, { gum: angleGum, ...INVENTED })],
  [
    "ava-vs-lvot-diameter.svg",
    sensitivityChart(
      [sensitivityCurve(
        continuityValveArea,
        { lvotDiameterCm: 2.1, lvotVtiCm: 20.6, avVtiCm: 92 },
        {
          vary: "lvotDiameterCm",
          from: 1.8,
          to: 2.4,
        },
      )],
      {
        relative: true,
        title: "Valve-area error vs LVOT diameter (reference 2.1 cm)",
        ...INVENTED,
      },
    ),
  ],
  [
    "pediatric-aortic-root.svg",
    tableZScoreChart(zScores, PHN_2017_MODELS.aorticRootSinus, INVENTED),
  ],
  [
    "adult-lvef.svg",
    adultLimitChart("lvEjectionFraction", {
      points: rowLabels(adults).map((label, i) => ({
        label,
        sex: (adults.columns.get("sex")!.values[i] === "F" ? "female" : "male") as
          | "female"
          | "male",
        value: adults.columns.get("ejectionFraction")!.values[i] as number,
      })),
      ...INVENTED,
    }),
  ],
];
for (const [name, chart] of files) await chart.writeSVG(`${outDir}/${name}`);
say(`6. Charts: ${files.map(([n]) => `${outDir}/${n}`).join(", ")}`);

// 7. The notebooks, executed on the real Deno kernel and exported to self-contained HTML.
const notebookDir = `${outDir}/notebooks`;
const notebooks = await findNotebooks(["notebooks", "examples"]);
say(
  `7. ${notebooks.length} notebooks executed on the Deno kernel, HTML reports in ${notebookDir}/`,
);
let failures = 0;
for (const path of notebooks) {
  const r = await runNotebook(path, { outDir: notebookDir, html: true, log: () => {} });
  if (r.status !== "ok") failures++;
  say(
    `   ${r.status === "ok" ? "ok" : r.status.toUpperCase()}  ${path}  ` +
      `(${r.cellsExecuted}/${r.codeCells} cells, ${(r.elapsedMs / 1000).toFixed(1)} s)`,
  );
  if (r.status !== "ok" && r.message) say(`      ${r.message}`);
}
say();
say(
  `Done. Reports are in ${outDir}/ (open ${notebookDir}/*.html in a browser; no network needed).`,
);
if (failures > 0) Deno.exit(1);
