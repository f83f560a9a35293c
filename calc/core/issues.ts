/**
 * Validation issues as messages and errors: every message of the package about a bad value is
 * rendered here from a structured issue, so each names the field, the value received and what was
 * expected (the valid range, the unit, or the choices).
 *
 * @module
 */
import type { ValidationIssue } from "./types.ts";
import { describeValue } from "./text.ts";

/**
 * The message of an issue: who checked, where in the file, the field with its label, what was
 * expected and what was received.
 *
 * @param issue The issue.
 * @returns One sentence, no final period.
 *
 * @example
 * ```ts
 * import { renderIssue } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(
 *   renderIssue({
 *     kind: "range", severity: "error", where: "Continuity valve area (VTI)",
 *     field: "lvotDiameterCm", label: "LVOT diameter", received: "0", expected: "in (0, 5] cm",
 *   }),
 *   "Continuity valve area (VTI): expected 'lvotDiameterCm' (LVOT diameter) in (0, 5] cm, got 0",
 * );
 * ```
 */
export function renderIssue(issue: ValidationIssue): string {
  const at = issue.line !== undefined
    ? `line ${issue.line}, `
    : issue.row !== undefined
    ? `row ${issue.row + 1}, `
    : "";
  const field = `${issue.part ? `the ${issue.part} of ` : ""}'${issue.field}'${
    issue.label && issue.label !== issue.field ? ` (${issue.label})` : ""
  }`;
  const lead = issue.where === "" ? "" : `${issue.where}: `;
  const noun = issue.line !== undefined || issue.row !== undefined ? "column" : "input";
  switch (issue.kind) {
    case "missing":
      return `${lead}${at}missing ${noun} ${field}: expected ${issue.expected}, got ${issue.received}`;
    case "unknown":
      return `${lead}${at}unknown ${noun} ${field}: expected ${issue.expected}, got ${issue.received}`;
    case "typical":
      return `${lead}${at}${field} = ${issue.received} lies outside the typical range ${issue.expected}${
        issue.note ? ` (${issue.note})` : ""
      }: interpret with care`;
    case "notMeasured":
      return `${lead}${at}${field} not measured (empty cell)${issue.note ? `: ${issue.note}` : ""}`;
    case "output":
      return `${lead}${at}output ${field} expected ${issue.expected}, got ${issue.received}`;
    case "constraint":
      return `${lead}${at}expected ${issue.expected}, got ${issue.received}`;
    case "format":
      return `${lead}${at}${
        issue.field === "" ? "" : `${field}: `
      }expected ${issue.expected}, got ${issue.received}`;
    default:
      return `${lead}${at}expected ${field} ${issue.expected}, got ${issue.received}`;
  }
}

/** A TypeError carrying the structured issues behind it (wrong type, unit, name or shape). */
export class InputTypeError extends TypeError {
  /** Every issue found, errors first; the message renders the first error. */
  readonly issues: readonly ValidationIssue[];
  /**
   * Makes the error; prefer {@linkcode issueError}, which renders the message from the issues.
   *
   * @param message The rendered message.
   * @param issues The issues.
   */
  constructor(message: string, issues: readonly ValidationIssue[]) {
    super(message);
    this.name = "TypeError";
    this.issues = issues;
  }
}

/** A RangeError carrying the structured issues behind it (a value outside its valid range, a
 * broken relation between inputs, an impossible output). */
export class InputRangeError extends RangeError {
  /** Every issue found, errors first; the message renders the first error. */
  readonly issues: readonly ValidationIssue[];
  /**
   * Makes the error; prefer {@linkcode issueError}, which renders the message from the issues.
   *
   * @param message The rendered message.
   * @param issues The issues.
   */
  constructor(message: string, issues: readonly ValidationIssue[]) {
    super(message);
    this.name = "RangeError";
    this.issues = issues;
  }
}

const TYPE_KINDS = new Set(["missing", "unknown", "type", "unit", "format"]);

/**
 * The error for a list of issues that holds at least one error: a TypeError for a wrong name,
 * type, unit or shape, a RangeError for a value outside its domain. Its message renders the first
 * error, adding how many more there are; `issues` holds them all.
 *
 * @param issues Issues, at least one with severity "error".
 * @returns The error to throw.
 *
 * @example
 * ```ts
 * import { issueError } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const e = issueError([{ kind: "range", severity: "error", where: "Demo", field: "x",
 *   received: "-1", expected: "in [0, 1]" }]);
 * assert.ok(e instanceof RangeError);
 * assert.equal(e.message, "Demo: expected 'x' in [0, 1], got -1");
 * ```
 */
export function issueError(
  issues: readonly ValidationIssue[],
): InputTypeError | InputRangeError {
  const errors = issues.filter((i) => i.severity === "error");
  const first = errors[0];
  if (first === undefined) {
    throw new TypeError("issueError: expected at least one error among the issues, got none");
  }
  const more = errors.length === 2
    ? " (and 1 more problem)"
    : errors.length > 2
    ? ` (and ${errors.length - 1} more problems)`
    : "";
  const message = renderIssue(first) + more;
  const ordered = [...errors, ...issues.filter((i) => i.severity !== "error")];
  return TYPE_KINDS.has(first.kind)
    ? new InputTypeError(message, ordered)
    : new InputRangeError(message, ordered);
}

/**
 * Throws the error of the first error issue, if there is one.
 *
 * @throws {TypeError | RangeError} As {@linkcode issueError} makes it.
 *
 * @example
 * ```ts
 * import { throwIfErrors } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * throwIfErrors([]); // nothing to report
 * assert.throws(() => throwIfErrors([{ kind: "missing", severity: "error", where: "Demo",
 *   field: "x", received: "nothing", expected: "a value in [0, 1]" }]), TypeError);
 * ```
 */
export function throwIfErrors(issues: readonly ValidationIssue[]): void {
  if (issues.some((i) => i.severity === "error")) throw issueError(issues);
}

/**
 * The error for a setting that must be one of a list of choices (a guideline scheme, a sex, a
 * parameter): a RangeError naming the field, the choices and the value received.
 *
 * @param where Who checks, e.g. "Mitral stenosis grading".
 * @param field The setting's name.
 * @param choices The valid choices.
 * @param got The value received.
 * @returns The error to throw.
 *
 * @example
 * ```ts
 * import { choiceError } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(choiceError("Demo", "sex", ["male", "female"], "x").message,
 *   `Demo: expected 'sex' one of "male", "female", got "x"`);
 * ```
 */
export function choiceError(
  where: string,
  field: string,
  choices: readonly string[],
  got: unknown,
): InputRangeError {
  return issueError([{
    kind: "range",
    severity: "error",
    where,
    field,
    expected: `one of ${choices.map((c) => JSON.stringify(c)).join(", ")}`,
    received: describeValue(got),
  }]) as InputRangeError;
}
