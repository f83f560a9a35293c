/**
 * The process checks of the testing entry point, on a real process group: the kernel-cleanup
 * assertions of the runner tests rely on them.
 */
import assert from "node:assert/strict";
import { processExists, processGroupAlive } from "../testing.ts";
import { CAN_RUN_KERNEL } from "./helpers.ts";

Deno.test({
  name: "the process checks see a live process and its group, then their end",
  ignore: !CAN_RUN_KERNEL,
  async fn() {
    const sleeper = new Deno.Command("sleep", {
      args: ["30"],
      detached: true,
      stdout: "null",
      stderr: "null",
    })
      .spawn();
    assert.equal(processExists(sleeper.pid), true);
    // the child becomes a group leader (setsid) just after fork: under load that can lag the spawn
    for (let i = 0; i < 100 && !processGroupAlive(sleeper.pid); i++) {
      await new Promise((r) => setTimeout(r, 20));
    }
    assert.equal(processGroupAlive(sleeper.pid), true);
    Deno.kill(-sleeper.pid, "SIGKILL");
    await sleeper.status;
    assert.equal(processExists(sleeper.pid), false);
    assert.equal(processGroupAlive(sleeper.pid), false);
  },
});

Deno.test("the process checks refuse an id that cannot be a process", () => {
  // POSIX kill(2): pid 0 and -1 address groups or every process, 1 is init; never a kernel
  for (const bad of [0, 1, -5, 2.5, Number.NaN]) {
    assert.throws(() => processExists(bad), {
      name: "RangeError",
      message: `Expected a process id above 1, got ${bad}`,
    });
    assert.throws(() => processGroupAlive(bad), {
      name: "RangeError",
      message: `Expected a process group id above 1, got ${bad}`,
    });
  }
});
