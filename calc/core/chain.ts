/**
 * Chains: calculations applied one after another, declared in one line, that are themselves a
 * calculation (evaluation, propagation, documentation, display, tables and the worker pool treat
 * them like any other). An input of a later step is fed by the earlier output of the same name;
 * inputs that no earlier step computes are the chain's inputs, shared by name across steps.
 *
 * @module
 */
import type {
  Calculation,
  Citation,
  InputConstraint,
  InputDefinition,
  InputsOf,
  InputValues,
  OutputsOf,
  OutputValues,
  Recipe,
} from "./types.ts";
import { defineCalculation, type InputRole } from "./calculation.ts";

/** A step of a chain: a calculation, optionally with its inputs and outputs renamed to the
 * chain's names (step name → chain name). */
export type ChainStep =
  | Calculation
  | {
    readonly calculation: Calculation;
    readonly inputs?: Readonly<Record<string, string>>;
    readonly outputs?: Readonly<Record<string, string>>;
  };

/** Options of {@linkcode chain}. */
export interface ChainOptions {
  /** Identifier. @default "chain(" + step ids + ")" */
  readonly id?: string;
  /** Title. @default the step titles joined by " → " */
  readonly title?: string;
  /** What the chain computes. @default built from the steps */
  readonly description?: string;
  /** Outputs to keep, by chain name. @default every step's outputs */
  readonly outputs?: readonly string[];
}

interface NormalizedStep {
  readonly calculation: Calculation;
  readonly inputs: Readonly<Record<string, string>>;
  readonly outputs: Readonly<Record<string, string>>;
}

function normalize(step: ChainStep): NormalizedStep {
  if ((step as Calculation).kind === "sonorigor.calculation") {
    return { calculation: step as Calculation, inputs: {}, outputs: {} };
  }
  const s = step as Exclude<ChainStep, Calculation>;
  if (s?.calculation?.kind !== "sonorigor.calculation") {
    throw new TypeError(
      `Chain: expected each step to be a calculation or { calculation, inputs?, outputs? }, got ${typeof step}`,
    );
  }
  return { calculation: s.calculation, inputs: s.inputs ?? {}, outputs: s.outputs ?? {} };
}

function roleOf(def: InputDefinition, stepTitle: string): InputRole {
  const q = def.quantity;
  const narrowed = def.range !== q.valid || def.typical !== q.typical ||
    def.typicalPediatric !== q.typicalPediatric;
  return {
    quantity: q,
    label: def.label,
    description: def.description,
    ...(narrowed
      ? {
        valid: def.range,
        ...(def.typical ? { typical: def.typical } : {}),
        ...(def.typicalPediatric ? { typicalPediatric: def.typicalPediatric } : {}),
        reason: def.narrowedBecause ?? `as in ${stepTitle}`,
      }
      : {}),
    ...(def.default !== undefined ? { default: def.default } : {}),
  };
}

/** Two calculations chained without renaming: the inputs the first does not compute, and the
 * outputs of both. */
export type Chained<A extends Calculation, B extends Calculation> = Calculation<
  InputsOf<A> | Exclude<InputsOf<B>, OutputsOf<A>>,
  OutputsOf<A> | OutputsOf<B>
>;

/**
 * Chains calculations into one: each later step's input is fed by the latest earlier output of
 * the same (chain) name; every other input is an input of the chain, shared by all steps that
 * name it. The chain's formula calls each step's own formula, so nothing is written twice, and
 * the chain propagates like any calculation: the GUM law differentiates the whole chain, Monte
 * Carlo evaluates it trial by trial.
 *
 * @param steps Calculations (or `{ calculation, inputs, outputs }` with renames) in order.
 * @param options Identifier, title, description, outputs to keep.
 * @returns The chain as a calculation.
 * @throws {TypeError} For fewer than two steps, two steps that give one output name, two inputs of
 * one name that measure different quantities, or an unknown output to keep.
 *
 * @example BSA from height and weight, then LV mass indexed to it
 * ```ts
 * import { bsaMosteller, chain, evaluate, indexedToBsa, LV_MASS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const lvMassIndex = chain([bsaMosteller, indexedToBsa(LV_MASS)]);
 * // Mosteller: √(180·80/3600) = 2 m² (hand-checkable); 190 g / 2 m² = 95 g/m²
 * const r = evaluate(lvMassIndex, { heightCm: 180, weightKg: 80, lvMass: 190 });
 * assert.equal(r.outputs.bsaM2, 2);
 * assert.equal(r.outputs.lvMassIndex, 95);
 * ```
 */
export function chain<A extends Calculation, B extends Calculation>(
  steps: readonly [A, B],
  options?: ChainOptions,
): Chained<A, B>;
/**
 * A chain of any number of steps, or of steps with renamed inputs or outputs (typed as a plain
 * calculation); see the two-step form above for the rules.
 *
 * @param steps The calculations in order, each optionally with renames.
 * @param options Id, title, outputs to keep.
 * @returns The chain, itself a calculation.
 *
 * @example Three steps: PISA flow, then EROA, then regurgitant volume
 * ```ts
 * import { chain, effectiveRegurgitantOrificeArea, evaluate, pisaFlowRate, regurgitantVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const pisa = chain([pisaFlowRate, effectiveRegurgitantOrificeArea, regurgitantVolume]);
 * const r = evaluate(pisa, {
 *   radiusCm: 1, aliasingVelocityCmPerS: 40, regurgitantPeakVelocity: 5, regurgitantVtiCm: 150,
 * });
 * // 2π·1²·40 = 251.3 mL/s; / 500 cm/s = 0.503 cm²; × 150 cm = 75.4 mL (hand-checkable)
 * assert.ok(Math.abs(r.outputs.regurgitantVolumeMl! - 75.4) < 0.1);
 * ```
 */
