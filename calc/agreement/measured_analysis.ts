/**
 * The statistics of a method-validation study of measurements: repeatability of each observer
 * from its replicates, each method against the reference (Bland–Altman, repeated-measures
 * Bland–Altman, concordance, Deming and Passing–Bablok regression), and the intraclass
 * correlation across observers. Every loop is linear in the number of readings (indexes by
 * subject), so large tables cost time in proportion to their size.
 *
 * @module
 */
import { attempt } from "./checks.ts";
import { blandAltman, blandAltmanRepeated } from "./bland_altman.ts";
import { repeatability } from "./repeatability.ts";
import { concordanceCorrelation } from "./concordance.ts";
import { demingRegression, passingBablokRegression } from "./regression.ts";
import { intraclassCorrelations } from "./icc.ts";
import type { MeasuredReadings } from "./validation_table.ts";
import type {
  IccAnalysis,
  MethodComparison,
  ObserverRepeatability,
  Outcome,
} from "./report_types.ts";
import type { Measured } from "./types.ts";

/** Settings shared by the statistics of a study. */
export interface StudySettings {
  /** Multiplier of limits and repeatability coefficients. */
  readonly multiplier: number;
  /** Confidence level. */
  readonly confidence: number;
  /** What was measured. */
  readonly quantity: Measured;
}

/** Readings by observer, then replicate, then subject. */
type ReadingIndex = Map<string, Map<number, Map<string, number>>>;

/** Indexes readings by observer, replicate and subject (one pass). */
export function indexReadings(readings: MeasuredReadings["readings"]): ReadingIndex {
  const index: ReadingIndex = new Map();
  for (const r of readings) {
    let byReplicate = index.get(r.observer);
    if (!byReplicate) index.set(r.observer, byReplicate = new Map());
    let bySubject = byReplicate.get(r.replicate);
    if (!bySubject) byReplicate.set(r.replicate, bySubject = new Map());
    bySubject.set(r.subject, r.value);
  }
  return index;
}

/**
 * Repeatability of each observer from all its replicates (subjects with fewer than two readings
 * left out); null when no subject has replicates.
 */
export function repeatabilityByObserver(
  study: MeasuredReadings,
  settings: StudySettings,
): ObserverRepeatability[] | null {
  if (study.maxReplicate < 2) return null;
  const groups = new Map<string, Map<string, number[]>>();
  for (const o of study.observers) groups.set(o, new Map());
  for (const r of study.readings) {
    const bySubject = groups.get(r.observer)!;
    const list = bySubject.get(r.subject);
    if (list) list.push(r.value);
    else bySubject.set(r.subject, [r.value]);
  }
  return study.observers.map((observer) => {
    const usable: number[][] = [];
    let leftOut = 0;
    for (const values of groups.get(observer)!.values()) {
      if (values.length >= 2) usable.push(values);
      else leftOut++;
    }
    return {
      observer,
      subjectsUsed: usable.length,
      subjectsLeftOut: leftOut,
      outcome: attempt(() =>
        repeatability(usable, {
          multiplier: settings.multiplier,
          confidence: settings.confidence,
          quantity: settings.quantity,
        })
      ),
    };
  });
}

const notComputed = (reason: string) => ({ status: "not computed", reason }) as const;

/**
 * Every pair of observers, on first readings: first each observer other than the reference
 * against the reference, then each pair of the other observers (the later in the table against
 * the earlier); the repeated-measures Bland–Altman on all replicates paired by number; Deming's
 * error variance ratio from the two observers' repeatability when both are known, else 1.
 */
