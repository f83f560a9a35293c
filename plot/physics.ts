/**
 * Charts of ultrasound physics: the Nyquist limit against sample depth for several transmit
 * frequencies, and axial and lateral resolution against frequency alongside the penetration
 * depth. The data come from `nyquistDepthRows` and `resolutionPenetrationRows` (calc/physics);
 * axis titles and legends are the quantities' labels with their units. Nothing is computed here.
 *
 * @module
 */
import {
  type NyquistDepthOptions,
  nyquistDepthRows,
  readVelocityOfInterest,
  type ResolutionPenetrationOptions,
  resolutionPenetrationRows,
} from "../calc/physics/curves.ts";
import { nyquistVelocityAtDepth } from "../calc/physics/aliasing.ts";
import { penetrationDepth } from "../calc/physics/attenuation.ts";
import { lateralResolution } from "../calc/physics/beam.ts";
import { axialResolution } from "../calc/physics/wave.ts";
import type { QuantityInput } from "../calc/core/units.ts";
import { withUnit } from "../calc/core/text.ts";
import { labelWithUnit } from "../display/uncertainty.ts";
import { formatResolution } from "../display/format.ts";
import { Chart, type ChartFootnotes, splitFootnotes, type VegaLiteSpec } from "./chart.ts";

/** An axis or legend title from an input or output definition: "Sample-volume depth (cm)". */
function titleOf(d: { readonly label: string; readonly unit: string }): string {
  return labelWithUnit(d.label, d.unit);
}

/** Options of {@linkcode nyquistDepthChart}: the data's options, and how to draw them. */
export interface NyquistDepthChartOptions extends NyquistDepthOptions, ChartFootnotes {
  /** A velocity of interest drawn as a horizontal rule, m/s (e.g. a jet to be displayed). */
  readonly velocityOfInterest?: QuantityInput;
  /** Chart width in pixels. @default 480 */
  readonly width?: number;
}

/**
 * Chart: the highest Nyquist velocity pulsed Doppler can reach against sample depth, one curve per
 * transmit frequency (log velocity axis). Deeper samples and higher frequencies alias sooner.
 *
 * Formula: v_N = c² / (8·d·f0·cos θ) (see `nyquistVelocityAtDepth`); the data are
 * `nyquistDepthRows(options)`.
 *
 * @param options Frequencies, depth range, angle, speed of sound, an optional velocity of
 * interest, width, footnotes (the clinical caution is on by default).
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {TypeError} For an unknown option, an empty or non-numeric frequency list, or a value of
 * the wrong type or unit.
 * @throws {RangeError} For a frequency, depth, angle or velocity outside its valid range.
 *
 * @example
 * ```ts
 * import { nyquistDepthChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = nyquistDepthChart({ transmitFrequenciesMHz: [2, 4], velocityOfInterest: 1.5 });
 * assert.match(await chart.toSVG(), /Nyquist velocity \(m\/s\)/);
 * ```
 */
export function nyquistDepthChart(options: NyquistDepthChartOptions = {}): Chart {
  const { footnotes, rest } = splitFootnotes(options);
  const { velocityOfInterest, width = 480, ...sweep } = rest;
  const rows = nyquistDepthRows(sweep);
  const v = velocityOfInterest === undefined
    ? undefined
    : readVelocityOfInterest(velocityOfInterest);
  const depth = nyquistVelocityAtDepth.inputs.sampleDepthCm;
  const frequency = nyquistVelocityAtDepth.inputs.transmitFrequencyMHz;
  const angle = nyquistVelocityAtDepth.inputs.angleDeg;
  const limit = nyquistVelocityAtDepth.outputs.nyquistVelocity;
  const angleText = withUnit(formatResolution(rows[0]!.angleDeg, angle.quantity.resolution), "deg");
  const title = `${limit.label} vs sample depth (PRF at its depth limit, θ = ${angleText})`;
  const lines = {
    data: { values: rows },
    mark: { type: "line", strokeWidth: 2 },
    encoding: {
      x: { field: "sampleDepthCm", type: "quantitative", title: titleOf(depth) },
      y: {
        field: "nyquistVelocity",
        type: "quantitative",
        title: titleOf(limit),
        scale: { type: "log" },
      },
      color: { field: "transmitFrequencyMHz", type: "ordinal", title: titleOf(frequency) },
    },
  };
  const layers: VegaLiteSpec[] = [lines];
  if (v !== undefined) {
    const velocity = withUnit(formatResolution(v, limit.quantity.resolution), limit.unit);
    layers.push({
      data: { values: [{ velocity: v, label: velocity }] },
      layer: [
        {
          mark: { type: "rule", strokeDash: [4, 4], color: "#444" },
          encoding: { y: { field: "velocity", type: "quantitative" } },
        },
        {
          mark: { type: "text", align: "right", dy: -6, color: "#444" },
          encoding: {
            y: { field: "velocity", type: "quantitative" },
            x: { value: width },
            text: { field: "label" },
          },
        },
      ],
    });
  }
  const spec: VegaLiteSpec = { title, width, height: 300, layer: layers };
  return new Chart(spec, { title, ...footnotes });
}

