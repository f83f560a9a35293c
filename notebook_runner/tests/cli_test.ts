/**
 * `deno task notebooks` as a user runs it: exit codes and messages for each kind of bad input,
 * and Ctrl-C (SIGINT) during a hanging cell, all on the real kernel.
 */
import assert from "node:assert/strict";
import { pathFromCaller } from "../cli.ts";
import { processExists, processGroupAlive } from "../testing.ts";
import { CAN_RUN_KERNEL, copyFixtures, FIXTURES, PACKAGE } from "./helpers.ts";

Deno.test("pathFromCaller: relative to the caller, shown relative to the current folder", () => {
  const here = Deno.cwd();
  // node:path resolve/relative semantics (POSIX): "a/../b" normalises to "b"
  assert.equal(pathFromCaller("x.ipynb", `${here}/notebooks`), "notebooks/x.ipynb");
  assert.equal(pathFromCaller("../b/x.ipynb", `${here}/a`), "b/x.ipynb");
  assert.equal(pathFromCaller("x.ipynb", here), "x.ipynb");
  // outside the current folder, or the folder itself: absolute
  assert.equal(pathFromCaller("/tmp/x.ipynb", here), "/tmp/x.ipynb");
  assert.equal(pathFromCaller("..", here), here.replace(/\/[^/]+$/, "") || "/");
  assert.equal(pathFromCaller(".", here), here);
});

const kernelTest = (name: string, fn: () => Promise<void>) =>
  Deno.test({ name, ignore: !CAN_RUN_KERNEL, fn });

function cli(args: string[], env: Record<string, string> = {}): Deno.Command {
  return new Deno.Command(Deno.execPath(), {
    args: ["run", "-A", "--quiet", `${PACKAGE}/cli.ts`, ...args],
    cwd: PACKAGE,
    env,
    stdin: "null",
    stdout: "piped",
    stderr: "piped",
  });
}

async function run(args: string[], env: Record<string, string> = {}) {
  const out = await cli(args, env).output();
  return { code: out.code, stderr: new TextDecoder().decode(out.stderr) };
}

kernelTest("CLI: each kind of bad input gives a clear message and a non-zero exit", async () => {
  const dir = await copyFixtures("throws.ipynb", "invalid_json.ipynb", "python_kernel.ipynb");
  const cases: [string[], Record<string, string>, number, RegExp][] = [
    [[`${dir}/missing.ipynb`], {}, 2, /Notebook not found: missing\.ipynb \(looked in \/.+\)/],
    [[`${dir}/invalid_json.ipynb`], {}, 2, /invalid_json\.ipynb: invalid JSON: /],
    [
      [`${dir}/python_kernel.ipynb`],
      {},
      2,
      /expected a Deno kernelspec \(name 'deno'\), got 'python3'/,
    ],
    [
      [`${FIXTURES}/ok.ipynb`, "--deno", "/nonexistent/deno"],
      {},
      3,
      /Deno binary not found: '\/nonexistent\/deno'/,
    ],
    [
      [`${FIXTURES}/ok.ipynb`],
      { SONORIGOR_DENO: "/nonexistent/env-deno" },
      3,
      /Deno binary not found: '\/nonexistent\/env-deno'/,
    ],
    [
      [`${dir}/throws.ipynb`, "--out", `${dir}/out`],
      {},
      1,
      /cell 3 of 4 failed[^]*missingFunction is not defined[^]*at line 5 of the cell/,
    ],
    [
      ["--timeout", "soon", `${dir}/throws.ipynb`],
      {},
      2,
      /Option --timeout: expected seconds in \(0, 86400\], got soon/,
    ],
    [["--bogus"], {}, 2, /Unknown option '--bogus'/],
  ];
  for (const [args, env, code, message] of cases) {
    const result = await run(args, env);
    assert.equal(result.code, code, `${args.join(" ")}\n${result.stderr}`);
    assert.match(result.stderr, message);
  }
  await Deno.stat(`${dir}/throws.partial.ipynb`);
  await Deno.remove(dir, { recursive: true });
});

kernelTest(
  "CLI: relative paths come from the caller's folder (INIT_CWD, as deno task sets it)",
  async () => {
    // `deno task` runs the command in the folder of its deno.json and passes the folder the
    // user typed it in as INIT_CWD; the process here runs in the package folder, the caller is
    // elsewhere, so only resolution from the caller finds the notebook and the output folder.
    const caller = await copyFixtures("ok.ipynb");
    const result = await run(["ok.ipynb", "--out", "executed", "--html", "--timeout", "60"], {
      INIT_CWD: caller,
    });
    assert.equal(result.code, 0, result.stderr);
    assert.match(await Deno.readTextFile(`${caller}/executed/ok.html`), /<rect id="fixture-rect"/);
    assert.equal(JSON.parse(await Deno.readTextFile(`${caller}/executed/ok.ipynb`)).nbformat, 4);
    await Deno.remove(caller, { recursive: true });
  },
);

