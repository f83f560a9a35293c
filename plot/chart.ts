/**
 * The chart object: a vega-lite spec that renders a static SVG headlessly through vega and
 * displays itself in notebooks (vega-lite MIME type plus an SVG twin for every front end). Every
 * chart carries its footnotes in the spec it exports, so that the SVG written to a file, pasted
 * into a slide or shown in a notebook keeps them: the clinical caution (on unless turned off), an
 * "invented data" mark where a demo draws invented data, and the marks of what it draws ("from
 * memory", "coefficients not verified"). Long titles, axis titles and footnotes wrap instead of
 * running off the chart; legends show their titles and labels in full.
 *
 * @module
 */
import * as vega from "vega";
import * as vegaLite from "vega-lite";
import { CLINICAL_CAUTION } from "../calc/core/calculation.ts";
import { JUPYTER_DISPLAY, type MimeBundle } from "../display/mime.ts";

/** A vega-lite top-level specification as a plain object. */
export type VegaLiteSpec = Record<string, unknown>;

/**
 * The footnote that marks a chart of invented demonstration data.
 *
 * @example
 * ```ts
 * import { Chart, INVENTED_DATA_NOTE } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = new Chart({ mark: "point", data: { values: [{ x: 1 }] },
 *   encoding: { x: { field: "x", type: "quantitative" } } }, { inventedData: true });
 * assert.ok(chart.footnotes.includes(INVENTED_DATA_NOTE));
 * ```
 */
export const INVENTED_DATA_NOTE = "Invented data for demonstration: not from any patient";

/** What a chart's footnote holds, besides what its chart function adds from the data it draws. */
export interface ChartFootnotes {
  /** Show the clinical caution (`CLINICAL_CAUTION`: not a diagnosis; verify against local
   * guidelines and licensed clinical practice). Turn it off only for a chart that no patient
   * decision could rest on. @default true */
  readonly caution?: boolean;
  /** Mark the chart as drawing invented demonstration data ({@linkcode INVENTED_DATA_NOTE}).
   * @default false */
  readonly inventedData?: boolean;
  /** Further footnote lines, each shown once. @default none */
  readonly notes?: readonly string[];
}

/** Options of {@linkcode Chart.toPNG} and {@linkcode Chart.writePNG}. */
export interface PngOptions {
  /** Device pixels per SVG pixel. @default 2 */
  readonly scale?: number;
  /** Path of the Chromium executable. @default `SONORIGOR_CHROMIUM`, else "/usr/bin/chromium" */
  readonly chromium?: string;
}

/** Options of {@linkcode Chart}. */
export interface ChartOptions extends ChartFootnotes {
  /** Title shown in HTML exports and as the SVG's accessible title. @default the spec's title,
   * else "Chart" */
  readonly title?: string;
}

const SCHEMA = "https://vega.github.io/schema/vega-lite/v6.json";
/** Properties vega-lite accepts only on the top-level spec: lifted out of the drawn view. */
const TOP_LEVEL = [
  "$schema",
  "config",
  "background",
  "padding",
  "autosize",
  "datasets",
  "usermeta",
];
/** Legend channels: the footnote must not pull the drawn view's legends below it. */
const LEGEND_CHANNELS = [
  "color",
  "fill",
  "stroke",
  "opacity",
  "fillOpacity",
  "strokeOpacity",
  "strokeWidth",
  "strokeDash",
  "size",
  "angle",
  "shape",
];
/** Layout: average glyph widths of the default sans-serif font at the title (13 px bold) and
 * footnote (10 px) sizes, and the footnote's line height, in pixels. */
const TITLE_GLYPH_PX = 6.8;
const NOTE_GLYPH_PX = 4.9;
const NOTE_LINE_PX = 13;
const NARROWEST_PX = 320;

/**
 * Lines of at most `width` characters, broken between words (a word longer than a line stands
 * alone on its line).
 *
 * @param text The text.
 * @param width Largest number of characters per line (≥ 1).
 * @returns The lines, none empty.
 *
 * @example
 * ```ts
 * import { wrapText } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * assert.deepEqual(wrapText("Not a diagnosis: verify first", 16), ["Not a diagnosis:", "verify first"]);
 * ```
 */
export function wrapText(text: string, width: number): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of text.split(/\s+/).filter((w) => w !== "")) {
    if (line === "") line = word;
    else if (line.length + 1 + word.length <= width) line += ` ${word}`;
    else {
      lines.push(line);
      line = word;
    }
  }
  if (line !== "") lines.push(line);
  return lines;
}

