/**
 * Labels a reader reads without a glossary on every chart: axis titles, legends and text from
 * quantity labels with units, never a code identifier ("trueGradient [mmHg]", "angleDeg",
 * "zScore.phn2017…"), and every tooltip field titled.
 */
import assert from "node:assert/strict";
import { everyChart } from "./every_chart.ts";
import { svgTexts } from "./svg_text.ts";

/** Units written in mixed case, which are not identifiers. */
const UNITS = /\b(mL|mmHg|MHz|kHz|cmH2O|dB)\b/g;
/** A camelCase identifier, a "name [unit]" header, a dotted id. */
const IDENTIFIER = /\b[a-z]+[A-Z][A-Za-z0-9]*\b|\w \[[^\]]+\]|\b[a-z]\w*\.[a-z]\w*\b/;
/** Charts drawn by modules another change owns (plot/agreement.ts): tooltips checked there. */
const TOOLTIPS_ELSEWHERE = new Set(["blandAltmanChart", "methodValidationChart"]);

function tooltipFields(spec: unknown, out: Record<string, unknown>[] = []) {
  if (Array.isArray(spec)) { for (const v of spec) tooltipFields(v, out); }
  else if (spec !== null && typeof spec === "object") {
    for (const [k, v] of Object.entries(spec)) {
      if (k === "tooltip" && Array.isArray(v)) out.push(...v);
      else tooltipFields(v, out);
    }
  }
  return out;
}

Deno.test("no chart shows a code identifier in its text (axes, legends, labels, footnotes)", async () => {
  for (const [name, chart] of await everyChart()) {
    for (const text of svgTexts(await chart.toSVG())) {
      assert.doesNotMatch(text.replace(UNITS, ""), IDENTIFIER, `${name}: "${text}"`);
    }
  }
});

Deno.test("no chart text is cut short with an ellipsis (legends, axis labels and titles in full)", async () => {
  for (const [name, chart] of await everyChart()) {
    for (const text of svgTexts(await chart.toSVG())) {
      assert.ok(!text.endsWith("…"), `${name}: "${text}"`);
    }
  }
});

Deno.test("every tooltip field of every chart has a reader's title", async () => {
  for (const [name, chart] of await everyChart()) {
    if (TOOLTIPS_ELSEWHERE.has(name)) continue;
    for (const t of tooltipFields(chart.spec)) {
      assert.ok(typeof t.title === "string" && t.title !== "", `${name}: ${JSON.stringify(t)}`);
      assert.doesNotMatch(String(t.title).replace(UNITS, ""), IDENTIFIER, name);
    }
  }
});
