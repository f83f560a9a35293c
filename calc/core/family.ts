/**
 * Families: calculations made from a parameter that is plain data (a Z-score model, the quantity
 * indexed to body surface area). A family is registered once in the catalog with the members it
 * documents; any member, published or the user's own, is made the same way and can be made again
 * in a worker from its parameter.
 *
 * @module
 */
import type { Calculation } from "./types.ts";
import { type CalculationSpec, defineCalculation } from "./calculation.ts";

/** What an author writes to declare a family. */
export interface FamilySpec<P> {
  /** Stable identifier, e.g. "zScore". */
  readonly id: string;
  /** Human title, e.g. "Pediatric Z-score". */
  readonly title: string;
  /** What the family computes, for the docs. */
  readonly description: string;
  /** The members the package documents (every published model, every common quantity). */
  readonly members: readonly P[];
  /** The identity of a member (its calculation is made once per key). */
  readonly key: (parameter: P) => string;
  /** The parameter as plain data, to make the member again in a worker. @default the parameter */
  readonly toData?: (parameter: P) => unknown;
  /** The parameter from plain data. @default the data itself */
  readonly fromData?: (data: unknown) => P;
  /** The definition of one member (its recipe is set by the family). */
  readonly define: (parameter: P) => Omit<CalculationSpec<string, string>, "recipe">;
}

/** A family of calculations. */
export interface Family<P = unknown> {
  /** Brand used by the catalog. */
  readonly kind: "sonorigor.family";
  /** Stable identifier. */
  readonly id: string;
  /** Human title. */
  readonly title: string;
  /** What the family computes. */
  readonly description: string;
  /** The documented members. */
  readonly members: readonly P[];
  /** The calculation of one member (made once per key). */
  calculation(parameter: P): Calculation;
  /** The member made from plain data (a worker's way in). */
  fromData(data: unknown): Calculation;
}

/**
 * Declares a family of calculations.
 *
 * @param spec Identifier, documented members, the member key, and the definition of a member.
 * @returns The family; `family.calculation(parameter)` makes (once) and returns a member.
 *
 * @example A family of "value per unit of body surface area", one member per quantity
 * ```ts
 * import { INDEXED_TO_BSA, LV_MASS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const lvMassIndex = INDEXED_TO_BSA.calculation(LV_MASS);
 * assert.equal(lvMassIndex, INDEXED_TO_BSA.calculation(LV_MASS)); // made once
 * assert.deepEqual(lvMassIndex.recipe, { kind: "family", family: "indexedToBsa", parameter: "lvMass" });
 * ```
 */
export function defineFamily<P>(spec: FamilySpec<P>): Family<P> {
  const made = new Map<string, Calculation>();
  const toData = spec.toData ?? ((p: P) => p as unknown);
  const fromData = spec.fromData ?? ((d: unknown) => d as P);
  const calculation = (parameter: P): Calculation => {
    const key = spec.key(parameter);
    let calc = made.get(key);
    if (calc === undefined) {
      calc = defineCalculation({
        ...spec.define(parameter),
        recipe: { kind: "family", family: spec.id, parameter: toData(parameter) },
      });
      made.set(key, calc);
    }
    return calc;
  };
  return Object.freeze({
    kind: "sonorigor.family" as const,
    id: spec.id,
    title: spec.title,
    description: spec.description,
    members: Object.freeze([...spec.members]),
    calculation,
    fromData: (data: unknown) => calculation(fromData(data)),
  });
}
