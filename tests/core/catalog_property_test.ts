/**
 * Catalog-wide property test: no calculation of the package gives, without a named error, an
 * impossible number (a negative volume, a fraction outside [0, 100] %, a negative pressure
 * difference, a non-finite output) for inputs drawn inside their valid and typical ranges; and no
 * output quantity declares a valid range that admits such numbers.
 *
 * What is impossible is trade fact (common practice, no source): a volume, a pressure difference
 * from the Bernoulli relation and a pressure estimated from the IVC are not negative; a fraction
 * of a whole lies in [0, 100] %.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { CATALOG } from "../../calc/catalog.ts";
import { catalogCalculations } from "../../calc/core/catalog.ts";
import { defineCalculation } from "../../calc/core/calculation.ts";
import { evaluate } from "../../calc/core/evaluate.ts";
import { relationText } from "../../calc/core/validate.ts";
import { defineQuantity } from "../../calc/core/quantity.ts";
import { InputRangeError, InputTypeError } from "../../calc/core/issues.ts";
import { typicalRange } from "../../calc/core/quantity.ts";
import {
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME,
} from "../../calc/quantities/structure.ts";
import { inRange } from "../../calc/core/range.ts";
import type {
  Calculation,
  InputDefinition,
  Population,
  Quantity,
  ValueRange,
} from "../../calc/core/types.ts";

const CALCULATIONS = catalogCalculations(CATALOG);
const SEED = 20_240_611;
const RUNS = 120;

/** Units of volumes (and volumes per m² of body surface area). */
const VOLUME_UNITS = new Set(["mL", "mL/m^2", "L"]);
/** Units of pressures and pressure differences. */
const PRESSURE_UNITS = new Set(["mmHg"]);
/** Percentages that are not a part of a whole, each with the reason. Every other "%" output is a
 * fraction and must stay in [0, 100] %. */
const NOT_A_FRACTION: ReadonlyMap<string, string> = new Map([
  ["valveAreaError", "a signed relative error: above −100 % (area → 0), any overestimate"],
  [
    "mechanicalIndexOfLimit",
    "a share of a regulatory limit: above 100 % when the limit is exceeded",
  ],
]);
/** Output quantities declared outside the files this test may change whose valid range is
 * written with a closed infinite end ("[−∞, ∞]"): reported, to be fixed where they are declared
 * (calc/reference/zscore.ts). */
const CLOSED_INFINITE_ELSEWHERE = /^zScore\./;

type Kind = "volume" | "pressure" | "fraction" | "other";

function kindOf(q: Quantity): Kind {
  if (VOLUME_UNITS.has(q.unit)) return "volume";
  if (PRESSURE_UNITS.has(q.unit)) return "pressure";
  if (q.unit === "%" && !NOT_A_FRACTION.has(q.id)) return "fraction";
  return "other";
}

function outputQuantities(): Map<string, { quantity: Quantity; calculations: string[] }> {
  const out = new Map<string, { quantity: Quantity; calculations: string[] }>();
  for (const c of CALCULATIONS) {
    for (const name of c.outputNames) {
      const q = c.outputs[name]!.quantity;
      const entry = out.get(q.id) ?? { quantity: q, calculations: [] };
      entry.calculations.push(c.id);
      out.set(q.id, entry);
    }
  }
  return out;
}

/** Why a value is impossible for its quantity's kind, or null when it is possible. */
function impossible(q: Quantity, v: number): string | null {
  if (!Number.isFinite(v)) return "not finite";
  const kind = kindOf(q);
  if ((kind === "volume" || kind === "pressure") && v < 0) return `a negative ${kind}`;
  if (kind === "fraction" && !(v >= 0 && v <= 100)) return "a fraction outside [0, 100] %";
  return null;
}

/** What is wrong with an output quantity's declared valid range, in words (none: empty). */
function rangeProblems(q: Quantity, calculations: readonly string[]): string[] {
  const problems: string[] = [];
  const r = q.valid;
  const where = `${q.id} (${q.label}, output of ${calculations.join(", ")})`;
  const kind = kindOf(q);
  // a volume or a pressure difference is never negative (common practice, no source)
  if ((kind === "volume" || kind === "pressure") && r.min < 0) {
    problems.push(`${where}: a ${kind} allowed down to ${r.min}`);
  }
  // a volume or a pressure has a physical upper end (common practice, no source)
  if ((kind === "volume" || kind === "pressure") && !Number.isFinite(r.max)) {
    problems.push(`${where}: a ${kind} without an upper limit`);
  }
  // a fraction of a whole lies in [0, 100] % (definition)
  if (kind === "fraction" && (r.min < 0 || r.max > 100)) {
    problems.push(`${where}: a fraction allowed in [${r.min}, ${r.max}] %`);
  }
  // an infinite end is never a value: it must be open (definition of the extended reals)
  const closedInfinite = (r.max === Infinity && !r.maxExclusive) ||
    (r.min === -Infinity && !r.minExclusive);
  if (closedInfinite && !CLOSED_INFINITE_ELSEWHERE.test(q.id)) {
    problems.push(`${where}: an infinite end that is closed`);
  }
  return problems;
}