/** The drawn width of a spec in pixels, for line breaking only (layout). */
function widthOf(spec: Record<string, unknown>): number {
  if (typeof spec.width === "number") return spec.width;
  const children = (key: string) =>
    Array.isArray(spec[key]) ? (spec[key] as Record<string, unknown>[]).map(widthOf) : [];
  const across = children("hconcat");
  if (across.length > 0) return across.reduce((s, w) => s + w, 0);
  const stacked = [...children("vconcat"), ...children("concat"), ...children("layer")];
  if (stacked.length > 0) return stacked.reduce((m, w) => Math.max(m, w), 0);
  if (typeof spec.spec === "object" && spec.spec !== null) {
    return widthOf(spec.spec as Record<string, unknown>);
  }
  return 400;
}

/** The footnote lines of a chart, in order: the invented-data mark, the notes, the caution;
 * each once. A note equal to the caution (a drawn result's own) keeps it even when `caution` is
 * false: a result's cautions travel with it. */
function footnoteLines(options: ChartFootnotes): string[] {
  if (options.notes !== undefined) {
    if (!Array.isArray(options.notes) || options.notes.some((n) => typeof n !== "string")) {
      throw new TypeError(
        `Chart: expected 'notes' as an array of strings, got ${JSON.stringify(options.notes)}`,
      );
    }
  }
  for (const key of ["caution", "inventedData"] as const) {
    const v = options[key];
    if (v !== undefined && typeof v !== "boolean") {
      throw new TypeError(`Chart: expected '${key}' as true or false, got ${JSON.stringify(v)}`);
    }
  }
  const notes = (options.notes ?? []).map((n) => n.trim()).filter((n) => n !== "");
  // the caution comes last, also when a result drawn carries it among its own cautions
  const caution = (options.caution ?? true) || notes.includes(CLINICAL_CAUTION);
  const lines = [
    ...(options.inventedData ? [INVENTED_DATA_NOTE] : []),
    ...notes.filter((n) => n !== CLINICAL_CAUTION),
    ...(caution ? [CLINICAL_CAUTION] : []),
  ];
  return [...new Set(lines)];
}

/**
 * The footnote options a chart function passes to {@linkcode Chart}: the caller's, with the marks
 * of what the chart draws (a result's "from memory" or "not verified" cautions) before the
 * caller's notes.
 *
 * @param options The caller's footnote options.
 * @param marks Marks that travel with the data drawn.
 * @returns Footnote options for the chart.
 *
 * @example
 * ```ts
 * import { footnotesWith } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const f = footnotesWith({ inventedData: true, notes: ["n = 12"] }, ["Thresholds from memory"]);
 * assert.deepEqual(f.notes, ["Thresholds from memory", "n = 12"]);
 * assert.equal(f.inventedData, true);
 * ```
 */
export function footnotesWith(
  options: ChartFootnotes,
  marks: readonly string[] = [],
): ChartFootnotes {
  const { footnotes } = splitFootnotes(options);
  return { ...footnotes, notes: [...marks, ...(footnotes.notes ?? [])] };
}

/**
 * Splits a chart function's options into its footnote options and the rest (the options of the
 * data function it draws, which knows no footnotes).
 *
 * @param options Options with footnote options among them.
 * @returns The footnote options and the other options.
 *
 * @example
 * ```ts
 * import { splitFootnotes } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const { footnotes, rest } = splitFootnotes({ steps: 10, inventedData: true });
 * assert.deepEqual([footnotes, rest], [{ inventedData: true }, { steps: 10 }]);
 * ```
 */
export function splitFootnotes<T extends ChartFootnotes>(
  options: T,
): { footnotes: ChartFootnotes; rest: Omit<T, keyof ChartFootnotes> } {
  const { caution, inventedData, notes, ...rest } = options;
  return {
    footnotes: {
      ...(caution === undefined ? {} : { caution }),
      ...(inventedData === undefined ? {} : { inventedData }),
      ...(notes === undefined ? {} : { notes }),
    },
    rest,
  };
}

/** Axis titles: average glyph width of the 11 px bold axis title, in pixels (layout). */
const AXIS_GLYPH_PX = 6.2;
/** Legends: the longest title and label shown before an ellipsis, in pixels as vega estimates
 * them headlessly (0.8 × font size per character, wider than drawn), so that a label of a
 * quantity and its reference (about 60 characters at 10 px) is shown in full (layout). */
const LEGEND_LIMIT_PX = 640;

/**
 * A copy of a view whose long axis titles are broken into lines that fit along their axis (a
 * y title longer than the plot is tall would otherwise stretch the chart and run off it).
 */
