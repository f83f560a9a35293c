/**
 * Progress of long Monte Carlo runs: the callbacks of display/progress.ts, and `onProgress` of
 * propagate and propagateInSteps (same result as a run without progress, bit for bit).
 */
import assert from "node:assert/strict";
import {
  continuityValveArea,
  formatMonteCarloProgress,
  normal,
  notebookProgress,
  propagate,
  propagateInSteps,
  terminalProgress,
} from "../../mod.ts";

const inputs = {
  lvotDiameterCm: normal(2.1, 0.08),
  lvotVtiCm: normal(20, 1),
  avVtiCm: normal(90, 5),
};

Deno.test("progress line: bar, counts, share and time (hand-checked)", () => {
  // 3/4 of 24 characters = 18 filled; 750000/1e6 = 75 %
  assert.equal(
    formatMonteCarloProgress({ trialsDone: 750_000, trialsPlanned: 1_000_000 }, 2345),
    `[${"#".repeat(18)}${"-".repeat(6)}] 750000 of 1000000 trials · 75 % · 2.3 s`,
  );
  // done beyond planned (never more than the bar) and nothing planned
  assert.match(formatMonteCarloProgress({ trialsDone: 5, trialsPlanned: 0 }, 0, 4), /^\[####\]/);
});

Deno.test("terminal progress: quiet when standard error is not a terminal", () => {
  const written: string[] = [];
  let t = 0;
  const report = terminalProgress({
    isTerminal: false,
    write: (s) => written.push(s),
    now: () => (t += 5000),
  });
  report({ trialsDone: 1, trialsPlanned: 2 });
  report({ trialsDone: 2, trialsPlanned: 2 });
  assert.deepEqual(written, []);
});

Deno.test("terminal progress: nothing for a run under a second; redrawn in place; the line ends when done", () => {
  const written: string[] = [];
  let t = 0;
  const quick = terminalProgress({
    isTerminal: true,
    write: (s) => written.push(s),
    now: () => (t += 100),
  });
  quick({ trialsDone: 1, trialsPlanned: 2 });
  quick({ trialsDone: 2, trialsPlanned: 2 });
  assert.equal(written.length, 0);
  const slow = terminalProgress({
    isTerminal: true,
    write: (s) => written.push(s),
    now: () => (t += 700),
    label: "AVA",
  });
  slow({ trialsDone: 1, trialsPlanned: 3 }); // 0.7 s: not yet
  slow({ trialsDone: 2, trialsPlanned: 3 });
  slow({ trialsDone: 3, trialsPlanned: 3 });
  assert.equal(written.length, 2);
  assert.ok(written.every((s) => s.startsWith("\rAVA: [")));
  assert.ok(!written[0]!.endsWith("\n") && written[1]!.endsWith("\n"));
});

Deno.test("notebook progress: one display, then updates of it; nothing outside a kernel", () => {
  const sent: { type: string; id: unknown }[] = [];
  let t = 0;
  const report = notebookProgress({
    send: (type, content) =>
      sent.push({ type, id: (content.transient as { display_id: unknown }).display_id }),
    now: () => (t += 1100),
  });
  for (const done of [1, 2, 3]) report({ trialsDone: done, trialsPlanned: 3 });
  assert.deepEqual(sent.map((m) => m.type), [
    "display_data",
    "update_display_data",
    "update_display_data",
  ]);
  assert.ok(sent.every((m) => m.id === sent[0]!.id));
  // deno test is not a kernel: a no-op, not an error
  notebookProgress()({ trialsDone: 1, trialsPlanned: 1 });
});

Deno.test("onProgress: called after each block, the same result as without it, bit for bit", async () => {
  const options = { method: "monteCarlo", trials: 300_000, seed: 11 } as const;
  const plain = propagate(continuityValveArea, inputs, options);
  const seen: number[] = [];
  const reported = propagate(continuityValveArea, inputs, {
    ...options,
    onProgress: (p) => {
      assert.equal(p.trialsPlanned, 300_000);
      seen.push(p.trialsDone);
    },
  });
  // blocks of 65,536 trials (calc/uncertainty/sampling.ts BLOCK_TRIALS): 5 blocks for 300,000
  assert.deepEqual(seen, [65_536, 131_072, 196_608, 262_144, 300_000]);
  assert.deepEqual(reported.outputs.avaCm2.samples, plain.outputs.avaCm2.samples);
  const stepped = await propagateInSteps(continuityValveArea, inputs, options);
  assert.deepEqual(stepped.outputs.avaCm2.samples, plain.outputs.avaCm2.samples);
  assert.deepEqual(stepped.outputs.avaCm2.interval, plain.outputs.avaCm2.interval);
});

Deno.test("onProgress: an adaptive run reports each sequence against its trial limit", () => {
  const seen: { trialsDone: number; trialsPlanned: number }[] = [];
  const r = propagate(continuityValveArea, inputs, {
    method: "monteCarlo",
    adaptive: { significantDigits: 1 },
    seed: 4,
    onProgress: (p) => seen.push(p),
  });
  // JCGM 101 §7.9.4: M = 10⁴ trials per sequence for p = 0.95
  assert.deepEqual(seen.map((p) => p.trialsDone), seen.map((_, i) => (i + 1) * 10_000));
  assert.equal(seen.length, r.monteCarlo!.adaptive!.sequences);
  assert.ok(seen.every((p) => p.trialsPlanned >= p.trialsDone));
});