/** Options of {@linkcode resolutionPenetrationChart}: the data's options, and how to draw them. */
export interface ResolutionPenetrationChartOptions
  extends ResolutionPenetrationOptions, ChartFootnotes {
  /** Chart width in pixels. @default 480 */
  readonly width?: number;
}

/**
 * Chart: the resolution–penetration trade-off. Top panel: axial and lateral (at the focus)
 * resolution against transmit frequency; bottom panel: penetration depth on the same frequency
 * axis. Higher frequency resolves finer detail but reaches less deep.
 *
 * Formulas: axial = n·λ/2 (`axialResolution`); lateral = 0.886·λ·F# (`lateralResolution`);
 * penetration = DR/(2·α·f) (`penetrationDepth`); the data are `resolutionPenetrationRows(options)`.
 *
 * @param options Frequency range, pulse, aperture, focus, dynamic range, attenuation, width,
 * footnotes (the clinical caution is on by default).
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {TypeError} For an unknown option or a value of the wrong type or unit.
 * @throws {RangeError} For a value outside the calculations' valid ranges.
 *
 * @example
 * ```ts
 * import { resolutionPenetrationChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = resolutionPenetrationChart({ fromFrequencyMHz: 1.5, toFrequencyMHz: 12 });
 * assert.match(await chart.toSVG(), /Penetration depth \(cm\)/);
 * ```
 */
export function resolutionPenetrationChart(options: ResolutionPenetrationChartOptions = {}): Chart {
  const { footnotes, rest } = splitFootnotes(options);
  const { width = 480, ...sweep } = rest;
  const rows = resolutionPenetrationRows(sweep);
  const axial = axialResolution.outputs.axialResolutionMm;
  const lateral = lateralResolution.outputs.beamWidthMm;
  const penetration = penetrationDepth.outputs.maxDepthCm;
  const title =
    `${axial.label}, ${lateral.label.toLowerCase()} and ${penetration.label.toLowerCase()} vs transmit frequency`;
  const x = {
    field: "transmitFrequencyMHz",
    type: "quantitative",
    title: titleOf(axialResolution.inputs.transmitFrequencyMHz),
  };
  const series: Readonly<Record<string, string>> = {
    axialResolutionMm: axial.label,
    lateralResolutionMm: lateral.label,
  };
  const spec: VegaLiteSpec = {
    title,
    data: { values: rows },
    vconcat: [
      {
        width,
        height: 200,
        transform: [
          { fold: Object.keys(series), as: ["field", "resolutionMm"] },
          { calculate: `${JSON.stringify(series)}[datum.field]`, as: "resolution" },
        ],
        mark: { type: "line", strokeWidth: 2 },
        encoding: {
          x,
          y: {
            field: "resolutionMm",
            type: "quantitative",
            title: labelWithUnit(`${axial.label} / ${lateral.label.toLowerCase()}`, axial.unit),
          },
          color: {
            field: "resolution",
            type: "nominal",
            title: null,
            legend: { labelLimit: 320 },
          },
        },
      },
      {
        width,
        height: 150,
        mark: { type: "line", strokeWidth: 2, color: "#b05a00" },
        encoding: {
          x,
          y: { field: "penetrationDepthCm", type: "quantitative", title: titleOf(penetration) },
        },
      },
    ],
  };
  return new Chart(spec, { title, ...footnotes });
}
