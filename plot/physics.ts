/**
 * Sensitivity charts of ultrasound physics: the Nyquist limit against sample depth for several
 * transmit frequencies, and axial and lateral resolution against frequency alongside the
 * penetration depth. Every data row is computed by the calculations' own definitions (through
 * `sensitivityCurve`, so inputs are validated); nothing is recomputed here.
 *
 * @module
 */
import { sensitivityCurve } from "../calc/core/sensitivity.ts";
import { nyquistVelocityAtDepth } from "../calc/physics/aliasing.ts";
import { penetrationDepth } from "../calc/physics/attenuation.ts";
import { lateralResolution } from "../calc/physics/beam.ts";
import { DEFAULT_SOUND_SPEED_MPS } from "../calc/physics/shared.ts";
import { axialResolution } from "../calc/physics/wave.ts";
import { Chart, type VegaLiteSpec } from "./chart.ts";

/** Options of {@linkcode nyquistDepthChart}. */
export interface NyquistDepthChartOptions {
  /** Transmit frequencies, one curve each, MHz. @default [1.5, 2.5, 3.5, 5] */
  readonly transmitFrequenciesMHz?: readonly number[];
  /** Shallowest sample depth, cm. @default 1 */
  readonly fromDepthCm?: number;
  /** Deepest sample depth, cm. @default 20 */
  readonly toDepthCm?: number;
  /** Points per curve. @default 60 */
  readonly steps?: number;
  /** Insonation angle, degrees. @default 0 */
  readonly angleDeg?: number;
  /** Speed of sound, m/s. @default 1540 */
  readonly soundSpeedMps?: number;
  /** A velocity of interest drawn as a horizontal rule, m/s (e.g. a jet to be displayed). */
  readonly velocityOfInterest?: number;
  /** Chart width in pixels. @default 480 */
  readonly width?: number;
}

/** One data row of {@linkcode nyquistDepthChart}. */
export interface NyquistDepthRow {
  /** Sample depth, cm. */
  readonly sampleDepthCm: number;
  /** Transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number;
  /** Legend label, e.g. "2.5 MHz". */
  readonly series: string;
  /** Nyquist velocity at the highest PRF the depth allows, m/s. */
  readonly nyquistVelocity: number;
}

function checkFrequencies(where: string, list: unknown): readonly number[] {
  if (!Array.isArray(list) || list.length === 0) {
    throw new TypeError(
      `${where}: expected 'transmitFrequenciesMHz' as a non-empty array of numbers, got ${
        Array.isArray(list) ? "an empty array" : typeof list
      }`,
    );
  }
  for (const f of list) {
    if (typeof f !== "number") {
      throw new TypeError(
        `${where}: expected 'transmitFrequenciesMHz' to hold numbers, got ${typeof f}`,
      );
    }
  }
  return list as readonly number[];
}

/**
 * Data rows of {@linkcode nyquistDepthChart}: the Nyquist limit of
 * {@linkcode nyquistVelocityAtDepth} swept over sample depth for each transmit frequency.
 *
 * @param options Frequencies, depth range, angle, speed of sound.
 * @returns One row per depth and frequency.
 * @throws {TypeError} For an empty or non-numeric frequency list.
 * @throws {RangeError} For a frequency, depth or angle outside its valid range (from the
 * calculation's input definitions).
 *
 * @example
 * ```ts
 * import { nyquistDepthRows } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const rows = nyquistDepthRows({ transmitFrequenciesMHz: [2], fromDepthCm: 15, toDepthCm: 16, steps: 2 });
 * // 1540² / (8 · 0.15 · 2e6) = 0.988 m/s at 15 cm (hand check)
 * assert.ok(Math.abs(rows[0]!.nyquistVelocity - 0.98817) < 1e-5);
 * ```
 */
export function nyquistDepthRows(options: NyquistDepthChartOptions = {}): NyquistDepthRow[] {
  const where = "Nyquist limit vs depth chart";
  const frequencies = checkFrequencies(where, options.transmitFrequenciesMHz ?? [1.5, 2.5, 3.5, 5]);
  const from = options.fromDepthCm ?? 1;
  const to = options.toDepthCm ?? 20;
  const rows: NyquistDepthRow[] = [];
  for (const f of frequencies) {
    const curve = sensitivityCurve(
      nyquistVelocityAtDepth,
      {
        sampleDepthCm: from,
        transmitFrequencyMHz: f,
        angleDeg: options.angleDeg ?? 0,
        soundSpeedMps: options.soundSpeedMps ?? DEFAULT_SOUND_SPEED_MPS,
      },
      { vary: "sampleDepthCm", from, to, steps: options.steps ?? 60, output: "nyquistVelocity" },
    );
    for (const p of curve.points) {
      rows.push({
        sampleDepthCm: p.x,
        transmitFrequencyMHz: f,
        series: `${f} MHz`,
        nyquistVelocity: p.y,
      });
    }
  }
  return rows;
}