export function methodComparisons(
  study: MeasuredReadings,
  reference: string,
  repeatabilities: readonly ObserverRepeatability[] | null,
  settings: StudySettings,
): MethodComparison[] {
  const index = indexReadings(study.readings);
  const { multiplier, confidence, quantity } = settings;
  const swOf = (observer: string): number | null => {
    const r = repeatabilities?.find((x) => x.observer === observer)?.outcome;
    return r?.status === "computed" ? r.result.withinSubjectSd : null;
  };
  const firstOf = (observer: string) => index.get(observer)?.get(1) ?? new Map<string, number>();
  const others = study.observers.filter((o) => o !== reference);
  const pairs: [string, string, MethodComparison["against"]][] = others.map((
    o,
  ) => [o, reference, "reference"]);
  others.forEach((earlier, i) => {
    for (const later of others.slice(i + 1)) pairs.push([later, earlier, "observer"]);
  });
  return pairs.map(([test, reference, against]) => {
    const xs = firstOf(reference);
    const ys = firstOf(test);
    const subjects: string[] = [];
    const x: number[] = [];
    const y: number[] = [];
    for (const s of study.subjects) {
      const xv = xs.get(s);
      const yv = ys.get(s);
      if (xv === undefined || yv === undefined) continue;
      subjects.push(s);
      x.push(xv);
      y.push(yv);
    }
    const swX = swOf(reference);
    const swY = swOf(test);
    const lambda = swX !== null && swY !== null
      ? { value: (swY / swX) ** 2, from: "replicates" as const }
      : { value: 1, from: "assumed" as const };
    const common = {
      test,
      reference,
      against,
      subjects,
      subjectsLeftOut: study.subjects.length - subjects.length,
      x,
      y,
      errorVarianceRatio: lambda,
    };
    if (subjects.length < 3) {
      const why = notComputed(
        `Method comparison: expected at least 3 subjects with a first reading by both ${test} and ${reference}, got ${subjects.length}`,
      );
      return {
        ...common,
        blandAltman: why,
        blandAltmanRepeated: study.maxReplicate > 1 ? why : null,
        concordance: why,
        deming: why,
        passingBablok: why,
      };
    }
    const xy = { confidence, quantity, methodNames: [reference, test] as const };
    return {
      ...common,
      blandAltman: attempt(() =>
        blandAltman(y, x, { multiplier, confidence, quantity, methodNames: [test, reference] })
      ),
      blandAltmanRepeated: study.maxReplicate > 1
        ? repeatedPairs(index, study, test, reference, multiplier, quantity)
        : null,
      concordance: attempt(() => concordanceCorrelation(x, y, xy)),
      deming: attempt(() => demingRegression(x, y, { ...xy, errorVarianceRatio: lambda.value })),
      passingBablok: attempt(() => passingBablokRegression(x, y, xy)),
    };
  });
}

function repeatedPairs(
  index: ReadingIndex,
  study: MeasuredReadings,
  test: string,
  reference: string,
  multiplier: number,
  quantity: Measured,
): Outcome<ReturnType<typeof blandAltmanRepeated>> {
  const ids: string[] = [];
  const a: number[] = [];
  const b: number[] = [];
  for (const s of study.subjects) {
    for (let rep = 1; rep <= study.maxReplicate; rep++) {
      const xv = index.get(reference)?.get(rep)?.get(s);
      const yv = index.get(test)?.get(rep)?.get(s);
      if (xv === undefined || yv === undefined) continue;
      ids.push(s);
      a.push(yv);
      b.push(xv);
    }
  }
  return attempt(() =>
    blandAltmanRepeated(ids, a, b, { multiplier, quantity, methodNames: [test, reference] })
  );
}

/** The six intraclass correlations across all observers, on first readings of the subjects read
 * by every observer; null with fewer than two observers. */
export function iccAcrossObservers(
  study: MeasuredReadings,
  settings: StudySettings,
): IccAnalysis | null {
  if (study.observers.length < 2) return null;
  const index = indexReadings(study.readings);
  const columns = study.observers.map((o) => index.get(o)?.get(1) ?? new Map<string, number>());
  const rows: number[][] = [];
  const leftOut: string[] = [];
  for (const s of study.subjects) {
    const row: number[] = [];
    for (const c of columns) {
      const v = c.get(s);
      if (v === undefined) break;
      row.push(v);
    }
    if (row.length === columns.length) rows.push(row);
    else leftOut.push(s);
  }
  return {
    observers: study.observers,
    completeSubjects: rows.length,
    leftOut,
    outcome: attempt(() =>
      intraclassCorrelations(rows, {
        confidence: settings.confidence,
        quantity: settings.quantity,
      })
    ),
  };
}
