/**
 * Bad input across the whole catalog, generated (fast-check, fixed seed): for every calculation
 * of `CATALOG`, one input at a time is given a wrong type, a unit of another dimension, no value,
 * a non-finite or an out-of-range value, or an unknown name is added; `evaluate` and `propagate`
 * (GUM law, plain values as exact inputs) must throw a
 * TypeError (type, unit, name, missing) or a RangeError (outside the valid range) whose message
 * names the field, the value received and the valid range — never return, never another error.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import {
  type Calculation,
  CATALOG,
  catalogCalculations,
  describeValue,
  evaluate,
  formatRange,
  type InputDefinition,
  inRange,
  propagate,
  readAmount,
  type ValueRange,
} from "../../mod.ts";

const SEED = 20240612;
const CALCULATIONS = catalogCalculations(CATALOG);

/** A value strictly inside a range (its middle, or next to a finite bound of a half-open one). */
function inside(range: ValueRange, integer: boolean, fraction = 0.5): number {
  const lo = Number.isFinite(range.min)
    ? range.min
    : Number.isFinite(range.max)
    ? range.max - 100
    : -100;
  const hi = Number.isFinite(range.max) ? range.max : lo + 100;
  let v = lo + fraction * (hi - lo);
  if (integer) v = Math.round(v);
  if (!inRange(v, range)) v = integer ? Math.ceil(lo + 1e-9) : (lo + hi) / 2;
  return v;
}

/** Valid arguments for a calculation: each input inside its typical range (or its valid one),
 * moved within those ranges until the calculation accepts them (relations between inputs); null
 * when none of the tries is accepted. */
function validArguments(calc: Calculation): Record<string, number> | null {
  for (let attempt = 0; attempt < 60; attempt++) {
    const args: Record<string, number> = {};
    calc.inputNames.forEach((name, k) => {
      const def: InputDefinition = calc.inputs[name]!;
      const integer = def.quantity?.integer ?? false;
      // a fixed sequence of fractions per try, different for each input
      const fraction = attempt === 0 ? 0.5 : ((attempt * 0.618 + k * 0.382) % 1) * 0.9 + 0.05;
      const typical = def.typical && inRange(inside(def.typical, integer, fraction), def.range)
        ? def.typical
        : def.range;
      args[name] = inside(typical, integer, fraction);
    });
    try {
      evaluate(calc, args);
      return args;
    } catch {
      // another try
    }
  }
  return null;
}

const BASELINES = new Map(CALCULATIONS.map((c) => [c.id, validArguments(c)]));

/** A unit of another dimension than `unit` (the validator must refuse it). */
function foreignUnit(unit: string): string {
  for (const u of ["mmHg", "kg", "cm", "s", "Hz", "mL"]) {
    if (typeof readAmount(`1 ${u}`, unit) !== "number") return u;
  }
  throw new Error(`no foreign unit for ${unit}`);
}

/** The entry points a user calls with values. */
const ENTRY_POINTS: readonly [
  string,
  (calc: Calculation, args: Record<string, unknown>) => unknown,
][] = [
  ["evaluate", (calc, args) => evaluate(calc, args as never)],
  ["propagate", (calc, args) => propagate(calc, args as never, { method: "gum" })],
];

type Defect = "type" | "unit" | "missing" | "extra" | "nonFinite" | "outOfRange";

const WRONG_TYPES: readonly unknown[] = [
  true,
  null,
  {},
  [],
  [1, 2],
  () => 1,
  new Float64Array(2),
  "twelve",
  "",
  10n,
];

interface Case {
  readonly calc: Calculation;
  readonly args: Record<string, unknown>;
  readonly field: string;
  readonly received: string;
  readonly expected: string;
  readonly error: typeof TypeError | typeof RangeError;
}

