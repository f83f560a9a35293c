/**
 * Table throughput: the same read → evaluate → write path on a 20-row clinic list (the demo
 * file) and on a synthetic 10^6-row registry extract (deterministic, invented values).
 * Run: npx -y deno@2.9.6 bench -A bench/table.bench.ts
 */
import {
  bsaHaycock,
  evaluateTable,
  indexedToBsa,
  LV_MASS,
  PHN_2017_MODELS,
  readTable,
  writeTableCsv,
  zScoreCalculation,
} from "../mod.ts";

const CALCULATIONS = [
  bsaHaycock,
  zScoreCalculation(PHN_2017_MODELS.lvEndDiastolicDimension),
  zScoreCalculation(PHN_2017_MODELS.lvMass),
  indexedToBsa(LV_MASS),
];

/** Invented registry rows from a fixed linear congruential stream (demo data only). */
export function syntheticRegistry(rows: number): string {
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

if (import.meta.main) {
  const clinic = await Deno.readTextFile(
    new URL("../examples/data/pediatric_clinic.csv", import.meta.url),
  );
  const registry = syntheticRegistry(1_000_000);
  const registryTable = readTable(registry, { population: "pediatric" });
  const registryResult = evaluateTable(registryTable, CALCULATIONS, { population: "pediatric" });

  Deno.bench("clinic list, 20 rows: read + evaluate + write", { group: "clinic" }, () => {
    writeTableCsv(evaluateTable(readTable(clinic, { population: "pediatric" }), CALCULATIONS));
  });

  Deno.bench("registry, 10^6 rows: read CSV", { group: "registry", n: 3, warmup: 1 }, () => {
    readTable(registry, { population: "pediatric" });
  });

  Deno.bench("registry, 10^6 rows: BSA, 2 Z-scores, LV mass index", {
    group: "registry",
    n: 5,
    warmup: 1,
  }, () => {
    evaluateTable(registryTable, CALCULATIONS, { population: "pediatric" });
  });

  Deno.bench("registry, 10^6 rows: write CSV with flags", {
    group: "registry",
    n: 3,
    warmup: 1,
  }, () => {
    writeTableCsv(registryResult);
  });
}
