/// <reference lib="dom" />
/**
 * Browser check of the HTML export: a notebook with charts is executed on the real kernel,
 * exported, and opened in headless Chromium (Debian's package, driven by playwright-core). Every
 * figure must be a rendered SVG with marks, the page must log no console error and load nothing
 * from the network. A screenshot is kept in out/test-artifacts/. Where Chromium is not installed
 * the test reports itself as ignored, with the reason in its name.
 */
import assert from "node:assert/strict";
import { runNotebook } from "@sonorigor/notebook-runner";
import {
  CHROMIUM,
  CHROMIUM_AVAILABLE as available,
  launchChromium,
  openPage,
} from "../screenshots/page_check.ts";

const NOTEBOOK =
  new URL("../../notebooks/01_phantom_lab_doppler_physics.ipynb", import.meta.url).pathname;
const ARTIFACTS = new URL("../../out/test-artifacts/", import.meta.url).pathname;

Deno.test({
  name: available
    ? "browser check: exported HTML shows every figure as a rendered SVG with marks, no console errors"
    : `browser check SKIPPED: Chromium not found at ${CHROMIUM} (CI installs Debian's chromium)`,
  ignore: !available,
  sanitizeResources: false,
  sanitizeOps: false,
  async fn() {
    const outDir = await Deno.makeTempDir({ prefix: "sonorigor-browser-" });
    try {
      const run = await runNotebook(NOTEBOOK, { outDir, html: true, log: () => {} });
      assert.equal(run.status, "ok", run.message);
      const svgOutputs = run.notebook!.cells.flatMap((c) =>
        c.cell_type === "code"
          ? c.outputs.filter((o) =>
            "data" in o && o.data && "image/svg+xml" in o.data
          )
          : []
      ).length;
      assert.ok(svgOutputs >= 3, `the notebook should produce charts, got ${svgOutputs}`);

      const browser = await launchChromium();
      try {
        const htmlPath = run.htmlPath!.startsWith("/")
          ? run.htmlPath!
          : `${Deno.cwd()}/${run.htmlPath}`;
        const { tab: page, problems } = await openPage(browser, htmlPath);
        const figures = await page.evaluate(() =>
          [...document.querySelectorAll("svg")]
            .filter((svg) => !svg.parentElement?.closest("svg"))
            .map((svg) => {
              const box = svg.getBoundingClientRect();
              return {
                width: box.width,
                height: box.height,
                marks: svg.querySelectorAll("path, rect, line, circle, polyline, polygon").length,
              };
            })
        );
        assert.equal(figures.length, svgOutputs, "one rendered SVG per figure output");
        for (const [i, f] of figures.entries()) {
          assert.ok(
            f.width > 50 && f.height > 50,
            `figure ${i + 1} is rendered with a size, got ${f.width}×${f.height}`,
          );
          assert.ok(f.marks > 5, `figure ${i + 1} has marks, got ${f.marks}`);
        }
        await Deno.mkdir(ARTIFACTS, { recursive: true });
        await page.screenshot({ path: `${ARTIFACTS}notebook-01-export.png`, fullPage: true });
        assert.deepEqual(problems, []);
      } finally {
        await browser.close();
      }
    } finally {
      await Deno.remove(outDir, { recursive: true });
    }
  },
});