export function chain(steps: readonly ChainStep[], options?: ChainOptions): Calculation;
export function chain(steps: readonly ChainStep[], options: ChainOptions = {}): Calculation {
  if (!Array.isArray(steps) || steps.length < 2) {
    throw new TypeError(`Chain: expected at least two steps, got ${steps?.length ?? 0}`);
  }
  const normalized = steps.map(normalize);
  const title = options.title ?? normalized.map((s) => s.calculation.title).join(" → ");
  const where = `Chain '${title}'`;
  const inputs: Record<string, InputRole> = {};
  const inputQuantity: Record<string, string> = {};
  const computed = new Set<string>();
  const outputs: Record<string, Calculation["outputs"][string]> = {};
  const constraints: InputConstraint<string>[] = [];
  // per step: [step input name, chain name] and [step output name, chain name]
  const wiring = normalized.map((s) => {
    const c = s.calculation;
    const ins = c.inputNames.map((n) => [n, s.inputs[n] ?? n] as const);
    for (const [n, name] of ins) {
      if (computed.has(name)) continue;
      const def = c.inputs[n]!;
      const known = inputQuantity[name];
      if (known !== undefined && known !== def.quantity.id) {
        throw new TypeError(
          `${where}: input '${name}' of '${c.title}' measures ${def.quantity.label}, but an earlier step's '${name}' measures another quantity; expected one quantity per name (rename one of them)`,
        );
      }
      if (known === undefined) {
        inputs[name] = roleOf(def, c.title);
        inputQuantity[name] = def.quantity.id;
      }
    }
    for (const k of c.constraints) {
      const names = k.inputs.map((n) => s.inputs[n] ?? n);
      if (names.some((n) => computed.has(n))) continue; // fed by an earlier step: not an input
      constraints.push({
        inputs: names,
        description: k.description.replace(
          /'([^']+)'/g,
          (_, n: string) => `'${s.inputs[n] ?? n}'`,
        ),
        holds: (x) => {
          const args: Record<string, number> = {};
          ins.forEach(([n, name]) => (args[n] = x[name]!));
          return k.holds(args as InputValues<string>);
        },
      });
    }
    const outs = c.outputNames.map((o) => [o, s.outputs[o] ?? o] as const);
    for (const [o, name] of outs) {
      if (outputs[name] !== undefined) {
        throw new TypeError(
          `${where}: two steps give the output '${name}'; expected one (rename it in a step's outputs)`,
        );
      }
      outputs[name] = c.outputs[o]!;
      computed.add(name);
    }
    return { ins, outs };
  });
  const keep = options.outputs ?? Object.keys(outputs);
  for (const name of keep) {
    if (outputs[name] === undefined) {
      throw new TypeError(
        `${where}: unknown output '${name}' to keep; expected one of ${
          Object.keys(outputs).join(", ")
        }`,
      );
    }
  }
  const formulas = normalized.map((s) => s.calculation.formula);
  const formula = (x: InputValues<string>): OutputValues<string> => {
    const v: Record<string, number> = { ...x };
    for (let k = 0; k < formulas.length; k++) {
      const { ins, outs } = wiring[k]!;
      const args: Record<string, number> = {};
      for (const [n, name] of ins) args[n] = v[name]!;
      const y = formulas[k]!(args as InputValues<string>) as Record<string, number>;
      for (const [o, name] of outs) v[name] = y[o]!;
    }
    const out: Record<string, number> = {};
    for (const name of keep) out[name] = v[name]!;
    return out;
  };
  const citations: Citation[] = [];
  const cautions: string[] = [];
  for (const s of normalized) {
    for (const c of s.calculation.citations) if (!citations.includes(c)) citations.push(c);
    for (const c of s.calculation.cautions) if (!cautions.includes(c)) cautions.push(c);
  }
  const recipe: Recipe = {
    kind: "chain",
    steps: normalized.map((s) => s.calculation.recipe),
    options: {
      renames: normalized.map((s) => ({ inputs: s.inputs, outputs: s.outputs })),
      ...options,
    },
  };
  return defineCalculation({
    id: options.id ?? `chain(${normalized.map((s) => s.calculation.id).join(", ")})`,
    title,
    description: options.description ??
      `${normalized.map((s) => s.calculation.title).join(", then ")}, computed as one chain.`,
    inputs,
    outputs: Object.fromEntries(keep.map((name) => {
      const d = outputs[name]!;
      return [name, { quantity: d.quantity, label: d.label, description: d.description }];
    })),
    formula,
    formulaText: normalized.map((s) => s.calculation.formulaText).join("; "),
    citations,
    cautions,
    constraints,
    clinical: normalized.some((s) => s.calculation.clinical),
    recipe,
  });
}
