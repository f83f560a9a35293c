/**
 * The shapes of chamber results: the notes that travel with a result, and the LV geometry
 * results (the sex-specific limits with their provenance, a classification, and the class
 * probabilities of a Monte Carlo propagation). Types only, so the display module reads them
 * without importing any computation.
 *
 * @module
 */
import type { Citation, Quantity } from "../core/types.ts";
import type { Propagation } from "../uncertainty/types.ts";

/** The warnings and cautions that travel with a chamber result. */
export interface ResultNotes {
  /** Warnings: values outside their typical ranges, long-axis mismatch. */
  readonly flags: readonly string[];
  /** Cautions, with the clinical caution. */
  readonly cautions: readonly string[];
}

/** Sex for the sex-specific LV mass-index limit. */
export type Sex = "male" | "female";

/** The four patterns of LV geometry. */
export type LvGeometry =
  | "normal"
  | "concentric remodeling"
  | "concentric hypertrophy"
  | "eccentric hypertrophy";

/** One upper limit of normal used to classify LV geometry, with where it comes from. */
export interface LvGeometryLimit {
  /** The quantity limited (relative wall thickness or LV mass index). */
  readonly quantity: Quantity;
  /** Largest normal value, in the quantity's unit; a value above it is increased. */
  readonly upperNormal: number;
  /** The publication the limit comes from. */
  readonly citation: Citation;
  /** True when the number was entered from memory of the publication, not copied from it. */
  readonly fromMemory: boolean;
  /** Where the limit comes from, in words, with "entered from memory" where that is the case. */
  readonly provenance: string;
}

/** The limits that classify LV geometry for one sex. */
export interface LvGeometryLimits {
  /** Upper normal relative wall thickness. */
  readonly relativeWallThickness: LvGeometryLimit;
  /** Upper normal LV mass index (linear method). */
  readonly lvMassIndexGPerM2: LvGeometryLimit;
}

/** The input names of the LV geometry measures (calipers and BSA). */
export type LvGeometryInput =
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm"
  | "bodySurfaceAreaM2";

/** The output names of the LV geometry measures. */
export type LvGeometryOutput = "lvMassG" | "lvMassIndexGPerM2" | "relativeWallThickness";

/** One LV geometry classification. */
export interface LvGeometryClassification {
  /** The class. */
  readonly geometry: LvGeometry;
  /** Upper normal relative wall thickness used. */
  readonly relativeWallThicknessLimit: number;
  /** Upper normal LV mass index used, g/m². */
  readonly lvMassIndexLimitGPerM2: number;
  /** The limits with their provenance. */
  readonly limits: LvGeometryLimits;
  /** Cautions: method of the limits, their provenance, the clinical caution. */
  readonly cautions: readonly string[];
}

/** The probability of each LV geometry class given the uncertainty of the calipers and BSA. */
export interface LvGeometryProbabilities {
  /** Brand for displays. */
  readonly kind: "sonorigor.lvGeometryProbabilities";
  /** Sex whose mass-index limit was used. */
  readonly sex: Sex;
  /** Fraction of Monte Carlo trials in each class (sums to 1). */
  readonly probabilities: Readonly<Record<LvGeometry, number>>;
  /** Monte Carlo standard error of each probability, √(p·(1 − p)/M). */
  readonly standardErrors: Readonly<Record<LvGeometry, number>>;
  /** The class with the largest probability (the first in class order on a tie). */
  readonly mostProbable: LvGeometry;
  /** The Monte Carlo propagation of LV mass, mass index and RWT whose trial-aligned samples were
   * classified. */
  readonly measures: Propagation<LvGeometryInput, LvGeometryOutput>;
  /** The limits with their provenance. */
  readonly limits: LvGeometryLimits;
  /** Number of Monte Carlo trials M. */
  readonly trials: number;
  /** Seed of the run. */
  readonly seed: number;
  /** Warnings of the propagation (draws or model values outside their valid ranges, flags). */
  readonly warnings: readonly string[];
  /** Cautions: the calculation's, the limits' method and provenance, the clinical caution. */
  readonly cautions: readonly string[];
}
