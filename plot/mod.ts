/**
 * Charts: vega-lite specs with static SVG rendering, kept apart from the calculations so that
 * calculations never import rendering code.
 *
 * @module
 */
export {
  Chart,
  type ChartFootnotes,
  type ChartOptions,
  footnotesWith,
  INVENTED_DATA_NOTE,
  type PngOptions,
  splitFootnotes,
  type VegaLiteSpec,
  wrapText,
} from "./chart.ts";
export * from "./uncertainty.ts";
export * from "./agreement.ts";
export * from "./doppler.ts";
export * from "./physics.ts";
export * from "./reference.ts";
export * from "./chamber.ts";
