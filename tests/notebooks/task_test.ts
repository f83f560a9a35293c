/**
 * `deno task notebooks` as defined in the root deno.json, typed in a sub-folder: paths are taken
 * from that folder (deno task itself runs in the repository root and passes the caller's folder
 * as INIT_CWD), and a missing notebook is reported with the folder that was searched.
 */
import assert from "node:assert/strict";
import { fileURLToPath } from "node:url";
import { canRunKernel } from "@sonorigor/notebook-runner/testing";

/** The repository root (absolute, no trailing slash). */
const ROOT = fileURLToPath(new URL("../../", import.meta.url)).replace(/\/$/, "");

async function task(cwd: string, args: string[]) {
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["task", "--quiet", "notebooks", ...args],
    cwd,
    // a fresh environment: under `deno task test` this process inherits INIT_CWD (the folder the
    // outer task was typed in), which an inner `deno task` would keep instead of setting its own
    clearEnv: true,
    env: {
      NO_COLOR: "1",
      ...Object.fromEntries(
        ["PATH", "HOME", "DENO_DIR", "XDG_CACHE_HOME", "TMPDIR"]
          .map((k) => [k, Deno.env.get(k)])
          .filter((e): e is [string, string] => e[1] !== undefined),
      ),
    },
    stdin: "null",
    stdout: "piped",
    stderr: "piped",
  }).output();
  return { code: out.code, stderr: new TextDecoder().decode(out.stderr) };
}

Deno.test({
  name: "deno task notebooks in notebooks/: a missing notebook names the folder searched",
  ignore: !canRunKernel(),
  async fn() {
    const result = await task(`${ROOT}/notebooks`, ["researcher.ipynb"]);
    assert.equal(result.code, 2, result.stderr);
    assert.ok(
      result.stderr.includes(
        `Notebook not found: researcher.ipynb (looked in ${ROOT}/notebooks)`,
      ),
      result.stderr,
    );
  },
});

Deno.test({
  name: "deno task notebooks in notebooks/: a path relative to that folder runs, HTML exported",
  ignore: !canRunKernel(),
  async fn() {
    const out = await Deno.makeTempDir({ prefix: "sonorigor-task-" });
    // the runner's own fixture, addressed from notebooks/ (the project's notebooks may be mid-edit)
    const result = await task(`${ROOT}/notebooks`, [
      "../notebook_runner/tests/fixtures/ok.ipynb",
      "--out",
      out,
      "--html",
      "--timeout",
      "60",
    ]);
    assert.equal(result.code, 0, result.stderr);
    assert.match(result.stderr, /notebook_runner\/tests\/fixtures\/ok\.ipynb: ok, 7 code cells/);
    await Deno.stat(`${out}/ok.html`);
    await Deno.remove(out, { recursive: true });
  },
});
