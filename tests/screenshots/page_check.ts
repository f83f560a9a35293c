/// <reference lib="dom" />
/**
 * What a reader of an exported notebook or of the validation report sees, checked in headless
 * Chromium (Debian's package, driven by playwright-core): each page is opened, screenshotted
 * into out/test-artifacts/screenshots/ (gitignored; kept for a person to look at), and what it
 * shows is read back for three rules (issue 16, "Must show"):
 *
 * 1. no raw object dump: no cell output whose text opens with `{`;
 * 2. no code identifier in an axis or legend title: none of the catalog's input and output
 *    names and quantity ids written in camelCase, and no snake_case word unless the page's
 *    tables show that very word as a name (a label from the user's own file);
 * 3. a unit in every numeric table column: in its header, or in the label of every row when the
 *    rows carry different units (an uncertainty budget); dimensionless statistics and counts
 *    are named in {@linkcode UNITLESS_HEADER};
 * 4. (the issue's "titles wrap instead of clipping") no chart title, axis or legend title or
 *    legend label cut short with "…" or drawn beyond the edge of its figure;
 * 5. (the issue's "16-digit numbers") no number shown with 9 or more significant digits.
 *
 * The rules are pure functions of a {@linkcode PageSnapshot}, tested on their own in
 * page_check_test.ts; the browser only reads the page.
 */
import { type Browser, chromium, type Page } from "playwright-core";
import { CATALOG, catalogCalculations, formatUnit, QUANTITIES } from "../../mod.ts";

/** The Chromium binary (Debian's package; `SONORIGOR_CHROMIUM` to use another). */
export const CHROMIUM = Deno.env.get("SONORIGOR_CHROMIUM") ?? "/usr/bin/chromium";

/** Whether Chromium is installed (the browser tests are reported as ignored when not). */
export const CHROMIUM_AVAILABLE = await Deno.stat(CHROMIUM).then((s) => s.isFile).catch(() =>
  false
);

/** Where the screenshots are kept (out/ is gitignored). */
export const SCREENSHOTS = new URL("../../out/test-artifacts/screenshots/", import.meta.url)
  .pathname;

/** What a page shows, as read in the browser. */
export interface PageSnapshot {
  /** The text of each cell output (or report section), trimmed. */
  outputs: string[];
  /** The title of each chart axis and legend. */
  axisTitles: string[];
  /** Each table of an output: its column headers and the text of its body cells. */
  tables: { headers: string[]; rows: string[][] }[];
  /**
   * Chart titles, axis and legend titles and legend labels that a reader cannot read whole: cut
   * short with "…", or drawn partly outside their figure; each with what was measured.
   */
  clippedTexts: { text: string; problem: string }[];
}

/** A rule broken on a page. */
export interface Defect {
  /** Which rule. */
  rule:
    | "raw object dump"
    | "code identifier in a chart title"
    | "numeric column without a unit"
    | "chart text clipped"
    | "unrounded number";
  /** What was shown, quoted, and where. */
  detail: string;
}

const escape = (s: string) => s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");

/** A name that reads as code: camelCase (a lower-case letter then a capital) or with a digit. */
const CODE_LIKE = /[a-z][A-Z]|[a-zA-Z]\d/;

/**
 * The code identifiers no chart title may show: every input and output name of the catalog's
 * calculations and every quantity id that reads as code (camelCase or with a digit; a one-word
 * lower-case id such as "height" is also an English word and is left out), plus any
 * snake_case word (which {@linkcode findDefects} accepts where the page's tables show it as a
 * name).
 */
export function forbiddenIdentifiers(): RegExp {
  const names = new Set<string>();
  for (const c of catalogCalculations(CATALOG)) {
    for (const n of [...c.inputNames, ...c.outputNames]) names.add(n);
  }
  for (const q of QUANTITIES.values()) names.add(q.id);
  const code = [...names].filter((n) => CODE_LIKE.test(n)).sort((a, b) => b.length - a.length);
  return new RegExp(`\\b(?:${code.map(escape).join("|")}|[A-Za-z]+(?:_[A-Za-z0-9]+)+)\\b`);
}

/** Units a header may name: every quantity's unit as printed, and the report's own. */
const UNITS: ReadonlySet<string> = new Set([
  ...[...QUANTITIES.values()].map((q) => formatUnit(q.unit)).filter((u) => u !== ""),
  "%",
  "points",
  "percentage points",
  "s",
  "mm",
]);

