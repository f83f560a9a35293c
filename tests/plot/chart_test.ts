/**
 * Footnotes that travel with every chart: the clinical caution (on by default), the "invented
 * data" mark, and the marks of what a chart draws ("from memory", "coefficients not verified",
 * synthetic models), in the exported vega-lite spec, the SVG (string and file) and the notebook
 * bundle; long titles wrap. The caution text is the project's (calc/core/calculation.ts).
 */
import assert from "node:assert/strict";
import {
  AORTIC_STENOSIS_2017,
  CLINICAL_CAUTION,
  defineZScoreModel,
  gradeSeverity,
  PHN_2017_MODELS,
} from "../../mod.ts";
import {
  adultLimitChart,
  Chart,
  INVENTED_DATA_NOTE,
  severityProbabilityChart,
  wrapText,
  zScoreChart,
} from "../../plot/mod.ts";
import { svgText } from "./svg_text.ts";
import { everyChart } from "./every_chart.ts";

const POINT = {
  data: { values: [{ x: 1, y: 2 }, { x: 2, y: 3 }] },
  mark: "point",
  encoding: { x: { field: "x", type: "quantitative" }, y: { field: "y", type: "quantitative" } },
};

Deno.test("every chart of every plot module carries the clinical caution and the invented-data mark in its SVG and spec", async () => {
  const charts = await everyChart();
  assert.equal(charts.length, 16);
  for (const [name, chart] of charts) {
    const text = svgText(await chart.toSVG());
    // the project's caution, verbatim (calc/core/calculation.ts), and the demo mark
    assert.ok(text.includes(CLINICAL_CAUTION), `${name}: no caution in the SVG text`);
    assert.ok(text.includes(INVENTED_DATA_NOTE), `${name}: no invented-data mark in the SVG`);
    // the exported vega-lite spec holds them too (what a notebook front end renders)
    const spec = JSON.stringify(chart.spec);
    for (const word of CLINICAL_CAUTION.split(" ")) assert.ok(spec.includes(word), name);
    assert.deepEqual(chart.footnotes.at(-1), CLINICAL_CAUTION, name);
    assert.equal(chart.footnotes[0], INVENTED_DATA_NOTE, name);
  }
});

Deno.test("charts of results marked 'from memory' or 'not verified' carry the mark in their footnote", async () => {
  // severity classes of the 2017 AS table, whose thresholds are recalled from memory
  // (calc/doppler/grading_tables.ts): the grading result's own caution
  const graded = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 1.2]);
  const memory = graded.cautions.find((c) => c.includes("from memory"))!;
  assert.ok(memory, "the grading result is marked");
  assert.ok(svgText(await severityProbabilityChart(graded).toSVG()).includes(memory));
  // PHN Z-score coefficients not verified against the paper (calc/reference/zscore_models.ts)
  const z = svgText(await zScoreChart(PHN_2017_MODELS.lvEndDiastolicDimension).toSVG());
  assert.match(z, /Coefficients not verified against the publication/);
  // adult limits entered from memory of Lang 2015 (calc/reference/adult.ts)
  const adult = svgText(await adultLimitChart("laVolumeIndex").toSVG());
  assert.match(adult, /Limits: Lang RM 2015, Table 2 .*entered from memory/);
  // a synthetic model is named as such (its calculation's caution)
  const synthetic = defineZScoreModel({
    ...PHN_2017_MODELS.aorticRootSinus,
    id: "synthetic.chart",
    provenance: "synthetic: invented for this test",
    synthetic: true,
  });
  assert.match(svgText(await zScoreChart(synthetic).toSVG()), /SYNTHETIC model/);
});

Deno.test("the caution is on by default, can be turned off, and notes are shown once", async () => {
  const plain = new Chart(POINT);
  assert.deepEqual(plain.footnotes, [CLINICAL_CAUTION]);
  assert.ok(svgText(await plain.toSVG()).includes(CLINICAL_CAUTION));
  const none = new Chart(POINT, { caution: false });
  assert.deepEqual(none.footnotes, []);
  assert.ok(!svgText(await none.toSVG()).includes("Not a diagnosis"));
  // the drawn view is exported as it was given when there is no footnote
  assert.deepEqual(none.spec.encoding, POINT.encoding);
  const noted = new Chart(POINT, { notes: ["n = 12", "n = 12", CLINICAL_CAUTION] });
  assert.deepEqual(noted.footnotes, ["n = 12", CLINICAL_CAUTION]);
  assert.throws(() => new Chart(POINT, { notes: "n = 12" as never }), {
    name: "TypeError",
    message: "Chart: expected 'notes' as an array of strings, got \"n = 12\"",
  });
  assert.throws(() => new Chart(POINT, { caution: "yes" as never }), {
    name: "TypeError",
    message: "Chart: expected 'caution' as true or false, got \"yes\"",
  });
});

