/**
 * Types shared by every calculation: the one-definition shape.
 *
 * A calculation is declared once with {@linkcode defineCalculation}; evaluation, validation,
 * uncertainty propagation, sensitivity curves and reference docs all read this shape.
 *
 * @module
 */

/** A closed or half-open interval of allowed values, in an input's canonical unit. */
export interface ValueRange {
  /** Smallest allowed value. */
  readonly min: number;
  /** Largest allowed value. */
  readonly max: number;
  /** When true the minimum itself is not allowed. @default false */
  readonly minExclusive?: boolean;
  /** When true the maximum itself is not allowed. @default false */
  readonly maxExclusive?: boolean;
}

/** A published source a reader can open. */
export interface Reference {
  /** Authors, e.g. "Baumgartner H, Hung J, Bermejo J, et al." */
  readonly authors: string;
  /** Year of publication (0 when there is none, e.g. a user-supplied model; shown as "n.d."). */
  readonly year: number;
  /** Title of the paper, standard or book. */
  readonly title: string;
  /** Journal, standard body or publisher with volume and pages. */
  readonly publication: string;
  /** Equation, table or clause used, e.g. "Table 3". */
  readonly locator?: string;
  /** DOI without the resolver prefix, when one exists. */
  readonly doi?: string;
}

/** One named input of a calculation. */
export interface InputDefinition {
  /** Canonical unit. A mathjs unit string ("cm", "m/s", "deg", "mmHg") or a plain label for
   * quantities mathjs does not know ("1" for dimensionless, "dB", "bpm"). */
  readonly unit: string;
  /** One-line description a practitioner reads without a glossary. */
  readonly description: string;
  /** Physically or mathematically valid domain; a value outside is an error. */
  readonly range: ValueRange;
  /** Range in which the formula has been validated or is used in practice; a value outside is
   * accepted but flagged. */
  readonly typical?: ValueRange;
  /** Default value in the canonical unit, used when the caller omits the input. */
  readonly default?: number;
}

/** One named output of a calculation. */
export interface OutputDefinition {
  /** Unit of the output (mathjs unit string or plain label). */
  readonly unit: string;
  /** One-line description. */
  readonly description: string;
}

/** Input values in canonical units, keyed by input name. */
export type InputValues<I extends string> = { readonly [K in I]: number };
/** Output values, keyed by output name. */
export type OutputValues<O extends string> = { [K in O]: number };

/** A relation between inputs that must hold, e.g. end-systolic ≤ end-diastolic volume. */
export interface InputConstraint<I extends string> {
  /** The inputs involved, named in the error message with their values. */
  readonly inputs: readonly I[];
  /** The relation in words, e.g. "'endSystolicVolumeMl' <= 'endDiastolicVolumeMl'". */
  readonly description: string;
  /** True when the relation holds (false for NaN). */
  readonly holds: (x: InputValues<I>) => boolean;
}

/** Everything a calculation author writes, once. */
export interface CalculationSpec<I extends string, O extends string> {
  /** Stable identifier in camelCase, e.g. "continuityValveArea". */
  readonly id: string;
  /** Short human title. */
  readonly title: string;
  /** What the calculation is for, one or two sentences. */
  readonly description: string;
  /** Named inputs with canonical units and ranges. */
  readonly inputs: { readonly [K in I]: InputDefinition };
  /** Named outputs with units. */
  readonly outputs: { readonly [K in O]: OutputDefinition };
  /** The formula, written once as plain arithmetic on canonical units. */
  readonly formula: (x: InputValues<I>) => OutputValues<O>;
  /** The formula as a reader sees it in docs, e.g. "ΔP = 4·v²". */
  readonly formulaText: string;
  /** Published sources for the formula and its constants. */
  readonly sources: readonly Reference[];
  /** Cautions specific to this calculation. */
  readonly cautions: readonly string[];
  /** Relations between inputs that must hold; a violation is a RangeError naming the inputs. */
  readonly constraints?: readonly InputConstraint<I>[];
  /** True when a result could reach a patient decision: the standard clinical caution is shown.
   * @default false */
  readonly clinical?: boolean;
  /** Optional exact partial derivatives of any order: returns ∂ⁿ output / ∂wrt[0]…∂wrt[n−1] as a
   * function of the inputs. Used by the GUM law instead of finite differences (expression models
   * supply symbolic derivatives here). */
  partial?(output: O, wrt: readonly I[]): (x: InputValues<I>) => number;
}

/** A defined calculation: the frozen spec plus the derived input order. */
export interface Calculation<I extends string = string, O extends string = string>
  extends CalculationSpec<I, O> {
  /** Input names in declaration order. */
  readonly inputNames: readonly I[];
  /** Output names in declaration order. */
  readonly outputNames: readonly O[];
  /** Brand used by {@linkcode isCalculation}. */
  readonly kind: "sonorigor.calculation";
}

/** What input validation needs of a calculation: its title, inputs and constraints. A plain
 * function with calculation-style arguments can describe its own arguments this way. */
export type InputSchema<I extends string> = Pick<
  Calculation<I, string>,
  "title" | "inputs" | "inputNames" | "constraints"
>;

/** Names of the inputs of a calculation type. */
export type InputsOf<C> = C extends Calculation<infer I, string> ? I : never;
/** Names of the outputs of a calculation type. */
export type OutputsOf<C> = C extends Calculation<string, infer O> ? O : never;
