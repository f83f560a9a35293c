/**
 * The chart object: a vega-lite spec that renders a static SVG headlessly through vega and
 * displays itself in notebooks (vega-lite MIME type plus an SVG twin for every front end).
 *
 * @module
 */
import * as vega from "vega";
import * as vegaLite from "vega-lite";
import { JUPYTER_DISPLAY, type MimeBundle } from "../display/mime.ts";

/** A vega-lite top-level specification as a plain object. */
export type VegaLiteSpec = Record<string, unknown>;

/** Options of {@linkcode Chart}. */
export interface ChartOptions {
  /** Title shown in HTML exports and as the SVG's accessible title. @default "Chart" */
  readonly title?: string;
}

const SCHEMA = "https://vega.github.io/schema/vega-lite/v6.json";

/**
 * A chart: a vega-lite spec plus headless SVG rendering.
 *
 * @example A scatter of two points rendered to SVG
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
 * ```
 */
export class Chart {
  /** The vega-lite spec (with `$schema` filled in). */
  readonly spec: VegaLiteSpec;
  /** Title used in exports. */
  readonly title: string;
  #svg: Promise<string> | undefined;

  /**
   * Wraps a vega-lite spec.
   *
   * @param spec A vega-lite spec (plain object; inline data only, no URLs).
   * @param options Title.
   * @throws {TypeError} When the spec is not an object.
   */
  constructor(spec: VegaLiteSpec, options: ChartOptions = {}) {
    if (typeof spec !== "object" || spec === null || Array.isArray(spec)) {
      throw new TypeError(`Chart: expected a vega-lite spec object, got ${typeof spec}`);
    }
    this.spec = { $schema: SCHEMA, ...spec };
    this.title = options.title ?? (typeof spec.title === "string" ? spec.title : "Chart");
  }

  /** The compiled vega spec. */
  toVega(): vega.Spec {
    return vegaLite.compile(this.spec as never).spec as vega.Spec;
  }

  /**
   * Renders a static SVG string headlessly (vega renderer "none"); cached per chart.
   *
   * @returns The SVG markup.
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

  /** Writes the SVG to `path`. */
  async writeSVG(path: string): Promise<void> {
    await Deno.writeTextFile(path, await this.toSVG());
  }

  /** Writes the self-contained HTML page to `path`. */
  async writeHTML(path: string): Promise<void> {
    await Deno.writeTextFile(path, await this.toHTML());
  }

  /** Notebook display: the vega-lite spec (interactive front ends) and its SVG twin. */
  async [JUPYTER_DISPLAY](): Promise<MimeBundle> {
    return {
      "application/vnd.vegalite.v6+json": this.spec,
      "image/svg+xml": await this.toSVG(),
      "text/plain": `Chart: ${this.title}`,
    };
  }
}