kernelTest("CLI: a notebook not found names the folder it was looked for in", async () => {
  const caller = await copyFixtures("ok.ipynb");
  const result = await run(["researcher.ipynb"], { INIT_CWD: caller });
  assert.equal(result.code, 2, result.stderr);
  assert.ok(
    result.stderr.includes(`Notebook not found: researcher.ipynb (looked in ${caller})`),
    result.stderr,
  );
  // a sub-folder of the caller's folder is reported as the folder searched
  const nested = await run(["sub/researcher.ipynb"], { INIT_CWD: caller });
  assert.ok(
    nested.stderr.includes(`Notebook not found: researcher.ipynb (looked in ${caller}/sub)`),
    nested.stderr,
  );
  await Deno.remove(caller, { recursive: true });
});

kernelTest("CLI: Ctrl-C during a hanging cell stops the kernel and exits 130", async () => {
  const dir = await copyFixtures("hangs.ipynb");
  const child = cli([`${dir}/hangs.ipynb`, "--timeout", "120"]).spawn();
  let stderr = "";
  let kernelPid: number | undefined;
  let interrupted = false;
  let aliveBeforeInterrupt = false;
  const decoder = new TextDecoder();
  const stopWatch = setTimeout(() => child.kill("SIGKILL"), 60_000); // never hang the suite
  try {
    for await (const chunk of child.stderr) {
      stderr += decoder.decode(chunk);
      kernelPid ??= Number(/kernel started \(pid (\d+)/.exec(stderr)?.[1]) || undefined;
      if (!interrupted && /\[cell 2\/4, code 1\/3\] ok in/.test(stderr)) {
        interrupted = true;
        await new Promise((r) => setTimeout(r, 500)); // the hanging cell is running now
        aliveBeforeInterrupt = kernelPid !== undefined && processExists(kernelPid);
        child.kill("SIGINT");
      }
    }
  } finally {
    clearTimeout(stopWatch);
  }
  await child.stdout.cancel();
  const status = await child.status;
  assert.ok(aliveBeforeInterrupt, "the kernel ran before Ctrl-C (so the check below can fail)");
  assert.equal(status.code, 130, stderr);
  assert.match(stderr, /Interrupted: stopping the kernel/);
  assert.match(stderr, /cell 3 of 4 was interrupted/);
  assert.ok(kernelPid !== undefined);
  assert.equal(processExists(kernelPid), false, "kernel still running after Ctrl-C");
  assert.equal(processGroupAlive(kernelPid), false);
  await Deno.stat(`${dir}/hangs.partial.ipynb`);
  await Deno.remove(dir, { recursive: true });
});

kernelTest(
  "CLI: --html writes the notebook and the report to --out, original untouched",
  async () => {
    const out = await Deno.makeTempDir({ prefix: "sonorigor-nb-out-" });
    const before = await Deno.readTextFile(`${FIXTURES}/ok.ipynb`);
    const result = await run([`${FIXTURES}/ok.ipynb`, "--out", out, "--html", "--timeout", "60"]);
    assert.equal(result.code, 0, result.stderr);
    assert.equal((result.stderr.match(/ ok in \d/g) ?? []).length, 7); // one line per code cell
    assert.match(await Deno.readTextFile(`${out}/ok.html`), /<rect id="fixture-rect"/);
    assert.equal(JSON.parse(await Deno.readTextFile(`${out}/ok.ipynb`)).nbformat_minor, 5);
    assert.equal(await Deno.readTextFile(`${FIXTURES}/ok.ipynb`), before);
    await Deno.remove(out, { recursive: true });
  },
);

kernelTest(
  "CLI killed outright (SIGKILL): the kernel still goes away, partial written",
  async () => {
    const dir = await copyFixtures("hangs.ipynb");
    const child = cli([`${dir}/hangs.ipynb`, "--timeout", "120"]).spawn();
    let stderr = "";
    let kernelPid: number | undefined;
    let aliveBeforeKill = false;
    const decoder = new TextDecoder();
    const stopWatch = setTimeout(() => child.kill("SIGKILL"), 60_000);
    try {
      for await (const chunk of child.stderr) {
        stderr += decoder.decode(chunk);
        kernelPid ??= Number(/kernel started \(pid (\d+)/.exec(stderr)?.[1]) || undefined;
        if (!aliveBeforeKill && /\[cell 2\/4, code 1\/3\] ok in/.test(stderr)) {
          await new Promise((r) => setTimeout(r, 500));
          aliveBeforeKill = kernelPid !== undefined && processExists(kernelPid);
          child.kill("SIGKILL"); // no handler runs in the CLI itself
        }
      }
    } finally {
      clearTimeout(stopWatch);
    }
    await child.stdout.cancel();
    assert.equal((await child.status).signal, "SIGKILL");
    assert.ok(aliveBeforeKill, stderr);
    // the notebook client notices the closed pipe, stops the kernel and writes the partial
    let gone = false;
    for (let i = 0; i < 100 && !gone; i++) {
      gone = !processGroupAlive(kernelPid!);
      if (!gone) await new Promise((r) => setTimeout(r, 100));
    }
    assert.ok(gone, `kernel group ${kernelPid} still alive 10 s after the CLI was killed`);
    for (let i = 0; i < 50; i++) {
      try {
        await Deno.stat(`${dir}/hangs.partial.ipynb`);
        break;
      } catch {
        await new Promise((r) => setTimeout(r, 100));
      }
    }
    await Deno.stat(`${dir}/hangs.partial.ipynb`);
    await Deno.remove(dir, { recursive: true });
  },
);