Deno.test("the notebook bundle, the written SVG and the HTML page keep the footnotes", async () => {
  const chart = new Chart({ ...POINT, title: "Demo" }, { inventedData: true });
  const bundle = await (chart as unknown as Record<symbol, () => Promise<Record<string, unknown>>>)[
    Symbol.for("Jupyter.display")
  ]!();
  assert.equal(
    bundle["text/plain"],
    `Chart: Demo\n${INVENTED_DATA_NOTE}\n${CLINICAL_CAUTION}`,
  );
  assert.ok(svgText(String(bundle["image/svg+xml"])).includes(CLINICAL_CAUTION));
  assert.ok(
    JSON.stringify(bundle["application/vnd.vegalite.v6+json"]).includes(INVENTED_DATA_NOTE),
  );
  const dir = await Deno.makeTempDir();
  try {
    await chart.writeSVG(`${dir}/chart.svg`);
    const written = svgText(await Deno.readTextFile(`${dir}/chart.svg`));
    assert.ok(written.includes(CLINICAL_CAUTION) && written.includes(INVENTED_DATA_NOTE));
    await chart.writeHTML(`${dir}/chart.html`);
    assert.ok(svgText(await Deno.readTextFile(`${dir}/chart.html`)).includes(CLINICAL_CAUTION));
  } finally {
    await Deno.remove(dir, { recursive: true });
  }
});

Deno.test("long titles and footnotes wrap between words instead of running off the chart", async () => {
  const title =
    "Continuity aortic valve area of every patient of the valve clinic with its 95 % coverage interval by Monte Carlo";
  const chart = new Chart({ ...POINT, title, width: 320 });
  const lines = (chart.spec.title as { text: string[] }).text;
  assert.ok(lines.length >= 2, `title lines: ${lines.length}`);
  assert.equal(lines.join(" "), title);
  // 320 px at the 13 px bold title's average glyph width of 6.8 px: 47 characters (layout)
  for (const line of lines) assert.ok(line.length <= 47, line);
  assert.ok(svgText(await chart.toSVG()).includes(title));
  // the chart keeps its title for exports
  assert.equal(chart.title, title);
  // greedy word wrap, a long word alone on its line (layout rule, no source needed)
  assert.deepEqual(wrapText("a bb ccc dddddddddd e", 6), ["a bb", "ccc", "dddddddddd", "e"]);
  assert.deepEqual(wrapText("  ", 6), []);
});

const CHROMIUM = Deno.env.get("SONORIGOR_CHROMIUM") ?? "/usr/bin/chromium";
const hasChromium = await Deno.stat(CHROMIUM).then((s) => s.isFile).catch(() => false);

Deno.test({
  name: hasChromium
    ? "a chart writes itself as PNG (the SVG drawn in headless Chromium), footnotes included"
    : `PNG export SKIPPED: Chromium not found at ${CHROMIUM}`,
  ignore: !hasChromium,
  sanitizeResources: false,
  sanitizeOps: false,
  async fn() {
    const chart = new Chart({ ...POINT, title: "Demo", width: 200, height: 100 });
    const dir = await Deno.makeTempDir();
    try {
      await chart.writePNG(`${dir}/chart.png`, { scale: 1 });
      const png = await Deno.readFile(`${dir}/chart.png`);
      // the PNG signature (ISO/IEC 15948:2004 §5.2) and the IHDR width: the SVG's width, which
      // holds the footnote view, at least the 200 px drawn width
      assert.deepEqual([...png.slice(0, 8)], [137, 80, 78, 71, 13, 10, 26, 10]);
      const width = new DataView(png.buffer, png.byteOffset).getUint32(16);
      const svgWidth = Number(/<svg[^>]*\swidth="([\d.]+)"/.exec(await chart.toSVG())![1]);
      assert.equal(width, Math.round(svgWidth));
    } finally {
      await Deno.remove(dir, { recursive: true });
    }
  },
});

Deno.test("PNG export names a missing Chromium and refuses a bad scale", async () => {
  const chart = new Chart(POINT);
  await assert.rejects(() => chart.toPNG({ chromium: "/nonexistent/chromium" }), {
    name: "Error",
    message:
      "Chart PNG: Chromium not found at '/nonexistent/chromium'; install Chromium or set SONORIGOR_CHROMIUM (or the 'chromium' option) to its path, or write the SVG with writeSVG",
  });
  await assert.rejects(() => chart.toPNG({ scale: 0 }), {
    name: "RangeError",
    message: "Chart PNG: expected 'scale' in (0, 8], got 0",
  });
});

Deno.test("long axis titles wrap to their axis; legends show titles and labels in full", async () => {
  const title = "Change of True gradient relative to its value at Signed insonation angle = 0° (%)";
  const chart = new Chart({
    ...POINT,
    width: 300,
    height: 200,
    encoding: {
      x: { field: "x", type: "quantitative", title: "x" },
      y: { field: "y", type: "quantitative", title },
    },
  });
  const view = (chart.spec.vconcat as { encoding: { y: { title: string[] } } }[])[0]!;
  const lines = view.encoding.y.title;
  // 200 px at the 11 px bold axis title's average glyph width of 6.2 px: 32 characters (layout)
  assert.ok(Array.isArray(lines) && lines.length >= 2);
  assert.equal(lines.join(" "), title);
  for (const line of lines) assert.ok(line.length <= 32, line);
  assert.ok(svgText(await chart.toSVG()).includes("Signed insonation angle"));
  const legend = (chart.spec.config as { legend: Record<string, number> }).legend;
  assert.deepEqual([legend.titleLimit, legend.labelLimit], [640, 640]);
});