/**
 * Chart: the highest Nyquist velocity pulsed Doppler can reach against sample depth, one curve per
 * transmit frequency (log velocity axis). Deeper samples and higher frequencies alias sooner.
 *
 * Formula: v_N = c² / (8·d·f0·cos θ) (see {@linkcode nyquistVelocityAtDepth}).
 *
 * @param options Frequencies, depth range, angle, speed of sound, an optional velocity of interest.
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {TypeError} For an empty or non-numeric frequency list.
 * @throws {RangeError} For a frequency, depth, angle or velocity outside its valid range.
 *
 * @example
 * ```ts
 * import { nyquistDepthChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = nyquistDepthChart({ transmitFrequenciesMHz: [2, 4], velocityOfInterest: 1.5 });
 * assert.match(await chart.toSVG(), /<path/);
 * ```
 */
export function nyquistDepthChart(options: NyquistDepthChartOptions = {}): Chart {
  const rows = nyquistDepthRows(options);
  const v = options.velocityOfInterest;
  if (v !== undefined && !(v > 0 && v <= 20)) {
    throw new RangeError(
      `Nyquist limit vs depth chart: expected 'velocityOfInterest' in (0, 20] m/s, got ${v}`,
    );
  }
  const angle = options.angleDeg ?? 0;
  const title = `Nyquist limit vs sample depth (PRF at its depth limit, θ = ${angle}°)`;
  const lines = {
    data: { values: rows },
    mark: { type: "line", strokeWidth: 2 },
    encoding: {
      x: { field: "sampleDepthCm", type: "quantitative", title: "Sample depth [cm]" },
      y: {
        field: "nyquistVelocity",
        type: "quantitative",
        title: "Nyquist velocity [m/s]",
        scale: { type: "log" },
      },
      color: {
        field: "series",
        type: "nominal",
        title: "Transmit frequency",
        sort: { field: "transmitFrequencyMHz" },
      },
    },
  };
  const layers: VegaLiteSpec[] = [lines];
  if (v !== undefined) {
    layers.push({
      data: { values: [{ velocity: v, label: `${v} m/s` }] },
      layer: [
        {
          mark: { type: "rule", strokeDash: [4, 4], color: "#444" },
          encoding: { y: { field: "velocity", type: "quantitative" } },
        },
        {
          mark: { type: "text", align: "right", dy: -6, color: "#444" },
          encoding: {
            y: { field: "velocity", type: "quantitative" },
            x: { datum: options.toDepthCm ?? 20, type: "quantitative" },
            text: { field: "label" },
          },
        },
      ],
    });
  }
  const spec: VegaLiteSpec = { title, width: options.width ?? 480, height: 300, layer: layers };
  return new Chart(spec, { title });
}

/** Options of {@linkcode resolutionPenetrationChart}. */
export interface ResolutionPenetrationChartOptions {
  /** Lowest transmit frequency, MHz. @default 1 */
  readonly fromFrequencyMHz?: number;
  /** Highest transmit frequency, MHz. @default 15 */
  readonly toFrequencyMHz?: number;
  /** Points per curve. @default 57 */
  readonly steps?: number;
  /** Cycles per pulse (axial resolution). @default 2 */
  readonly cyclesPerPulse?: number;
  /** Aperture width, mm (lateral resolution). @default 20 */
  readonly apertureMm?: number;
  /** Focal depth, cm (lateral resolution). @default 8 */
  readonly focalDepthCm?: number;
  /** Dynamic range, dB (penetration). @default 60 */
  readonly dynamicRangeDb?: number;
  /** Attenuation coefficient, dB/cm/MHz (penetration). @default 0.5 */
  readonly attenuationDbPerCmMHz?: number;
  /** Speed of sound, m/s. @default 1540 */
  readonly soundSpeedMps?: number;
  /** Chart width in pixels. @default 480 */
  readonly width?: number;
}

/** One data row of {@linkcode resolutionPenetrationChart}. */
export interface ResolutionPenetrationRow {
  /** Transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number;
  /** Axial resolution, mm (from {@linkcode axialResolution}). */
  readonly axialResolutionMm: number;
  /** Lateral resolution at the focus, mm (from {@linkcode lateralResolution}). */
  readonly lateralResolutionMm: number;
  /** Penetration depth, cm (from {@linkcode penetrationDepth}). */
  readonly penetrationDepthCm: number;
}

