/**
 * The statistics of a method-validation study of graded findings: Cohen's kappa (unweighted,
 * linear and quadratic weights) for each pair of raters on first readings, and Fleiss' kappa
 * across all raters on the subjects graded by every rater.
 *
 * @module
 */
import { attempt } from "./checks.ts";
import { cohenKappa, fleissKappa } from "./kappa.ts";
import type { GradedReadings } from "./validation_table.ts";
import type { KappaAnalysis, KappaPair } from "./report_types.ts";
import type { KappaWeights } from "./types.ts";

const WEIGHTS: readonly KappaWeights[] = ["none", "linear", "quadratic"];

/** Kappa statistics of graded findings (first readings). */
export function kappaAnalysis(study: GradedReadings, confidence: number): KappaAnalysis {
  const first = new Map<string, Map<string, string>>();
  for (const o of study.observers) first.set(o, new Map());
  for (const r of study.readings) {
    if (r.replicate === 1) first.get(r.observer)!.set(r.subject, r.value);
  }
  const quantity = { label: study.label, unit: "1" };
  const categories = study.categories;
  const pairs: KappaPair[] = [];
  for (let i = 0; i < study.observers.length; i++) {
    for (let j = i + 1; j < study.observers.length; j++) {
      const raterA = study.observers[i]!;
      const raterB = study.observers[j]!;
      const a: string[] = [];
      const b: string[] = [];
      const ofB = first.get(raterB)!;
      for (const s of study.subjects) {
        const ga = first.get(raterA)!.get(s);
        const gb = ofB.get(s);
        if (ga === undefined || gb === undefined) continue;
        a.push(ga);
        b.push(gb);
      }
      pairs.push({
        raterA,
        raterB,
        subjects: a.length,
        kappas: WEIGHTS.map((weights) => ({
          weights,
          outcome: attempt(() =>
            cohenKappa(a, b, {
              weights,
              categories,
              confidence,
              quantity,
              raterNames: [raterA, raterB],
            })
          ),
        })),
      });
    }
  }
  let fleiss: KappaAnalysis["fleiss"] = null;
  if (study.observers.length >= 3) {
    const column = new Map(categories.map((c, k) => [c, k]));
    const counts: number[][] = [];
    for (const s of study.subjects) {
      const row = categories.map(() => 0);
      let complete = true;
      for (const o of study.observers) {
        const g = first.get(o)!.get(s);
        if (g === undefined) {
          complete = false;
          break;
        }
        row[column.get(g)!]!++;
      }
      if (complete) counts.push(row);
    }
    fleiss = {
      completeSubjects: counts.length,
      leftOut: study.subjects.length - counts.length,
      outcome: attempt(() => fleissKappa(counts, { categories, quantity })),
    };
  }
  return { categories, pairs, fleiss };
}