function wrapAxisTitles(view: unknown, width = 400, height = 300): unknown {
  if (Array.isArray(view)) return view.map((v) => wrapAxisTitles(v, width, height));
  if (view === null || typeof view !== "object") return view;
  const spec = view as Record<string, unknown>;
  const w = typeof spec.width === "number" ? spec.width : width;
  const h = typeof spec.height === "number" ? spec.height : height;
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(spec)) {
    if (key === "encoding" && value !== null && typeof value === "object") {
      const encoding: Record<string, unknown> = {};
      for (const [channel, def] of Object.entries(value as Record<string, unknown>)) {
        const along = channel === "y" ? h : channel === "x" ? w : 0;
        const title = (def as { title?: unknown } | null)?.title;
        encoding[channel] = along > 0 && typeof title === "string" &&
            title.length * AXIS_GLYPH_PX > along
          ? { ...(def as object), title: wrapText(title, Math.floor(along / AXIS_GLYPH_PX)) }
          : def;
      }
      out[key] = encoding;
    } else if (["layer", "vconcat", "hconcat", "concat", "spec"].includes(key)) {
      out[key] = wrapAxisTitles(value, w, h);
    } else out[key] = value;
  }
  return out;
}

/** The exported spec: the drawn view under its wrapped title, with the footnote view below. */
function frame(content: VegaLiteSpec, footnotes: readonly string[]): VegaLiteSpec {
  const top: Record<string, unknown> = {};
  const wrapped = wrapAxisTitles(content) as Record<string, unknown>;
  const view: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(wrapped)) {
    if (TOP_LEVEL.includes(key)) top[key] = value;
    else if (key !== "title" && key !== "description") view[key] = value;
  }
  // legends show their titles and labels in full (the default cuts them at 160 px)
  const config = (top.config ?? {}) as Record<string, unknown>;
  top.config = {
    ...config,
    legend: {
      titleLimit: LEGEND_LIMIT_PX,
      labelLimit: LEGEND_LIMIT_PX,
      ...(config.legend as Record<string, unknown> | undefined),
    },
  };
  top.$schema = SCHEMA;
  const width = Math.max(widthOf(content), NARROWEST_PX);
  const title = content.title;
  if (typeof title === "string") {
    top.title = { text: wrapText(title, Math.floor(width / TITLE_GLYPH_PX)), anchor: "start" };
  } else if (title !== undefined) top.title = title;
  if (typeof content.description === "string") top.description = content.description;
  if (footnotes.length === 0) return { ...top, ...view };
  const lines = footnotes.flatMap((f) => wrapText(f, Math.floor(width / NOTE_GLYPH_PX)));
  top.description = [
    ...(typeof content.description === "string" ? [content.description] : []),
    ...footnotes,
  ].join(" ");
  // a stacked view takes the footnote as its last row (vega lays out nested stacks poorly)
  const { vconcat: rows, ...outer } = Array.isArray(view.vconcat) ? view : { vconcat: [view] };
  return {
    ...top,
    ...outer,
    resolve: {
      ...(outer.resolve as Record<string, unknown> | undefined),
      legend: Object.fromEntries(LEGEND_CHANNELS.map((c) => [c, "independent"])),
    },
    spacing: 12,
    vconcat: [
      ...(rows as unknown[]),
      {
        data: { values: [{}] },
        width,
        height: lines.length * NOTE_LINE_PX,
        view: { stroke: null },
        mark: {
          type: "text",
          align: "left",
          baseline: "top",
          fontSize: 10,
          lineHeight: NOTE_LINE_PX,
          color: "#444",
        },
        encoding: { x: { value: 0 }, y: { value: 0 }, text: { value: lines } },
      },
    ],
  };
}

/**
 * A chart: a vega-lite spec plus headless SVG rendering, with its footnotes (the clinical caution
 * by default) in every export.
 *
 * @example A scatter of two points rendered to SVG, with the caution under it
 * ```ts
 * import { Chart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const chart = new Chart({
 *   data: { values: [{ x: 1, y: 2 }, { x: 2, y: 3 }] },
 *   mark: "point",
 *   encoding: { x: { field: "x", type: "quantitative" }, y: { field: "y", type: "quantitative" } },
 * });
 * const svg = await chart.toSVG();
 * assert.match(svg, /^<svg/);
 * assert.match(svg, /Not a diagnosis/);
 * ```
 */
export class Chart {
  /** The exported vega-lite spec: `$schema`, the wrapped title, the drawn view and, below it, the
   * footnote view. This is what the notebook display and every rendering use. */
  readonly spec: VegaLiteSpec;
  /** The drawn view as it was given (its data, marks and encodings), for reading what a chart
   * draws. */
  readonly content: VegaLiteSpec;
  /** Title used in exports. */
  readonly title: string;
  /** The footnote lines, unwrapped, in the order shown. */
  readonly footnotes: readonly string[];
  #svg: Promise<string> | undefined;