/**
 * Headers of columns that have no unit by nature: dimensionless statistics (Z-score, ICC, CCC,
 * kappa, r, p, z, F, t, degrees of freedom ν, coverage factor k, slope, ratio, CV, share,
 * probability, correlation, a cusum test statistic, observed or chance agreement, E[…] of a
 * dimensionless variable)
 * and counts (n, pairs, readings, patients, subjects, studies, trials, readers, replicates,
 * beats, rows), and the labels of dimensionless quantities.
 */
export const UNITLESS_HEADER = new RegExp(
  [
    String
      .raw`z-score|\bicc\b|\bccc\b|kappa|κ|\br\b|\bp\b|p \(|\bz\b|\bf\b|\bt\b|ν|degrees of freedom`,
    String.raw`\bk\b|coverage factor|slope|ratio|\bcv\b|share|probability|^p\(|e\[|c_b|scale shift`,
    String
      .raw`location shift|correlation|cusum|observed agreement|chance agreement|expected agreement`,
    String
      .raw`\bn\b|count|pairs|readings|patients|subjects|studies|trials|readers|replicates|beats|rows`,
    ...[...QUANTITIES.values()].filter((q) => formatUnit(q.unit) === "").map((q) =>
      escape(q.label.toLowerCase())
    ),
  ].join("|"),
  "i",
);

/** A cell holding only a number, an interval of numbers or "a to b" (no unit written). */
function isBareNumber(cell: string): boolean {
  const n = String.raw`[−+-]?(?:\d[\d,]*(?:\.\d+)?|\.\d+)(?:e[−+-]?\d+)?`;
  return new RegExp(String.raw`^(?:${n}|\[${n}, ${n}\]|${n} to ${n}|${n} ± ${n})$`, "i")
    .test(cell.trim());
}

/**
 * A number shown with 9 or more significant digits (floating-point output never rounded for a
 * reader, such as 4.266666666666667): no measurement in echocardiography has that many.
 */
function unrounded(text: string): { number: string; index: number } | undefined {
  for (const m of text.matchAll(/(?<![\w.])\d+\.\d+(?![\w.])/g)) {
    const significant = m[0].replace(".", "").replace(/^0+/, "");
    if (significant.length >= 9) return { number: m[0], index: m.index };
  }
  return undefined;
}

/** Headers of interval columns: "95 % CI", "outer 95 % bounds", "interval". */
const INTERVAL_HEADER = /\bCI\b|bounds|interval/i;

const MISSING = /^(?:|—|-|–|not measured|n\/a|none)$/i;

/** Whether a text names a unit in parentheses or brackets: "LVOT diameter (cm)", "[mm]". */
function namesUnit(text: string): boolean {
  for (const m of text.matchAll(/[([]([^()[\]]+)[)\]]/g)) {
    // "points²" is a unit squared; "cm, exact" a unit with a note
    const parts = m[1]!.split(/[,;]\s*/).map((part) => part.trim());
    if (parts.some((part) => UNITS.has(part) || UNITS.has(part.replace(/[²³]$/, "")))) {
      return true;
    }
  }
  return false;
}

/**
 * The defects of one page under the three rules.
 *
 * @param page What the page shows.
 * @param forbidden The code identifiers (see {@linkcode forbiddenIdentifiers}).
 * @returns Every defect, in page order.
 */
