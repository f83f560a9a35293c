/**
 * Executes every notebook in notebooks/ and examples/ through the runner on the real kernel
 * (with the HTML export) and fails on any cell error. The test name carries the count it ran.
 */
import assert from "node:assert/strict";
import { fileURLToPath } from "node:url";
import { findNotebooks, runNotebook } from "@sonorigor/notebook-runner";
import { canRunKernel, processExists } from "@sonorigor/notebook-runner/testing";

/** The repository root (absolute, no trailing slash). */
const ROOT = fileURLToPath(new URL("../../", import.meta.url)).replace(/\/$/, "");

const notebooks = await findNotebooks([`${ROOT}/notebooks`, `${ROOT}/examples`]);
const label = (path: string) => path.slice(ROOT.length + 1);

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
    const out = await Deno.makeTempDir({ prefix: "sonorigor-all-notebooks-" });
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
        assert.ok(result.kernelPid !== undefined && !processExists(result.kernelPid));
      });
    }
    console.error(`all-notebooks: ${ran} of ${notebooks.length} notebook(s) ran`);
    assert.equal(ran, notebooks.length);
    await Deno.remove(out, { recursive: true });
  },
});
