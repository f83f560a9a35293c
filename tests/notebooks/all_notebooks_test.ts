/**
 * Executes every notebook in notebooks/ and examples/ through the runner on the real kernel
 * (with the HTML export) and fails on any cell error. The test name carries the count it ran.
 * The exports are kept in out/test-artifacts/notebooks/ and, in a second test, opened in
 * headless Chromium: a screenshot of each (out/test-artifacts/screenshots/) and the checks of
 * tests/screenshots/page_check.ts, without running the notebooks a second time.
 */
import assert from "node:assert/strict";
import { fileURLToPath } from "node:url";
import { findNotebooks, runNotebook } from "@sonorigor/notebook-runner";
import { canRunKernel, processExists } from "@sonorigor/notebook-runner/testing";
import {
  CHROMIUM,
  CHROMIUM_AVAILABLE,
  defectReport,
  type PageToCheck,
  readPages,
} from "../screenshots/page_check.ts";

/** The repository root (absolute, no trailing slash). */
const ROOT = fileURLToPath(new URL("../../", import.meta.url)).replace(/\/$/, "");

const notebooks = await findNotebooks([`${ROOT}/notebooks`, `${ROOT}/examples`]);
const label = (path: string) => path.slice(ROOT.length + 1);
/** Where the executed notebooks and their HTML exports are kept (out/ is gitignored). */
const EXPORTS = `${ROOT}/out/test-artifacts/notebooks`;
/** The HTML export of each notebook that ran in this process, for the screenshot test. */
const exported: PageToCheck[] = [];

Deno.test({
  name:
    `every notebook in notebooks/ and examples/ runs without a cell error (${notebooks.length} found)`,
  ignore: !canRunKernel(),
  async fn(t) {
    console.error(
      `all-notebooks: running ${notebooks.length} notebook(s): ${
        notebooks.map(label).join(", ") || "none"
      }`,
    );
    await Deno.remove(EXPORTS, { recursive: true }).catch(() => {});
    const out = EXPORTS;
    let ran = 0;
    for (const path of notebooks) {
      await t.step(label(path), async () => {
        const lines: string[] = [];
        const result = await runNotebook(path, {
          outDir: out,
          html: true,
          timeoutSeconds: 300,
          log: (line) => lines.push(line),
        });
        ran++;
        assert.equal(result.status, "ok", `${label(path)}:\n${result.message ?? lines.join("\n")}`);
        assert.ok(result.cellsExecuted <= result.codeCells);
        assert.ok(result.htmlPath !== undefined);
        exported.push({
          name: label(path).replace(/\.ipynb$/, "").replace(/\//g, "_"),
          path: result.htmlPath,
        });
        assert.ok(result.kernelPid !== undefined && !processExists(result.kernelPid));
      });
    }
    console.error(`all-notebooks: ${ran} of ${notebooks.length} notebook(s) ran`);
    assert.equal(ran, notebooks.length);
  },
});

Deno.test({
  name: CHROMIUM_AVAILABLE
    ? "screenshot: each notebook's HTML export shows no raw object, no code identifier on an axis, units in every numeric column"
    : `screenshots of the notebooks SKIPPED: Chromium not found at ${CHROMIUM}`,
  ignore: !CHROMIUM_AVAILABLE || !canRunKernel(),
  sanitizeResources: false,
  sanitizeOps: false,
  async fn() {
    assert.equal(
      exported.length,
      notebooks.length,
      "every notebook's HTML export, from the test above (it failed or did not run)",
    );
    const defects = defectReport(await readPages(exported));
    if (defects.length > 0) {
      assert.fail(
        "What a reader sees in the notebooks breaks issue 16's rules (displays: display/; " +
          "charts: plot/; tables: calc/table/, calc/agreement/; the notebooks' own cells):\n" +
          defects.join("\n"),
      );
    }
  },
});