export function findDefects(page: PageSnapshot, forbidden: RegExp): Defect[] {
  const defects: Defect[] = [];
  for (const [i, text] of page.outputs.entries()) {
    if (text.startsWith("{")) {
      defects.push({
        rule: "raw object dump",
        detail: `output ${i + 1} opens with "${text.slice(0, 60).replace(/\s+/g, " ")}…"`,
      });
    }
  }
  for (const [i, text] of page.outputs.entries()) {
    const long = unrounded(text);
    if (long) {
      const at = Math.max(0, long.index - 30);
      defects.push({
        rule: "unrounded number",
        detail: `output ${i + 1} shows ${long.number} ("…${
          text.slice(at, long.index + long.number.length + 10).replace(/\s+/g, " ")
        }…")`,
      });
    }
  }
  // a snake_case word the page's own tables show as a name (an observer called "sonographer_A"
  // in the user's file) is that name, not code; a catalog identifier never is
  const tableWords = new Set(
    page.tables.flatMap((t) => [...t.headers, ...t.rows.flat()]).flatMap((c) =>
      c.match(/[A-Za-z0-9]+(?:_[A-Za-z0-9]+)+/g) ?? []
    ),
  );
  const global = new RegExp(forbidden.source, "g");
  for (const title of page.axisTitles) {
    const found = [...title.matchAll(global)].map((m) => m[0])
      .find((word) => !(word.includes("_") && tableWords.has(word)));
    if (found !== undefined) {
      defects.push({
        rule: "code identifier in a chart title",
        detail: `"${title}" shows \`${found}\``,
      });
    }
  }
  for (const { text, problem } of page.clippedTexts) {
    defects.push({ rule: "chart text clipped", detail: `"${text}" ${problem}` });
  }
  for (const [t, table] of page.tables.entries()) {
    table.headers.forEach((header, column) => {
      const cells = table.rows.map((r) => r[column] ?? "").filter((c) => !MISSING.test(c.trim()));
      if (cells.length === 0 || !cells.every(isBareNumber)) return;
      // an interval column is read with the estimate to its left ("ICC | 95 % CI")
      let judged = column;
      while (judged > 0 && INTERVAL_HEADER.test(table.headers[judged] ?? "")) judged--;
      const about = table.headers[judged] ?? "";
      if (namesUnit(about) || UNITLESS_HEADER.test(about)) return;
      if (judged !== column && namesUnit(header)) return;
      // a unit per row: each row's label, left of the column, names its unit or is a
      // dimensionless statistic or a count (uncertainty budgets, "Statistic | Estimate" tables)
      const unlabelled = table.rows.find((r) =>
        !r.slice(0, judged).some((c) =>
          !isBareNumber(c) && (namesUnit(c) || UNITLESS_HEADER.test(c))
        )
      );
      if (unlabelled === undefined) return;
      const label = unlabelled.slice(0, judged).filter((c) => !isBareNumber(c)).join(" | ");
      const row = table.rows.length > 1 && label !== "" ? ` (row "${label}")` : "";
      defects.push({
        rule: "numeric column without a unit",
        detail: `table ${t + 1} (${table.headers.filter(Boolean).join(" | ")}): column "${
          header || `#${column + 1}`
        }" holds numbers such as "${
          isBareNumber(unlabelled[column] ?? "") ? unlabelled[column] : cells[0]
        }"${row} and names no unit`,
      });
    });
  }
  return defects;
}

/** A page to check: a name (for the screenshot file) and the HTML file. */
export interface PageToCheck {
  /** Short name, used for the screenshot file (`<name>.png`). */
  name: string;
  /** The HTML file (absolute path). */
  path: string;
}

/** What the browser found on a page: the snapshot, problems loading it, the screenshot. */
export interface PageReading {
  /** The page. */
  page: PageToCheck;
  /** What it shows. */
  snapshot: PageSnapshot;
  /** Console errors, page errors and network requests (a self-contained page has none). */
  problems: string[];
  /** The screenshot file. */
  screenshot: string;
}

/** Headless Chromium as the tests run it: no network services, no sandbox (containers). */
export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-background-networking",
      "--no-first-run",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/**
 * Opens a local HTML file in a new 1000 × 800 tab and collects what a self-contained page must
 * not have: console errors, page errors and requests to the network.
 *
 * @param browser The browser.
 * @param path The HTML file (absolute path).
 * @returns The tab and the problems list, which fills as the page runs.
 */
export async function openPage(
  browser: Browser,
  path: string,
): Promise<{ tab: Page; problems: string[] }> {
  const tab = await browser.newPage({ viewport: { width: 1000, height: 800 } });
  const problems: string[] = [];
  tab.on("console", (m) => {
    if (m.type() === "error") problems.push(`console error: ${m.text()}`);
  });
  tab.on("pageerror", (e) => problems.push(`page error: ${e}`));
  tab.on("request", (r) => {
    if (!r.url().startsWith("file:") && !r.url().startsWith("data:")) {
      problems.push(`network request: ${r.url()}`);
    }
  });
  await tab.goto(`file://${path}`);
  return { tab, problems };
}

/**
 * Opens each page in headless Chromium (one browser for all), saves a full-page screenshot and
 * reads back what the page shows.
 *
 * @param pages The pages.
 * @returns One reading per page, in order.
 */
