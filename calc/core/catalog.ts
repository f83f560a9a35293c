/**
 * The catalog: explicit registration of every calculation, family and quantity of the package
 * (or of a user's module), the way to make a calculation again from its recipe in another
 * thread, and a fingerprint of a definition that tells two calculations apart even when they
 * share an id and a formula's source text but not the values the formula closes over.
 *
 * @module
 */
import { createHash } from "node:crypto";
import type { Calculation, InputValues, Quantity, Recipe } from "./types.ts";
import type { Family } from "./family.ts";
import { chain, type ChainOptions, type ChainStep } from "./chain.ts";
import { typicalRange } from "./quantity.ts";

/** A catalog of calculations, families and quantities. */
export interface Catalog {
  /** Brand. */
  readonly kind: "sonorigor.catalog";
  /** Calculations by id. */
  readonly calculations: ReadonlyMap<string, Calculation>;
  /** Families by id. */
  readonly families: ReadonlyMap<string, Family>;
  /** Quantities by id. */
  readonly quantities: ReadonlyMap<string, Quantity>;
}

/** What a catalog registers. */
export interface CatalogSpec {
  /** Calculations (ids unique). */
  readonly calculations?: readonly Calculation[];
  /** Families (ids unique). */
  readonly families?: readonly Family<never>[];
  /** Quantities (ids unique). */
  readonly quantities?: readonly Quantity[];
}

function register<T extends { id: string }>(
  into: Map<string, T>,
  items: readonly T[],
  what: string,
): void {
  for (const item of items) {
    const known = into.get(item.id);
    if (known !== undefined && known !== item) {
      throw new TypeError(
        `Catalog: two different ${what} share the id '${item.id}'; give each its own id`,
      );
    }
    into.set(item.id, item);
  }
}

/**
 * Registers calculations, families and quantities; catalogs may be combined by listing the
 * contents of several (see {@linkcode combineCatalogs}).
 *
 * @param spec What to register.
 * @returns The catalog.
 * @throws {TypeError} When two different items share an id.
 *
 * @example
 * ```ts
 * import { CATALOG, continuityValveArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CATALOG.calculations.get("continuityValveArea"), continuityValveArea);
 * ```
 */
export function defineCatalog(spec: CatalogSpec): Catalog {
  const calculations = new Map<string, Calculation>();
  const families = new Map<string, Family>();
  const quantities = new Map<string, Quantity>();
  register(calculations, spec.calculations ?? [], "calculations");
  register(families, (spec.families ?? []) as readonly Family[], "families");
  register(quantities, spec.quantities ?? [], "quantities");
  for (const c of calculations.values()) {
    for (const d of [...Object.values(c.inputs), ...Object.values(c.outputs)]) {
      register(quantities, [d.quantity], "quantities");
    }
  }
  return Object.freeze({ kind: "sonorigor.catalog" as const, calculations, families, quantities });
}

/**
 * One catalog from several (a worker's: the package's and the user's modules').
 *
 * @throws {TypeError} When two different items share an id.
 *
 * @example
 * ```ts
 * import { CATALOG, combineCatalogs, defineCatalog } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const both = combineCatalogs([CATALOG, defineCatalog({})]);
 * assert.equal(both.calculations.size, CATALOG.calculations.size);
 * ```
 */
export function combineCatalogs(catalogs: readonly Catalog[]): Catalog {
  return defineCatalog({
    calculations: catalogs.flatMap((c) => [...c.calculations.values()]),
    families: catalogs.flatMap((c) => [...c.families.values()]) as Family<never>[],
    quantities: catalogs.flatMap((c) => [...c.quantities.values()]),
  });
}

/**
 * Every calculation a catalog documents: its calculations and every documented member of its
 * families, sorted by id.
 *
 * @example
 * ```ts
 * import { CATALOG, catalogCalculations } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(catalogCalculations(CATALOG).some((c) => c.id.startsWith("zScore(")));
 * ```
 */
export function catalogCalculations(catalog: Catalog): Calculation[] {
  const all = [...catalog.calculations.values()];
  for (const f of catalog.families.values()) {
    for (const p of f.members) all.push(f.calculation(p));
  }
  return all.sort((a, b) => a.id.localeCompare(b.id));
}