Deno.test("no output quantity declares a valid range that admits an impossible value", () => {
  const problems = [...outputQuantities().values()].flatMap((e) =>
    rangeProblems(e.quantity, e.calculations)
  );
  assert.deepEqual(problems, []);
});

/** A finite span to draw from: the range itself, or a large finite part of an unbounded one. */
function span(
  r: ValueRange,
): { min: number; max: number; minExcluded: boolean; maxExcluded: boolean } {
  const min = Number.isFinite(r.min) ? r.min : -1e6;
  const max = Number.isFinite(r.max) ? r.max : Math.max(min, 0) + 1e6;
  return {
    min,
    max,
    minExcluded: Number.isFinite(r.min) && Boolean(r.minExclusive),
    maxExcluded: Number.isFinite(r.max) && Boolean(r.maxExclusive),
  };
}

function arbitraryOf(d: InputDefinition, r: ValueRange): fc.Arbitrary<number> {
  const s = span(r);
  if (d.quantity.integer) {
    const lo = Math.ceil(s.minExcluded ? s.min + 1e-9 : s.min);
    const hi = Math.floor(s.maxExcluded ? s.max - 1e-9 : s.max);
    return fc.integer({ min: lo, max: hi });
  }
  return fc.double({ ...s, noNaN: true, noDefaultInfinity: true });
}

/** Where to draw each input: inside its valid range, or inside its typical range (adults or
 * children), which the calculation keeps inside the valid one. */
function rangeOf(d: InputDefinition, where: "valid" | Population): ValueRange {
  if (where === "valid") return d.range;
  const typical = where === "pediatric"
    ? d.typicalPediatric ?? d.typical ?? typicalRange(d.quantity, "pediatric")
    : d.typical ?? typicalRange(d.quantity, "adult");
  return typical ?? d.range;
}

/** Draws consistent with the declared constraints where a swap of the two values involved makes
 * the relation hold (`notAbove`); other draws must meet a named constraint error. */
function consistent(c: Calculation, x: Record<string, number>): Record<string, number> {
  const y = { ...x };
  for (const k of c.constraints) {
    if (k.holds(y) || k.inputs.length !== 2) continue;
    const [a, b] = k.inputs as [string, string];
    const swapped = { ...y, [a]: y[b]!, [b]: y[a]! };
    if (
      k.holds(swapped) && inRange(swapped[a]!, c.inputs[a]!.range) &&
      inRange(swapped[b]!, c.inputs[b]!.range)
    ) Object.assign(y, swapped);
  }
  return y;
}

/** True when a thrown error is named: TypeError or RangeError carrying structured issues, whose
 * message names the field at fault (and, for an impossible output or a broken relation, the
 * inputs that produced it). */
function assertNamed(c: Calculation, e: unknown, x: Record<string, number>): void {
  const shown = JSON.stringify(x);
  assert.ok(
    e instanceof InputRangeError || e instanceof InputTypeError,
    `${c.id}: unnamed ${(e as Error)?.name}: ${(e as Error)?.message} for ${shown}`,
  );
  const issue = e.issues[0]!;
  const message = e.message;
  assert.ok(message.startsWith(`${c.title}: `), `${c.id}: message without the title: ${message}`);
  if (issue.kind === "output") {
    // the impossible output is named, with every input that produced it
    assert.ok(message.includes(`'${issue.field}'`), `${c.id}: ${message}`);
    for (const n of c.inputNames) assert.ok(message.includes(`${n} = `), `${c.id}: ${message}`);
  } else if (issue.kind === "constraint") {
    const k = c.constraints.find((k) => relationText(c, k) === issue.expected);
    assert.ok(k, `${c.id}: a constraint error for no declared constraint: ${message}`);
    for (const n of k.inputs) assert.ok(message.includes(`${n} = `), `${c.id}: ${message}`);
  } else {
    assert.ok(
      (c.inputNames as readonly string[]).includes(issue.field) &&
        message.includes(`'${issue.field}'`),
      `${c.id}: error not naming an input: ${message}`,
    );
  }
}