export async function readPages(pages: readonly PageToCheck[]): Promise<PageReading[]> {
  await Deno.mkdir(SCREENSHOTS, { recursive: true });
  const browser = await launchChromium();
  const readings: PageReading[] = [];
  try {
    for (const page of pages) {
      const { tab, problems } = await openPage(browser, page.path);
      const snapshot: PageSnapshot = await tab.evaluate(() => {
        const text = (e: Element | null) => ((e as HTMLElement | null)?.innerText ?? "").trim();
        // an SVG text wrapped over lines (one tspan a line) reads with a space between lines
        const svgText = (t: Element) => {
          const lines = [...t.querySelectorAll("tspan")].map((l) => (l.textContent ?? "").trim());
          return (lines.length > 0 ? lines.join(" ") : t.textContent ?? "").trim();
        };
        // a notebook export: its cell outputs; the validation report: its sections
        const notebook = document.querySelector("main.notebook") !== null;
        const outputs = notebook
          ? [...document.querySelectorAll(".cell.code .output:not(.error) > .body")].map(text)
          : [...document.querySelectorAll("body > *, section, article")].map(text);
        const scope = notebook ? ".cell.code .outputs " : "";
        const axisTitles = [
          ...document.querySelectorAll(
            "svg .role-axis-title text, svg .role-legend-title text, " +
              'svg [aria-label$="axis label"] text, svg [aria-label$="legend"] text.title',
          ),
        ].map(svgText).filter((t) => t !== "");
        const tables = [...document.querySelectorAll(`${scope}table`)].map((table) => {
          const headRows = table.querySelectorAll("thead tr");
          const headRow = headRows.length > 0
            ? headRows[headRows.length - 1]!
            : table.querySelector("tr");
          const headers = [...(headRow?.querySelectorAll("th, td") ?? [])].map(text);
          const bodyRows = [...table.querySelectorAll("tbody tr, tr")].filter((r) =>
            r !== headRow && r.closest("thead") === null
          );
          return {
            headers,
            rows: [...new Set(bodyRows)].map((r) => [...r.querySelectorAll("th, td")].map(text)),
          };
        });
        // what a reader cannot read whole: an ellipsis, or ink outside the figure (an inline
        // SVG hides its overflow)
        const clippedTexts: { text: string; problem: string }[] = [];
        const chartTexts = document.querySelectorAll(
          "svg .role-title text, svg .role-axis-title text, svg .role-legend-title text, " +
            "svg .role-legend-label text, svg [aria-label$='axis label'] text",
        );
        for (const t of chartTexts) {
          const content = svgText(t);
          if (content === "") continue;
          if (content.endsWith("…")) {
            clippedTexts.push({ text: content, problem: "is cut short with an ellipsis" });
            continue;
          }
          let svg = t.closest("svg");
          while (svg?.parentElement?.closest("svg")) svg = svg.parentElement.closest("svg");
          if (svg === null) continue;
          const box = t.getBoundingClientRect();
          const frame = svg.getBoundingClientRect();
          const beyond = [
            ["left", frame.left - box.left],
            ["right", box.right - frame.right],
            ["top", frame.top - box.top],
            ["bottom", box.bottom - frame.bottom],
          ].filter(([, px]) => (px as number) > 2) as [string, number][];
          if (beyond.length > 0) {
            clippedTexts.push({
              text: content,
              problem: `is drawn ${
                beyond.map(([side, px]) => `${Math.round(px)} px beyond the ${side} edge`).join(
                  " and ",
                )
              } of its figure`,
            });
          }
        }
        return { outputs, axisTitles, tables, clippedTexts };
      });
      const screenshot = `${SCREENSHOTS}${page.name}.png`;
      await tab.screenshot({ path: screenshot, fullPage: true });
      await tab.close();
      readings.push({ page, snapshot, problems, screenshot });
    }
  } finally {
    await browser.close();
  }
  return readings;
}

/**
 * The defects of every reading as one message per page, empty when there is none; the
 * screenshot is named so a person can look.
 *
 * @param readings What the browser read.
 * @returns One line per defect, grouped by page.
 */
export function defectReport(readings: readonly PageReading[]): string[] {
  const forbidden = forbiddenIdentifiers();
  return readings.flatMap((r) => {
    const defects = [
      ...r.problems.map((p) => ({ rule: "page problem", detail: p })),
      ...findDefects(r.snapshot, forbidden),
    ];
    return defects.length === 0 ? [] : [
      `${r.page.name} (screenshot ${r.screenshot}):`,
      ...defects.map((d) => `  ${d.rule}: ${d.detail}`),
    ];
  });
}
