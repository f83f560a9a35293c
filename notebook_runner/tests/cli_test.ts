/**
 * `deno task notebooks` as a user runs it: exit codes and messages for each kind of bad input,
 * and Ctrl-C (SIGINT) during a hanging cell, all on the real kernel.
 */
import assert from "node:assert/strict";
import { pathFromCaller } from "../cli.ts";
import type { Notebook, Output } from "../nbformat.ts";
import { childProcesses, processExists, processGroupAlive } from "../testing.ts";
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
  assert.match(stderr, /Interrupted by SIGINT: stopping the kernel/);
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
    // stderr is a pipe here: no progress bar, no carriage return or escape code in the log
    assert.ok(!result.stderr.includes("\r") && !result.stderr.includes("\x1b"), result.stderr);
    assert.doesNotMatch(result.stderr, /code cells ·/);
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

/** What {@linkcode runDuringFlood} saw. */
interface FloodRun {
  /** The CLI's exit status. */
  status: Deno.CommandStatus;
  /** Everything the CLI wrote on stderr. */
  stderr: string;
  /** The kernel's pid (its process group id). */
  kernelPid: number;
  /** The notebook client the CLI started. */
  clientPid: number;
  /** Milliseconds from the start of the flooding cell to the CLI's exit. */
  afterFloodStartMs: number;
  /** The copy of the flood fixture's folder. */
  dir: string;
}

/**
 * Runs the CLI on the flood fixture (cell 3 of 4 prints 200,000 lines); `during`, when given, is
 * called `afterMs` after the flooding cell started. Whatever happens, nothing is left running: after
 * 120 s the CLI, its notebook client and the kernel's group are killed (and the test fails).
 */
