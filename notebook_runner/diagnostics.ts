/**
 * Failure diagnostics of a notebook run: where and why a cell failed, the source line behind a
 * kernel error (the kernel reports positions in transpiled JavaScript), syntax errors located by
 * the TypeScript parser of the same deno binary, and the multi-line report printed on stderr.
 *
 * @module
 */
import { stripAnsi } from "./html.ts";

/** Where and how a cell failed. */
export interface CellFailure {
  /** Why: the kernel reported an error, the cell timed out, the kernel died, or the run was aborted. */
  kind: "error" | "timeout" | "died" | "aborted";
  /** 1-based position of the cell among all cells. */
  cellNumber: number;
  /** Total number of cells. */
  cellCount: number;
  /** Cell id. */
  cellId: string;
  /** Execution count of the failing cell, when the kernel gave one. */
  executionCount: number | null;
  /** Error class name. */
  ename: string;
  /** Error message. */
  evalue: string;
  /** Traceback lines, ANSI codes removed. */
  traceback: string[];
  /** The source line that failed, when it could be located. */
  line?: SourceLine;
  /** What the kernel wrote to its own stderr during the cell (e.g. a syntax error's details). */
  kernelStderr?: string;
}

/** A located source line of a cell. */
export interface SourceLine {
  /** 1-based line number in the cell. */
  number: number;
  /** The line's text. */
  text: string;
  /**
   * How it was found: "name" when a name from the error message occurs on it, "message" when
   * the thrown message text does, "parser" for a syntax error found by the TypeScript parser,
   * "position" when only the kernel's line number was used (the kernel numbers lines after
   * transpiling TypeScript, so that one can be off by a few lines).
   */
  how: "name" | "message" | "parser" | "position";
}

/**
 * Locates the source line of a cell error. The Deno kernel reports positions in the transpiled
 * JavaScript, so a name quoted in the message (e.g. `'lvotDiameterCm'`, `x is not defined`) or the
 * thrown message text is searched first, nearest to the reported line; the reported line is the
 * fallback.
 *
 * @param source The cell source.
 * @param evalue The error message.
 * @param traceback The traceback lines (ANSI removed).
 * @returns The line, or undefined when nothing fits.
 */
export function locateErrorLine(
  source: string,
  evalue: string,
  traceback: readonly string[],
): SourceLine | undefined {
  const lines = source.split("\n");
  let reported: number | undefined;
  for (const entry of traceback) {
    const match = /<anonymous>:(\d+):\d+/.exec(entry);
    if (match?.[1] !== undefined) {
      reported = Number(match[1]);
      break;
    }
  }
  const nearest = (candidates: number[]): number | undefined =>
    candidates.sort((a, b) =>
      Math.abs(a - (reported ?? a)) - Math.abs(b - (reported ?? b)) || a - b
    )[0];
  const pick = (predicate: (line: string) => boolean): number | undefined =>
    nearest(lines.flatMap((line, i) => (predicate(line) ? [i + 1] : [])));
  const isCode = (line: string) => line.trim() !== "" && !/^\s*(\/\/|\*|\/\*)/.test(line);
  const names = new Set<string>();
  for (const m of evalue.matchAll(/['"`]([A-Za-z_$][\w$.]*)['"`]/g)) names.add(m[1]!);
  for (
    const m of evalue.matchAll(/\b([A-Za-z_$][\w$.]*) is not (?:defined|a function|iterable)/g)
  ) {
    names.add(m[1]!.split(".").pop()!);
  }
  for (const m of evalue.matchAll(/reading '([^']+)'/g)) names.add(m[1]!);
  if (names.size > 0) {
    const escaped = [...names].map((n) => n.replace(/[.*+?^${}()|[\]\\]/g, "\\$&"));
    const re = new RegExp(`(^|[^\\w$])(${escaped.join("|")})(?![\\w$])`);
    const at = pick((line) => isCode(line) && re.test(line));
    if (at !== undefined) return { number: at, text: lines[at - 1]!, how: "name" };
  }
  const message = evalue.trim();
  if (message.length >= 3) {
    const at = pick((line) => isCode(line) && line.includes(message));
    if (at !== undefined) return { number: at, text: lines[at - 1]!, how: "message" };
  }
  if (reported !== undefined && reported >= 1 && reported <= lines.length) {
    return { number: reported, text: lines[reported - 1]!, how: "position" };
  }
  return undefined;
}

/**
 * Formats a failure as the multi-line report printed on stderr.
 *
 * @param path The notebook path.
 * @param failure The failure.
 * @returns The report text.
 */
export function formatFailure(path: string, failure: CellFailure): string {
  const what = {
    error: "failed",
    timeout: "timed out",
    died: "lost its kernel",
    aborted: "was interrupted",
  }[failure.kind];
  const count = failure.executionCount === null
    ? ""
    : `, execution count ${failure.executionCount}`;
  const out = [
    `${path}: cell ${failure.cellNumber} of ${failure.cellCount} ${what} (id ${failure.cellId}${count})`,
    `  ${failure.ename}: ${failure.evalue}`,
  ];
  if (failure.line !== undefined) {
    const where = failure.line.how === "position" ? "near" : "at";
    out.push(`  ${where} line ${failure.line.number} of the cell: ${failure.line.text.trim()}`);
  }
  if (failure.traceback.length > 0) {
    out.push("  traceback:");
    for (const entry of failure.traceback) {
      for (const line of entry.split("\n")) out.push(`    ${line}`);
    }
  }
  if (failure.kernelStderr !== undefined && failure.kernelStderr.trim() !== "") {
    out.push("  kernel stderr:");
    for (const line of failure.kernelStderr.trim().split("\n").slice(-20)) out.push(`    ${line}`);
  }
  return out.join("\n");
}

/**
 * Finds a syntax error in cell source with the TypeScript parser of a deno binary (`deno fmt
 * --ext=ts -` parses without running anything and reports the first error with its position).
 *
 * @param denoPath The deno binary.
 * @param source The cell source.
 * @returns The message and the located line, or undefined when the source parses (or the check
 *   itself cannot run).
 */
export async function diagnoseSyntax(
  denoPath: string,
  source: string,
): Promise<{ message: string; line: SourceLine } | undefined> {
  let output: Deno.CommandOutput;
  try {
    const child = new Deno.Command(denoPath, {
      args: ["fmt", "--ext=ts", "-"],
      env: { NO_COLOR: "1", DENO_NO_UPDATE_CHECK: "1" },
      stdin: "piped",
      stdout: "null",
      stderr: "piped",
    }).spawn();
    const writer = child.stdin.getWriter();
    await writer.write(new TextEncoder().encode(source));
    await writer.close();
    output = await child.output();
  } catch {
    return undefined;
  }
  if (output.success) return undefined;
  const text = stripAnsi(new TextDecoder().decode(output.stderr));
  const message = /SyntaxError: (.+)/.exec(text)?.[1]?.trim();
  const position = /_stdin\.ts:(\d+):\d+/.exec(text)?.[1];
  if (message === undefined || position === undefined) return undefined;
  const number = Number(position);
  const lines = source.split("\n");
  if (!(number >= 1 && number <= lines.length)) return undefined;
  return { message, line: { number, text: lines[number - 1]!, how: "parser" } };
}
