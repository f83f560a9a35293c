/**
 * What the engine's own power, logarithm and exponential cost per call over 10⁶ values: the floor
 * under any formula with powers evaluated row by row (the cohort of bench/compare_numpy.ts, case
 * (c)), and whether a product of powers is cheaper in log space: one power against one logarithm
 * and, per product, one exponential more (bench/analysis.md).
 * Run: npx -y deno@2.9.6 bench -A bench/built_in_math.bench.ts
 */
const n = 1_000_000;
let state = 777;
const next = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32;
const weight = Float64Array.from({ length: n }, () => 3 + 80 * next());
const out = new Float64Array(n);

Deno.bench("x ** 0.5378, 10⁶ values", { group: "one call per value", baseline: true }, () => {
  for (let i = 0; i < n; i++) out[i] = weight[i]! ** 0.5378;
});
Deno.bench("Math.log(x), 10⁶ values", { group: "one call per value" }, () => {
  for (let i = 0; i < n; i++) out[i] = Math.log(weight[i]!);
});
Deno.bench("Math.exp(x / 100), 10⁶ values", { group: "one call per value" }, () => {
  for (let i = 0; i < n; i++) out[i] = Math.exp(weight[i]! / 100);
});