async function runDuringFlood(
  args: string[],
  during?: { afterMs: number; act: (cli: Deno.ChildProcess) => void },
): Promise<FloodRun> {
  const dir = await copyFixtures("floods.ipynb");
  const child = cli([`${dir}/floods.ipynb`, ...args]).spawn();
  let stderr = "";
  let kernelPid: number | undefined;
  let clientPid: number | undefined;
  let floodStarted: number | undefined;
  let actTimer: ReturnType<typeof setTimeout> | undefined;
  const decoder = new TextDecoder();
  let watchdogFired = false;
  const watchdog = setTimeout(() => {
    watchdogFired = true;
    for (
      const [pid, target] of [[child.pid, child.pid], [clientPid, clientPid], [
        kernelPid,
        -kernelPid!,
      ]]
    ) {
      if (pid !== undefined) {
        try {
          Deno.kill(target!, "SIGKILL");
        } catch {
          // already gone
        }
      }
    }
  }, 120_000);
  try {
    for await (const chunk of child.stderr) {
      stderr += decoder.decode(chunk);
      kernelPid ??= Number(/kernel started \(pid (\d+)/.exec(stderr)?.[1]) || undefined;
      clientPid ??= childProcesses(child.pid).find((c) => c.command.includes("child.ts"))?.pid;
      if (floodStarted === undefined && /\[cell 2\/4, code 1\/3\] ok in/.test(stderr)) {
        floodStarted = Date.now();
        if (during !== undefined) actTimer = setTimeout(() => during.act(child), during.afterMs);
      }
    }
  } finally {
    clearTimeout(watchdog);
    clearTimeout(actTimer);
  }
  await child.stdout.cancel();
  const status = await child.status;
  assert.ok(!watchdogFired, `the runner was still running 120 s after it started:\n${stderr}`);
  assert.ok(
    kernelPid !== undefined && clientPid !== undefined && floodStarted !== undefined,
    stderr,
  );
  return {
    status,
    stderr,
    kernelPid,
    clientPid,
    afterFloodStartMs: Date.now() - floodStarted,
    dir,
  };
}

/** The flooding cell of the partial notebook the run left, and its stdout lines. */
async function floodCellOfPartial(dir: string): Promise<{ outputs: Output[]; lines: string[] }> {
  const partial = JSON.parse(await Deno.readTextFile(`${dir}/floods.partial.ipynb`)) as Notebook;
  const cells = partial.cells.filter((c) => c.cell_type === "code");
  const flood = cells[1];
  assert.ok(flood?.cell_type === "code");
  assert.equal(
    cells[2]?.cell_type === "code" && cells[2].execution_count,
    null,
    "cell 4 never ran",
  );
  const lines = flood.outputs.flatMap((o) =>
    o.output_type === "stream" && o.name === "stdout"
      ? (Array.isArray(o.text) ? o.text : [o.text])
      : []
  );
  // the outputs so far: a prefix of what the cell prints, in order, nothing lost in between
  assert.ok(lines.length > 0, "some flood output reached the partial notebook");
  assert.equal(lines.findIndex((line, i) => line !== `line ${i}\n`), -1);
  return { outputs: flood.outputs, lines };
}

function assertNothingLeft(run: FloodRun): void {
  assert.equal(processExists(run.kernelPid), false, `kernel ${run.kernelPid} still running`);
  assert.equal(
    processGroupAlive(run.kernelPid),
    false,
    `kernel group ${run.kernelPid} still alive`,
  );
  assert.equal(
    processExists(run.clientPid),
    false,
    `notebook client ${run.clientPid} still running`,
  );
}

/**
 * Checks a run stopped by the cell limit: noticed within a second of the limit while messages
 * poured in, the CLI gone within 10 s more (interrupt, kill, write), nothing left running, and
 * the partial notebook with the outputs so far and the timeout error naming the limit.
 */
async function assertTimedOutDuringFlood(run: FloodRun, limit: number) {
  assert.equal(run.status.code, 1, run.stderr);
  const seconds = Number(
    /\[cell 3\/4, code 2\/3\] TIMED OUT after (\d+\.\d+) s/.exec(run.stderr)?.[1],
  );
  assert.ok(
    seconds >= limit && seconds <= limit + 1,
    `timed out after ${seconds} s:\n${run.stderr}`,
  );
  // interrupt, kill, write: the whole stop is bounded too
  assert.ok(
    run.afterFloodStartMs < (limit + 10) * 1000,
    `the CLI exited ${run.afterFloodStartMs} ms after the flood began`,
  );
  assert.match(run.stderr, /cell 3 of 4 timed out/);
  assertNothingLeft(run);
  const { outputs } = await floodCellOfPartial(run.dir);
  const last = outputs.at(-1);
  assert.ok(last?.output_type === "error");
  assert.equal(last.ename, "CellTimeoutError");
  assert.match(
    last.evalue,
    new RegExp(
      `^Cell did not finish within ${limit} s( \\(its output was still arriving\\))?; the kernel was stopped$`,
    ),
  );
  await Deno.remove(run.dir, { recursive: true });
}

kernelTest(
  "CLI: --timeout 2 stops a flooding cell promptly and writes the partial notebook",
  async () => {
    await assertTimedOutDuringFlood(await runDuringFlood(["--timeout", "2"]), 2);
  },
);

kernelTest("CLI: --timeout 10 holds deep into a flood (tens of thousands of lines)", async () => {
  // 10 s in, a per-message cost that grows with the output so far and a drain loop that never
  // yields had let the cell run seconds past its limit and the stop take up to a minute
  await assertTimedOutDuringFlood(await runDuringFlood(["--timeout", "10"]), 10);
});

kernelTest(
  "CLI: SIGTERM during an output flood stops everything, exits 143, writes the partial",
  async () => {
    // 10 s in: tens of thousands of lines so far, the flood still going
    const run = await runDuringFlood(["--timeout", "120"], {
      afterMs: 10_000,
      act: (cli) => cli.kill("SIGTERM"),
    });
    // exit status 128 + the signal number (SIGTERM is 15, POSIX signal.h / Linux signal(7))
    assert.equal(run.status.code, 143, run.stderr);
    assert.ok(
      run.afterFloodStartMs < 25_000,
      `the CLI exited ${run.afterFloodStartMs} ms after the flood began`,
    );
    assert.match(run.stderr, /Interrupted by SIGTERM: stopping the kernel/);
    assert.match(run.stderr, /cell 3 of 4 was interrupted/);
    assertNothingLeft(run);
    const { outputs, lines } = await floodCellOfPartial(run.dir);
    assert.ok(lines.length < 200_000, "the flood was cut short");
    assert.deepEqual(outputs.at(-1), {
      output_type: "error",
      ename: "InterruptedError",
      evalue: "Run interrupted by SIGTERM; the kernel was stopped",
      traceback: ["InterruptedError: Run interrupted by SIGTERM; the kernel was stopped"],
    });
    await Deno.remove(run.dir, { recursive: true });
  },
);
