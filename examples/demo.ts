/**
 * The bundled demo: the main job on invented data, end to end.
 *
 * Scenario (invented): a valve clinic re-reads one patient's aortic stenosis study. The LVOT was
 * measured with a caliper uncertainty, the VTIs were averaged over five beats, and the sonographer
 * could not be sure the continuous-wave beam was parallel to the jet. The demo prints the GUM
 * budget, where the first-order law stops being honest (the beam angle), the Monte Carlo answer
 * and the probability of each severity class on one screen; writes the charts to out/demo/; then
 * executes every notebook on the real Deno kernel and writes their HTML reports to
 * out/demo/notebooks/.
 *
 * Run: `deno task demo` (or `npx -y deno@2.9.6 task demo`). Optional argument: the output folder.
 *
 * @module
 */
import {
  AORTIC_STENOSIS_2017,
  continuityValveArea,
  continuityValveAreaWithAngles,
  formatGumOutput,
  gradeSeverity,
  gum,
  monteCarlo,
  normal,
  rectangular,
  sensitivityCurve,
  typeA,
  validateGumWithMonteCarlo,
} from "../mod.ts";
import { budgetChart, histogramChart, sensitivityChart } from "../plot/mod.ts";
import { findNotebooks, runNotebook } from "@sonorigor/notebook-runner";

const outDir = Deno.args[0] ?? "out/demo";
await Deno.mkdir(outDir, { recursive: true });
const say = (text = "") => console.log(text);
const pct = (x: number) => `${(100 * x).toFixed(1)} %`;

say("sonorigor demo: continuity aortic valve area with honest error bars (invented patient)");
say("Not a diagnosis: verify against local guidelines and licensed clinical practice.");
say();

// 1. The measurements with their uncertainties, through the GUM law.
const inputs = {
  lvotDiameterCm: normal("21 mm", "0.8 mm"), // caliper repeatability
  lvotVtiCm: typeA([20.1, 21.4, 19.8, 20.9, 21.0]), // five beats
  avVtiCm: typeA([88, 94, 91, 97, 90]),
};
const g = gum(continuityValveArea, inputs);
const ava = g.outputs.avaCm2;
const shares = [...ava.budget].sort((a, b) => b.share - a.share)
  .map((b) => `${b.input} ${pct(b.share)}`).join(", ");
say("1. GUM law of propagation (JCGM 100:2008)");
say(`   ${formatGumOutput(ava, g.coverage)}`);
say(`   budget, share of u²: ${shares}`);

// 2. Monte Carlo on the same definition, and the JCGM 101 §8 check of the GUM interval.
const m = monteCarlo(continuityValveArea, inputs, { seed: 2026 });
const mo = m.outputs.avaCm2;
const [verdict] = validateGumWithMonteCarlo(g, m, 2);
say(`2. Monte Carlo (JCGM 101:2008), ${m.trials} trials, seed ${m.seed}`);
say(
  `   AVA = ${mo.estimate.toFixed(3)} cm², u = ${mo.standardUncertainty.toFixed(3)} cm², ` +
    `95 % interval [${mo.symmetricInterval[0].toFixed(3)}, ${
      mo.symmetricInterval[1].toFixed(3)
    }] cm²`,
);
say(
  `   ${
    verdict!.validated
      ? "GUM interval validated"
      : "GUM interval not validated: report the Monte Carlo interval"
  } ` +
    `(JCGM 101 §8, δ = ${verdict!.tolerance})`,
);

// 3. An uncertain beam angle: the first-order law fails at 0°, Monte Carlo does not.
const angleInputs = {
  lvotDiameterCm: normal(2.1, 0.08),
  lvotPeakVelocity: normal(1.0, 0.05),
  lvotAngleDeg: 0,
  avPeakVelocity: normal(4.1, 0.1),
  avAngleDeg: rectangular(-20, 20), // the beam somewhere within ±20° of the jet
};
const ga = gum(continuityValveAreaWithAngles, angleInputs);
const ma = monteCarlo(continuityValveAreaWithAngles, angleInputs, { seed: 2027 });
const mao = ma.outputs.avaCm2;
say("3. Beam angle uncertain within ±20° (peak-velocity form)");
say(`   GUM: ${formatGumOutput(ga.outputs.avaCm2, ga.coverage)}`);
if (ga.warnings.some((w) => /inadequate for 'avaCm2'/.test(w))) {
  say("   the GUM result warns: first-order propagation is inadequate for the beam angle");
  say("   (its sensitivity vanishes at 0°), so that interval is biased and too narrow");
}
say(
  `   Monte Carlo: AVA = ${mao.estimate.toFixed(3)} cm², shortest 95 % interval ` +
    `[${mao.shortestInterval[0].toFixed(3)}, ${mao.shortestInterval[1].toFixed(3)}] cm²`,
);

// 4. Probability of each severity class (2017 table) from the Monte Carlo samples.
const grade = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, ma.outputs.avaCm2);
say("4. Aortic stenosis class by valve area (Baumgartner et al. 2017), from the samples");
say(
  `   ${
    grade.probabilities.map((p) => `${p.grade} (${p.printed}) ${pct(p.probability)}`).join(", ")
  }`,
);

// 5. Charts.
const files: [string, { writeSVG(path: string): Promise<void> }][] = [
  ["ava-histogram.svg", histogramChart(m, { gum: g })],
  ["ava-budget.svg", budgetChart(g)],
  ["ava-angle-histogram.svg", histogramChart(ma, { gum: ga })],
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
      { relative: true, title: "Valve-area error vs LVOT diameter (reference 2.1 cm)" },
    ),
  ],
];
for (const [name, chart] of files) await chart.writeSVG(`${outDir}/${name}`);
say(`5. Charts: ${files.map(([n]) => `${outDir}/${n}`).join(", ")}`);

// 6. The notebooks, executed on the real Deno kernel and exported to self-contained HTML.
const notebookDir = `${outDir}/notebooks`;
const notebooks = await findNotebooks(["notebooks", "examples"]);
say(
  `6. ${notebooks.length} notebooks executed on the Deno kernel, HTML reports in ${notebookDir}/`,
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
