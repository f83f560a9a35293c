/**
 * Screenshot of the method-validation report (`deno task validate` on the bundled demo table
 * with its unit, as the README suggests) in headless Chromium, checked by the rules of page_check.ts. The
 * screenshot is kept in out/test-artifacts/screenshots/validation_report.png.
 */
import { CHROMIUM, CHROMIUM_AVAILABLE, defectReport, readPages } from "./page_check.ts";

const ROOT = new URL("../../", import.meta.url).pathname;

Deno.test({
  name: CHROMIUM_AVAILABLE
    ? "screenshot: the validation report shows no raw object, no code identifier on an axis, units in every numeric column"
    : `screenshot of the validation report SKIPPED: Chromium not found at ${CHROMIUM}`,
  ignore: !CHROMIUM_AVAILABLE,
  sanitizeResources: false,
  sanitizeOps: false,
  async fn() {
    const out = await Deno.makeTempDir({ prefix: "sonorigor-report-" });
    try {
      // as the README shows it: the task (its permissions from deno.json) on the demo table
      const run = await new Deno.Command(Deno.execPath(), {
        args: ["task", "--quiet", "validate", "examples/data/validation_demo.csv", "--subject"]
          .concat(["patient", "--value", "lvef_percent", "--unit", "%", "--out", out]),
        cwd: ROOT,
        stdout: "piped",
        stderr: "piped",
      }).output();
      if (!run.success) throw new Error(new TextDecoder().decode(run.stderr));
      const readings = await readPages([{ name: "validation_report", path: `${out}/report.html` }]);
      const defects = defectReport(readings);
      if (defects.length > 0) {
        throw new Error(
          "What a reader sees in the validation report breaks issue 16's rules (report: " +
            "display/method_validation.ts, cli/validate.ts; charts: plot/):\n" + defects.join("\n"),
        );
      }
    } finally {
      await Deno.remove(out, { recursive: true });
    }
  },
});