function check(c: Calculation, where: "valid" | Population, repair: boolean): void {
  const record: Record<string, fc.Arbitrary<number>> = {};
  for (const n of c.inputNames) {
    const d = c.inputs[n]!;
    record[n] = arbitraryOf(d, rangeOf(d, where));
  }
  const population: Population = where === "pediatric" ? "pediatric" : "adult";
  fc.assert(
    fc.property(fc.record(record), (drawn) => {
      const x = repair ? consistent(c, drawn) : drawn;
      let outputs: Record<string, number>;
      try {
        outputs = evaluate(c, x, { population }).outputs;
      } catch (e) {
        assertNamed(c, e, x);
        return;
      }
      for (const name of c.outputNames) {
        const q = c.outputs[name]!.quantity;
        const v = outputs[name]!;
        const why = impossible(q, v);
        assert.equal(why, null, `${c.id}: '${name}' = ${v} is ${why} for ${JSON.stringify(x)}`);
        // the evaluator's own promise: an output inside its quantity's valid range
        assert.ok(inRange(v, q.valid), `${c.id}: '${name}' = ${v} outside its valid range`);
      }
    }),
    { seed: SEED, numRuns: RUNS },
  );
}

Deno.test("every catalog calculation: inputs in their valid ranges give a possible result or a named error", () => {
  assert.ok(CALCULATIONS.length > 50, "the whole catalog is checked");
  for (const c of CALCULATIONS) check(c, "valid", false);
});

Deno.test("every catalog calculation: inputs in their typical ranges (adults and children) give a possible result or a named error", () => {
  for (const c of CALCULATIONS) {
    check(c, "adult", false);
    check(c, "pediatric", false);
  }
});

Deno.test("every catalog calculation: inputs drawn consistent with the declared relations give a possible result or a named error", () => {
  const constrained = CALCULATIONS.filter((c) => c.constraints.length > 0);
  // end-systolic ≤ end-diastolic, regurgitant ≤ total stroke volume, … (common practice, no source)
  assert.ok(constrained.length >= 5, `constrained calculations: ${constrained.length}`);
  for (const c of constrained) {
    check(c, "valid", true);
    check(c, "adult", true);
  }
});

Deno.test("the property checks can fail: impossible ranges, values and unnamed errors are caught", () => {
  const quantity = (id: string) =>
    [...outputQuantities().values()].find((e) => e.quantity.id === id)!.quantity;
  // a regurgitant fraction declared up to 200 % (the kind of range this test is for)
  const fraction: Quantity = { ...quantity("regurgitantFraction"), valid: { min: 0, max: 200 } };
  assert.equal(kindOf(fraction), "fraction");
  assert.equal(rangeProblems(fraction, ["demo"]).length, 1);
  assert.equal(impossible(fraction, 150), "a fraction outside [0, 100] %");
  assert.equal(impossible(fraction, Number.NaN), "not finite");
  // the indexed LV volumes as they were declared before this test: [0, ∞] mL/m²
  const index: Quantity = {
    ...quantity("lvEndDiastolicVolumeIndex"),
    valid: { min: 0, max: Infinity },
  };
  assert.deepEqual(rangeProblems(index, ["demo"]).map((p) => p.split(": ")[1]), [
    "a volume without an upper limit",
    "an infinite end that is closed",
  ]);
  // a negative gradient
  assert.equal(impossible(quantity("peakGradient"), -1), "a negative pressure");
  // a plain Error is not a named error
  const c = CALCULATIONS[0]!;
  assert.throws(() => assertNamed(c, new Error("boom"), {}), /unnamed Error: boom/);
  // a calculation whose output range admits a negative volume, and whose formula gives one, fails
  const leaky = defineCalculation({
    id: "demoLeakyVolume",
    title: "Demo volume",
    description: "A deliberately wrong difference of volumes.",
    inputs: { edv: LV_END_DIASTOLIC_VOLUME, esv: LV_END_SYSTOLIC_VOLUME },
    outputs: {
      volume: defineQuantity({
        id: "demoSignedVolume",
        label: "Demo volume",
        unit: "mL",
        description: "A volume declared with a negative range",
        valid: { min: -2000, max: 2000 },
        resolution: 1,
      }),
    },
    formula: ({ edv, esv }) => ({ volume: esv - edv }),
    formulaText: "V = ESV − EDV",
    citations: [{ authors: "none", year: 0, title: "test double", publication: "none" }],
    cautions: [],
  });
  assert.throws(() => check(leaky, "adult", false), /Property failed[^]*Counterexample/);
});