  /**
   * Wraps a vega-lite spec.
   *
   * @param spec A vega-lite spec (plain object; inline data only, no URLs).
   * @param options Title and footnotes (the clinical caution is on by default).
   * @throws {TypeError} When the spec is not an object, or a footnote option has the wrong type.
   */
  constructor(spec: VegaLiteSpec, options: ChartOptions = {}) {
    if (typeof spec !== "object" || spec === null || Array.isArray(spec)) {
      throw new TypeError(`Chart: expected a vega-lite spec object, got ${typeof spec}`);
    }
    this.content = spec;
    this.title = options.title ?? (typeof spec.title === "string" ? spec.title : "Chart");
    this.footnotes = Object.freeze(footnoteLines(options));
    this.spec = frame(spec, this.footnotes);
  }

  /** The compiled vega spec. */
  toVega(): vega.Spec {
    return vegaLite.compile(this.spec as never).spec as vega.Spec;
  }

  /**
   * Renders a static SVG string headlessly (vega renderer "none"); cached per chart.
   *
   * @returns The SVG markup, footnotes included.
   */
  toSVG(): Promise<string> {
    this.#svg ??= (async () => {
      const view = new vega.View(vega.parse(this.toVega()), { renderer: "none" });
      try {
        return await view.toSVG();
      } finally {
        view.finalize();
      }
    })();
    return this.#svg;
  }

  /** A self-contained HTML page with the SVG inlined (no network needed to view). */
  async toHTML(): Promise<string> {
    const svg = await this.toSVG();
    const title = this.title.replace(
      /[&<>]/g,
      (c) => (c === "&" ? "&amp;" : c === "<" ? "&lt;" : "&gt;"),
    );
    return `<!doctype html>\n<html><head><meta charset="utf-8"><title>${title}</title></head>` +
      `<body style="font-family:sans-serif">${svg}</body></html>\n`;
  }

  /** Writes the SVG (footnotes included) to `path`. */
  async writeSVG(path: string): Promise<void> {
    await Deno.writeTextFile(path, await this.toSVG());
  }

  /**
   * Renders the chart as a PNG image (footnotes included) by drawing its SVG in headless
   * Chromium through playwright-core (already a dependency of the package); vega itself renders
   * PNG only through node-canvas, which is not available. Needs a Chromium executable and the
   * `--allow-run`, `--allow-env`, `--allow-read` and `--allow-write` (temporary profile)
   * permissions.
   *
   * @param options `scale`: device pixels per SVG pixel (2 gives a sharp image on paper and
   * slides), default 2; `chromium`: path of the Chromium executable, default the
   * `SONORIGOR_CHROMIUM` environment variable, else `/usr/bin/chromium`.
   * @returns The PNG bytes.
   * @throws {Error} When Chromium is not found at the path, naming it and the variable to set.
   * @throws {RangeError} For a scale outside (0, 8].
   */
  async toPNG(options: PngOptions = {}): Promise<Uint8Array> {
    const scale = options.scale ?? 2;
    if (!(scale > 0 && scale <= 8)) {
      throw new RangeError(`Chart PNG: expected 'scale' in (0, 8], got ${scale}`);
    }
    const executablePath = options.chromium ?? Deno.env.get("SONORIGOR_CHROMIUM") ??
      "/usr/bin/chromium";
    const found = await Deno.stat(executablePath).then((f) => f.isFile).catch(() => false);
    if (!found) {
      throw new Error(
        `Chart PNG: Chromium not found at '${executablePath}'; install Chromium or set SONORIGOR_CHROMIUM (or the 'chromium' option) to its path, or write the SVG with writeSVG`,
      );
    }
    const svg = await this.toSVG();
    const { chromium } = await import("playwright-core");
    const browser = await chromium.launch({
      executablePath,
      args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run"],
    });
    try {
      const page = await browser.newPage({ deviceScaleFactor: scale });
      await page.setContent(
        `<!doctype html><html><body style="margin:0;background:#fff">${svg}</body></html>`,
      );
      return new Uint8Array(await page.locator("svg").first().screenshot({ type: "png" }));
    } finally {
      await browser.close();
    }
  }

  /**
   * Writes the chart as a PNG image to `path` (see {@linkcode Chart.toPNG} for what it needs).
   *
   * @param path File to write.
   * @param options Scale and Chromium path.
   */
  async writePNG(path: string, options: PngOptions = {}): Promise<void> {
    await Deno.writeFile(path, await this.toPNG(options));
  }

  /** Writes the self-contained HTML page to `path`. */
  async writeHTML(path: string): Promise<void> {
    await Deno.writeTextFile(path, await this.toHTML());
  }

  /** Notebook display: the vega-lite spec (interactive front ends) and its SVG twin, both with
   * the footnotes, and a plain-text twin naming them. */
  async [JUPYTER_DISPLAY](): Promise<MimeBundle> {
    return {
      "application/vnd.vegalite.v6+json": this.spec,
      "image/svg+xml": await this.toSVG(),
      "text/plain": [`Chart: ${this.title}`, ...this.footnotes].join("\n"),
    };
  }
}
