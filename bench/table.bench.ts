/**
 * Cohort throughput: the same read → compute → write path on a 20-row clinic list (the demo
 * file) and on a synthetic 10^6-row registry extract (deterministic, invented values).
 * Run: npx -y deno@2.9.6 bench -A bench/cohort.bench.ts
 */
import { cohortToCsv, computeCohort, PHN_2017_MODELS, readCohortCsv } from "../mod.ts";

const LVEDD = PHN_2017_MODELS.lvEndDiastolicDimension;
const MASS = PHN_2017_MODELS.lvMass;
const OPTIONS = {
  id: "patient",
  height: "height",
  weight: "weight",
  measurements: [
    { column: "lvedd", canonicalUnit: LVEDD.unit, range: LVEDD.measurementRange },
    { column: "lv mass", name: "lvMass", canonicalUnit: MASS.unit, range: MASS.measurementRange },
  ],
} as const;
const COMPUTE = {
  bsaMethod: "haycock",
  index: ["lvMass"],
  zScores: { lvedd: LVEDD, lvMass: MASS },
} as const;

/** Invented registry rows from a fixed linear congruential stream (demo data only). */
function syntheticRegistry(rows: number): string {
  let state = 12345;
  const next = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32;
  const lines = ["patient,height [cm],weight [kg],lvedd [mm],lv mass [g]"];
  for (let i = 0; i < rows; i++) {
    const h = 50 + 140 * next();
    const w = Math.max(3, 0.0000165 * h ** 2.9 * (0.85 + 0.3 * next()));
    const lvedd = 20 + 0.17 * h * (0.9 + 0.2 * next());
    const mass = i % 50 === 0 ? "" : (0.0011 * h ** 2.2 * (0.8 + 0.4 * next())).toFixed(1);
    lines.push(`R${i},${h.toFixed(1)},${w.toFixed(1)},${lvedd.toFixed(1)},${mass}`);
  }
  return lines.join("\n") + "\n";
}

const clinic = await Deno.readTextFile(
  new URL("../examples/data/pediatric_clinic.csv", import.meta.url),
);
const registry = syntheticRegistry(1_000_000);
const registryTable = readCohortCsv(registry, OPTIONS);
const registryResult = computeCohort(registryTable, COMPUTE);

Deno.bench("clinic list, 20 rows: read + compute + write", { group: "clinic" }, () => {
  cohortToCsv(computeCohort(readCohortCsv(clinic, { ...OPTIONS, sex: "sex" }), COMPUTE));
});

Deno.bench("registry, 10^6 rows: read CSV (papaparse + zod cell checks)", {
  group: "registry",
  n: 3,
  warmup: 1,
}, () => {
  readCohortCsv(registry, OPTIONS);
});

Deno.bench("registry, 10^6 rows: compute BSA, index, 2 Z-scores (columnar)", {
  group: "registry",
  n: 5,
  warmup: 1,
}, () => {
  computeCohort(registryTable, COMPUTE);
});

Deno.bench(
  "registry, 10^6 rows: write CSV with flags",
  { group: "registry", n: 3, warmup: 1 },
  () => {
    cohortToCsv(registryResult);
  },
);
