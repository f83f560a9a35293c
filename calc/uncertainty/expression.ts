/**
 * Expression models: a user writes a measurement model as a mathjs expression ("4 * v^2") with
 * named inputs and units, and gets a calculation with symbolic sensitivity coefficients.
 *
 * @module
 */
import type { MathNode } from "mathjs";
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation, Citation, InputValues } from "../core/types.ts";
import type { InputSpec } from "../core/calculation.ts";
import { math } from "../core/units.ts";

/** The id every expression model carries (they are made at run time, not exported by a module). */
export const EXPRESSION_MODEL_ID = "expressionModel";

/** Options of {@linkcode expressionModel}. */
export interface ExpressionModelSpec<I extends string, O extends string> {
  /** The model as a mathjs expression over the input names, e.g. "4 * v^2". Angles inside
   * trigonometric functions are in radians. */
  readonly expression: string;
  /** Inputs by name, each with its canonical unit and valid range. */
  readonly inputs: { readonly [K in I]: InputSpec };
  /** The output's name, unit and description. */
  readonly output: { readonly name: O; readonly unit: string; readonly description: string };
  /** Title. @default "Expression model: <expression>" */
  readonly title?: string;
  /** Sources. @default a "user-supplied model" entry */
  readonly citations?: readonly Citation[];
  /** Cautions. @default none */
  readonly cautions?: readonly string[];
  /** Whether the result could reach a patient decision. @default false */
  readonly clinical?: boolean;
}

const USER_SOURCE: Citation = {
  authors: "the user",
  year: 0, // no publication year: shown as "n.d."
  title: "User-supplied measurement model",
  publication: "this analysis",
};

function symbolsOf(node: MathNode): string[] {
  const names = new Set<string>();
  node.traverse((n, _path, parent) => {
    if ((n as { isSymbolNode?: boolean }).isSymbolNode) {
      const isCallee = parent && (parent as { isFunctionNode?: boolean }).isFunctionNode &&
        (parent as unknown as { fn: MathNode }).fn === n;
      if (!isCallee) names.add((n as unknown as { name: string }).name);
    }
  });
  return [...names];
}

/**
 * Builds a calculation from a mathjs expression, with exact (symbolic) partial derivatives of any
 * order for the GUM law (JCGM 100:2008 §5.1.3, eq. (11a) sensitivity coefficients).
 *
 * @param spec Expression, inputs with units and ranges, output name and unit.
 * @returns A calculation usable with evaluate, gum, monteCarlo and sensitivity curves.
 * @throws {TypeError} When the expression does not parse or uses a symbol that is not an input
 * or a mathjs constant.
 *
 * @example
 * ```ts
 * import { evaluate, expressionModel } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * assert.equal(evaluate(model, { v: 3 }).outputs.gradient, 36);
 * assert.equal(model.partial!("gradient", ["v"])({ v: 3 }), 24);
 * ```
 */
export function expressionModel<I extends string, O extends string>(
  spec: ExpressionModelSpec<I, O>,
): Calculation<I, O> {
  const title = spec.title ?? `Expression model: ${spec.expression}`;
  let node: MathNode;
  try {
    node = math.parse(spec.expression);
  } catch (e) {
    throw new TypeError(
      `${title}: the expression does not parse (${(e as Error).message}), got "${spec.expression}"`,
    );
  }
  const inputNames = Object.keys(spec.inputs);
  const unknown = symbolsOf(node).filter((s) => !inputNames.includes(s) && !(s in math));
  if (unknown.length > 0) {
    throw new TypeError(
      `${title}: unknown symbol '${unknown.join("', '")}'; expected inputs ${
        inputNames.join(", ")
      }`,
    );
  }
  const compiled = node.compile();
  const cache = new Map<string, (x: InputValues<I>) => number>();
  const partial = (output: O, wrt: readonly I[]) => {
    if (output !== spec.output.name) throw new TypeError(`${title}: unknown output '${output}'`);
    const key = wrt.join("\u0000");
    let f = cache.get(key);
    if (!f) {
      let d: MathNode = node;
      for (const name of wrt) d = math.derivative(d, name);
      const c = d.compile();
      f = (x) => Number(c.evaluate({ ...x }));
      cache.set(key, f);
    }
    return f;
  };
  const out = spec.output.name;
  return defineCalculation<I, O>({
    id: EXPRESSION_MODEL_ID,
    title,
    description: `User model ${spec.output.name} = ${spec.expression}`,
    inputs: spec.inputs,
    outputs: { [out]: { unit: spec.output.unit, description: spec.output.description } } as {
      [K in O]: { unit: string; description: string };
    },
    formula: (x) => ({ [out]: Number(compiled.evaluate({ ...x })) }) as Record<O, number>,
    formulaText: `${spec.output.name} = ${spec.expression}`,
    citations: spec.citations ?? [USER_SOURCE],
    recipe: {
      kind: "local",
      why: "an expression model is made at run time and needs mathjs, which workers do not load",
    },
    cautions: spec.cautions ?? [],
    clinical: spec.clinical ?? false,
    partial,
  });
}