/**
 * Data rows of {@linkcode resolutionPenetrationChart}: axial and lateral resolution and
 * penetration depth swept over transmit frequency by their calculations.
 *
 * @param options Frequency range, pulse, aperture, focus, dynamic range, attenuation.
 * @returns One row per frequency.
 * @throws {RangeError} For a value outside the calculations' valid ranges.
 *
 * @example
 * ```ts
 * import { resolutionPenetrationRows } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const [row] = resolutionPenetrationRows({ fromFrequencyMHz: 3, toFrequencyMHz: 6, steps: 2 });
 * assert.ok(Math.abs(row!.penetrationDepthCm - 20) < 1e-12); // 60 dB / (2 · 0.5 · 3) (hand check)
 * ```
 */
export function resolutionPenetrationRows(
  options: ResolutionPenetrationChartOptions = {},
): ResolutionPenetrationRow[] {
  const from = options.fromFrequencyMHz ?? 1;
  const to = options.toFrequencyMHz ?? 15;
  const steps = options.steps ?? 57;
  const c = options.soundSpeedMps ?? DEFAULT_SOUND_SPEED_MPS;
  const sweep = { vary: "transmitFrequencyMHz" as const, from, to, steps };
  const axial = sensitivityCurve(axialResolution, {
    transmitFrequencyMHz: from,
    cyclesPerPulse: options.cyclesPerPulse ?? 2,
    soundSpeedMps: c,
  }, { ...sweep, output: "axialResolutionMm" });
  const lateral = sensitivityCurve(lateralResolution, {
    transmitFrequencyMHz: from,
    apertureMm: options.apertureMm ?? 20,
    focalDepthCm: options.focalDepthCm ?? 8,
    soundSpeedMps: c,
  }, { ...sweep, output: "beamWidthMm" });
  const penetration = sensitivityCurve(penetrationDepth, {
    transmitFrequencyMHz: from,
    dynamicRangeDb: options.dynamicRangeDb ?? 60,
    attenuationDbPerCmMHz: options.attenuationDbPerCmMHz ?? 0.5,
  }, { ...sweep, output: "maxDepthCm" });
  return axial.points.map((p, i) => ({
    transmitFrequencyMHz: p.x,
    axialResolutionMm: p.y,
    lateralResolutionMm: lateral.points[i]!.y,
    penetrationDepthCm: penetration.points[i]!.y,
  }));
}

/**
 * Chart: the resolution–penetration trade-off. Top panel: axial and lateral (at the focus)
 * resolution against transmit frequency; bottom panel: penetration depth on the same frequency
 * axis. Higher frequency resolves finer detail but reaches less deep.
 *
 * Formulas: axial = n·λ/2 ({@linkcode axialResolution}); lateral = 0.886·λ·F#
 * ({@linkcode lateralResolution}); penetration = DR/(2·α·f) ({@linkcode penetrationDepth}).
 *
 * @param options Frequency range, pulse, aperture, focus, dynamic range, attenuation.
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {RangeError} For a value outside the calculations' valid ranges.
 *
 * @example
 * ```ts
 * import { resolutionPenetrationChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = resolutionPenetrationChart({ fromFrequencyMHz: 1.5, toFrequencyMHz: 12 });
 * assert.match(await chart.toSVG(), /<path/);
 * ```
 */
export function resolutionPenetrationChart(options: ResolutionPenetrationChartOptions = {}): Chart {
  const rows = resolutionPenetrationRows(options);
  const title = "Resolution and penetration vs transmit frequency";
  const x = {
    field: "transmitFrequencyMHz",
    type: "quantitative",
    title: "Transmit frequency [MHz]",
  };
  const width = options.width ?? 480;
  const spec: VegaLiteSpec = {
    title,
    data: { values: rows },
    vconcat: [
      {
        width,
        height: 200,
        transform: [{
          fold: ["axialResolutionMm", "lateralResolutionMm"],
          as: ["quantity", "resolutionMm"],
        }, {
          calculate: "datum.quantity === 'axialResolutionMm' ? 'Axial' : 'Lateral, at focus'",
          as: "resolution",
        }],
        mark: { type: "line", strokeWidth: 2 },
        encoding: {
          x,
          y: {
            field: "resolutionMm",
            type: "quantitative",
            title: "Resolution [mm] (smaller is finer)",
          },
          color: { field: "resolution", type: "nominal", title: "Resolution" },
        },
      },
      {
        width,
        height: 150,
        mark: { type: "line", strokeWidth: 2, color: "#b05a00" },
        encoding: {
          x,
          y: { field: "penetrationDepthCm", type: "quantitative", title: "Penetration depth [cm]" },
        },
      },
    ],
  };
  return new Chart(spec, { title });
}