/**
 * Makes a calculation again from its recipe: by id from the catalog, as a family member from its
 * parameter, or as a chain of recipes.
 *
 * @param catalog Where to look.
 * @param recipe The recipe (a calculation's `recipe`).
 * @returns The calculation.
 * @throws {TypeError} For an unknown id or family, or a recipe of a calculation made at run time.
 *
 * @example
 * ```ts
 * import { CATALOG, chain, bsaHaycock, indexedToBsa, LV_MASS, rebuild } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = chain([bsaHaycock, indexedToBsa(LV_MASS)]);
 * assert.equal(rebuild(CATALOG, c.recipe).id, c.id);
 * ```
 */
export function rebuild(catalog: Catalog, recipe: Recipe): Calculation {
  switch (recipe.kind) {
    case "catalog": {
      const c = catalog.calculations.get(recipe.id);
      if (c === undefined) {
        throw new TypeError(
          `Catalog: calculation '${recipe.id}' is not registered; expected a calculation of the catalog or of a listed module, got '${recipe.id}'`,
        );
      }
      return c;
    }
    case "family": {
      const f = catalog.families.get(recipe.family);
      if (f === undefined) {
        throw new TypeError(
          `Catalog: family '${recipe.family}' is not registered; expected one of ${
            [...catalog.families.keys()].join(", ")
          }, got '${recipe.family}'`,
        );
      }
      return f.fromData(recipe.parameter);
    }
    case "chain": {
      // a chain the catalog registers comes back as that same object
      const text = JSON.stringify(recipe);
      for (const c of catalog.calculations.values()) {
        if (c.recipe.kind === "chain" && JSON.stringify(c.recipe) === text) return c;
      }
      const { renames, ...options } = recipe.options as ChainOptions & {
        renames: { inputs: Record<string, string>; outputs: Record<string, string> }[];
      };
      const steps: ChainStep[] = recipe.steps.map((r, i) => ({
        calculation: rebuild(catalog, r),
        ...(renames[i] ?? {}),
      }));
      return chain(steps, options);
    }
    case "local":
      throw new TypeError(
        `Catalog: this calculation cannot be made again elsewhere: ${recipe.why}`,
      );
  }
}

const fingerprints = new WeakMap<Calculation, string>();

/** Probe values of an input: points across its typical range (or inside its valid range). */
function probe(calc: Calculation, fraction: number): InputValues<string> {
  const x: Record<string, number> = {};
  for (const name of calc.inputNames) {
    const d = calc.inputs[name]!;
    const r = typicalRange(d) ?? d.range;
    const lo = Number.isFinite(r.min) ? r.min : -1;
    const hi = Number.isFinite(r.max) ? r.max : lo + 2;
    x[name] = d.default ?? lo + fraction * (hi - lo);
  }
  return x;
}

/**
 * A fingerprint of a calculation's definition: SHA-256 of its id, inputs and outputs (names,
 * quantities, units, ranges), formula text and source, and the formula's outputs at three probe
 * points across the typical ranges, so that two calculations with the same id and formula source
 * but different values closed over (a different parameter) have different fingerprints.
 *
 * @param calc The calculation.
 * @returns 64 hexadecimal digits.
 *
 * @example
 * ```ts
 * import { continuityValveArea, fingerprint } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(fingerprint(continuityValveArea), /^[0-9a-f]{64}$/);
 * ```
 */
export function fingerprint(calc: Calculation): string {
  let f = fingerprints.get(calc);
  if (f !== undefined) return f;
  const probes = [0.3, 0.5, 0.7].map((fraction) => {
    try {
      const y = calc.formula(probe(calc, fraction)) as Record<string, number>;
      return calc.outputNames.map((o) => String(y[o]));
    } catch (e) {
      return [`threw ${(e as Error).name}`];
    }
  });
  const text = JSON.stringify({
    id: calc.id,
    inputs: calc.inputNames.map((n) => {
      const d = calc.inputs[n]!;
      return [n, d.quantity.id, d.unit, d.range, d.default ?? null];
    }),
    outputs: calc.outputNames.map((o) => [o, calc.outputs[o]!.quantity.id]),
    formulaText: calc.formulaText,
    formula: calc.formula.toString(),
    probes,
  });
  f = createHash("sha256").update(text).digest("hex");
  fingerprints.set(calc, f);
  return f;
}