/** The bad arguments for one defect, and what the message must name. */
function badCase(
  calc: Calculation,
  base: Record<string, number>,
  defect: Defect,
  which: number,
  pick: number,
): Case | null {
  const name = calc.inputNames[which % calc.inputNames.length]!;
  const def: InputDefinition = calc.inputs[name]!;
  const range = formatRange(def.range, def.unit);
  const args: Record<string, unknown> = { ...base };
  const integer = def.quantity?.integer ?? false;
  const made = (field: string, received: string, expected: string, error: Case["error"]) => ({
    calc,
    args,
    field,
    received,
    expected,
    error,
  });
  switch (defect) {
    case "type": {
      const v = WRONG_TYPES[pick % WRONG_TYPES.length];
      args[name] = v;
      return made(name, describeValue(v), range, TypeError);
    }
    case "unit": {
      const text = `${base[name]} ${foreignUnit(def.unit)}`;
      args[name] = text;
      return made(name, JSON.stringify(text), range, TypeError);
    }
    case "missing": {
      if (def.default !== undefined) return null; // a default fills it
      delete args[name];
      return made(name, "nothing", range, TypeError);
    }
    case "extra": {
      const unknown = `${name}Extra`;
      args[unknown] = pick;
      return made(unknown, String(pick), `one of ${calc.inputNames.join(", ")}`, TypeError);
    }
    case "nonFinite": {
      const v = [NaN, Infinity, -Infinity][pick % 3]!;
      if (inRange(v, def.range)) return null; // an unbounded range may hold ±∞ (none does now)
      args[name] = v;
      return made(name, String(v), range, RangeError);
    }
    case "outOfRange": {
      const { min, max } = def.range;
      const below = Number.isFinite(min);
      const above = Number.isFinite(max);
      if (!below && !above) return null;
      const step = integer
        ? 1
        : Math.max(1e-6, 0.01 * Math.abs((above ? max : 0) - (below ? min : 0)));
      const low = def.range.minExclusive ? min : min - step;
      const high = def.range.maxExclusive ? max : max + step;
      const v = below && (!above || pick % 2 === 0) ? low : high;
      args[name] = v;
      return made(name, String(v), range, RangeError);
    }
  }
}

Deno.test("every catalog calculation has valid arguments to start from", () => {
  const none = [...BASELINES].filter(([, a]) => a === null).map(([id]) => id);
  assert.deepEqual(none, []);
});

Deno.test("fuzz: bad input to any catalog calculation is a TypeError or RangeError naming field, value and range", () => {
  const usable = CALCULATIONS.filter((c) => BASELINES.get(c.id) && c.inputNames.length > 0);
  fc.assert(
    fc.property(
      fc.nat({ max: usable.length - 1 }),
      fc.constantFrom<Defect>("type", "unit", "missing", "extra", "nonFinite", "outOfRange"),
      fc.nat({ max: 50 }),
      fc.nat({ max: 1000 }),
      fc.nat({ max: ENTRY_POINTS.length - 1 }),
      (index, defect, which, pick, entry) => {
        const calc = usable[index]!;
        const c = badCase(calc, BASELINES.get(calc.id)!, defect, which, pick);
        if (c === null) return;
        const [call, run] = ENTRY_POINTS[entry]!;
        let thrown: unknown = null;
        try {
          run(calc, c.args);
        } catch (e) {
          thrown = e;
        }
        const what = `${call} ${calc.id}, ${defect} '${c.field}' = ${c.received}`;
        assert.ok(thrown !== null, `${what}: accepted`);
        assert.ok(thrown instanceof c.error, `${what}: ${thrown}`);
        const message = (thrown as Error).message;
        assert.ok(message.startsWith(`${calc.title}: `), `${what}: ${message}`);
        assert.ok(message.includes(`'${c.field}'`), `${what}: ${message}`);
        assert.ok(message.includes(`got ${c.received}`), `${what}: ${message}`);
        assert.ok(message.includes(c.expected), `${what}: ${message}`);
      },
    ),
    { seed: SEED, numRuns: 3000 },
  );
});

Deno.test("every calculation and every kind of defect is exercised at least once", () => {
  // the same cases as above, enumerated: no calculation escapes the generator by chance
  const failures: string[] = [];
  for (const calc of CALCULATIONS) {
    const base = BASELINES.get(calc.id);
    if (!base) continue;
    for (let which = 0; which < calc.inputNames.length; which++) {
      for (
        const defect of ["type", "unit", "missing", "extra", "nonFinite", "outOfRange"] as const
      ) {
        for (const pick of [0, 1, 2]) {
          const c = badCase(calc, base, defect, which, pick);
          if (c === null) continue;
          for (const [call, run] of ENTRY_POINTS) {
            const what = `${call} ${calc.id}: ${defect} '${c.field}' = ${c.received}`;
            try {
              run(calc, c.args);
              failures.push(`${what} accepted`);
            } catch (e) {
              const m = (e as Error).message;
              if (
                !(e instanceof c.error) || !m.includes(`'${c.field}'`) ||
                !m.includes(`got ${c.received}`) || !m.includes(c.expected)
              ) {
                failures.push(`${what}: ${e}`);
              }
            }
          }
        }
      }
    }
  }
  assert.deepEqual(failures, []);
});
