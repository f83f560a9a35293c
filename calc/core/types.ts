/**
 * The shapes every other module reads: quantities, citations, calculations, validation issues
 * and evaluations. Types only: presentation modules import from here without importing any
 * computation, so no module depends on itself through them.
 *
 * @module
 */

/** A closed or half-open interval of allowed values, in a quantity's canonical unit. */
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

/** A published source a reader can open: paper, guideline, standard or textbook. */
export interface Citation {
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

/**
 * A measured or derived quantity, declared once: everything that shows, reads or checks a value
 * of it (calculation inputs and outputs, table columns, chart axes, error messages) takes its
 * label, unit and ranges from here.
 */
export interface Quantity {
  /** Brand used by `isQuantity`. */
  readonly kind: "sonorigor.quantity";
  /** Stable identifier in camelCase, e.g. "lvotDiameter"; also the column name in tables. */
  readonly id: string;
  /** What a clinician calls it, e.g. "LVOT diameter". */
  readonly label: string;
  /** Short symbol for formulas and compact tables, e.g. "d_LVOT". */
  readonly symbol: string;
  /** Canonical unit: a mathjs unit string ("cm", "m/s", "mmHg") or a plain label mathjs does
   * not know ("1" for dimensionless, "%", "dB", "bpm"). */
  readonly unit: string;
  /** One line a practitioner reads without a glossary. */
  readonly description: string;
  /** Physically or mathematically possible values; a value outside is an error. */
  readonly valid: ValueRange;
  /** Values seen in adult practice; a value outside is accepted and flagged. */
  readonly typical?: ValueRange;
  /** Values seen in children, where they differ from adults. */
  readonly typicalPediatric?: ValueRange;
  /** Smallest difference worth showing when no uncertainty is known, in the canonical unit. */
  readonly resolution: number;
  /** True for counts (number of discs, focal zones): only integers are valid. */
  readonly integer: boolean;
  /** Column headers that mean this quantity (compared case- and punctuation-insensitively; the
   * id and the label are always recognised). */
  readonly headers: readonly string[];
  /** Where the ranges come from ("common practice, no source", a citation, "from memory"). */
  readonly rangeNote?: string;
}

/** Which typical range applies: adults by default. */
export type Population = "adult" | "pediatric";

/** One input of a calculation, resolved from its quantity (and the calculation's narrowing). */
export interface InputDefinition {
  /** The quantity measured. */
  readonly quantity: Quantity;
  /** Label of this input: the quantity's, or the role it plays here ("First medium impedance"). */
  readonly label: string;
  /** Canonical unit (the quantity's). */
  readonly unit: string;
  /** What this input is in this calculation. */
  readonly description: string;
  /** Valid values: the quantity's, or the formula's narrower domain. */
  readonly range: ValueRange;
  /** Typical values for adults: the quantity's, or narrowed by the calculation. */
  readonly typical?: ValueRange;
  /** Typical values for children, where they differ. */
  readonly typicalPediatric?: ValueRange;
  /** Why the calculation narrows the quantity's ranges. */
  readonly narrowedBecause?: string;
  /** Value in the canonical unit used when the caller omits the input. */
  readonly default?: number;
}

/** One output of a calculation, resolved from its quantity. */
export interface OutputDefinition {
  /** The quantity computed. */
  readonly quantity: Quantity;
  /** Label of this output (the quantity's unless the calculation names a role). */
  readonly label: string;
  /** Canonical unit (the quantity's). */
  readonly unit: string;
  /** What this output is in this calculation. */
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

/**
 * How a calculation can be made again from the catalog in another thread: by its id, as a member
 * of a family with a parameter (plain data), or as a chain of other recipes. "local" means it was
 * made at run time (an expression model, a test double) and cannot be rebuilt elsewhere.
 */
export type Recipe =
  | { readonly kind: "catalog"; readonly id: string }
  | { readonly kind: "family"; readonly family: string; readonly parameter: unknown }
  | {
    readonly kind: "chain";
    readonly steps: readonly Recipe[];
    readonly options: unknown;
  }
  | { readonly kind: "local"; readonly why: string };

/** A defined calculation: the frozen definition with its resolved inputs and outputs. */
export interface Calculation<I extends string = string, O extends string = string> {
  /** Brand used by `isCalculation`. */
  readonly kind: "sonorigor.calculation";
  /** Stable identifier in camelCase, e.g. "continuityValveArea". */
  readonly id: string;
  /** Short human title. */
  readonly title: string;
  /** What the calculation is for, one or two sentences. */
  readonly description: string;
  /** Inputs by name. */
  readonly inputs: { readonly [K in I]: InputDefinition };
  /** Outputs by name. */
  readonly outputs: { readonly [K in O]: OutputDefinition };
  /** Input names in declaration order. */
  readonly inputNames: readonly I[];
  /** Output names in declaration order. */
  readonly outputNames: readonly O[];
  /** The formula, written once as plain arithmetic on canonical units. */
  readonly formula: (x: InputValues<I>) => OutputValues<O>;
  /** The formula as a reader sees it in docs, e.g. "ΔP = 4·v²". */
  readonly formulaText: string;
  /** Published sources for the formula and its constants. */
  readonly citations: readonly Citation[];
  /** Cautions specific to this calculation. */
  readonly cautions: readonly string[];
  /** Relations between inputs that must hold. */
  readonly constraints: readonly InputConstraint<I>[];
  /** True when a result could reach a patient decision (the clinical caution is shown). */
  readonly clinical: boolean;
  /** How to make this calculation again from the catalog (worker threads). */
  readonly recipe: Recipe;
  /** Optional exact partial derivatives ∂ⁿ output / ∂wrt[0]…∂wrt[n−1] (expression models). */
  partial?(output: O, wrt: readonly I[]): (x: InputValues<I>) => number;
}

/** What input validation needs of a calculation. */
export type InputSchema<I extends string> = Pick<
  Calculation<I, string>,
  "title" | "inputs" | "inputNames" | "constraints"
>;

/** Names of the inputs of a calculation type. */
export type InputsOf<C> = C extends Calculation<infer I, string> ? I : never;
/** Names of the outputs of a calculation type. */
export type OutputsOf<C> = C extends Calculation<string, infer O> ? O : never;

/** What went wrong, or what deserves a flag, with one value. */
export type IssueKind =
  /** A required value was not given. */
  | "missing"
  /** A value was given for a name the calculation or table does not know. */
  | "unknown"
  /** The value is not a number, a quantity string or an uncertain value. */
  | "type"
  /** The quantity string has a unit of another dimension, or one that cannot be read. */
  | "unit"
  /** The value lies outside the valid range (NaN and infinities included). */
  | "range"
  /** A count that is not a whole number. */
  | "integer"
  /** A relation between inputs does not hold. */
  | "constraint"
  /** The formula gave a non-finite output or one outside the output's valid range. */
  | "output"
  /** Warning: the value lies outside the typical range. */
  | "typical"
  /** Warning: an empty cell where a measurement may be missing. */
  | "notMeasured"
  /** The text of a file is malformed (quotes, field count, encoding, delimiter, header). */
  | "format";

/** One finding about one value: the structured form behind every message. */
export interface ValidationIssue {
  /** What went wrong. */
  readonly kind: IssueKind;
  /** "error" stops the computation; "warning" is a flag carried with the result. */
  readonly severity: "error" | "warning";
  /** Who checked: a calculation title or a file name. */
  readonly where: string;
  /** The input name or column header the value belongs to. */
  readonly field: string;
  /** The quantity's label, when the field is a quantity. */
  readonly label?: string;
  /** The part of the value at fault, for a distribution: "standard uncertainty", "lower
   * bound", "degrees of freedom". */
  readonly part?: string;
  /** The value as received, shown: "0", "\"21 mmHg\"", "nothing". */
  readonly received: string;
  /** The value in the canonical unit, when one could be read. */
  readonly value?: number;
  /** The canonical unit. */
  readonly unit?: string;
  /** The valid (or, for a warning, typical) range the value was checked against. */
  readonly range?: ValueRange;
  /** What was expected, in words: "in (0, 5] cm", "one of a, b". */
  readonly expected: string;
  /** 0-based data row of a table. */
  readonly row?: number;
  /** 1-based line of a file. */
  readonly line?: number;
  /** Why the range is what it is, when a calculation narrows it ("the BSA range of the
   * population the model was built on"). */
  readonly note?: string;
}

/** The validated result of one evaluation. */
export interface Evaluation<I extends string = string, O extends string = string> {
  /** Brand for displays. */
  readonly kind: "sonorigor.evaluation";
  /** The calculation that produced it. */
  readonly calculation: Calculation<I, O>;
  /** Inputs in canonical units. */
  readonly inputs: InputValues<I>;
  /** Outputs in their units. */
  readonly outputs: OutputValues<O>;
  /** Warnings as messages: inputs outside their typical range. */
  readonly flags: readonly string[];
  /** The warnings as structured issues. */
  readonly issues: readonly ValidationIssue[];
  /** Cautions of the calculation, with the clinical caution where it applies. */
  readonly cautions: readonly string[];
}

/** A Jupyter MIME bundle: MIME type → content. */
export type MimeBundle = Record<string, unknown>;

/** One point of a sensitivity curve. */
export interface SensitivityPoint {
  /** Value of the swept input. */
  readonly x: number;
  /** Value of the output. */
  readonly y: number;
  /** Change of the output relative to its value at the reference inputs (`reference.y`), in
   * percent: `relativeChangePercent(y, reference.y)`, the package's one definition. */
  readonly relativeChangePercent: number;
}

/** A sensitivity curve with its labels. */
export interface SensitivityCurve {
  /** Calculation title. */
  readonly title: string;
  /** Swept input name. */
  readonly input: string;
  /** Label of the swept input (its quantity's). */
  readonly inputLabel: string;
  /** Unit of the swept input. */
  readonly inputUnit: string;
  /** Followed output name. */
  readonly output: string;
  /** Label of the followed output (its quantity's). */
  readonly outputLabel: string;
  /** Unit of the followed output. */
  readonly outputUnit: string;
  /** Reference value of the swept input and of the output. */
  readonly reference: { readonly x: number; readonly y: number };
  /** The points, in sweep order. */
  readonly points: readonly SensitivityPoint[];
}
