/**
 * Draining in bounded batches: timers and other event-loop work keep running while a source
 * that always has a message ready (an output flood) is drained.
 */
import assert from "node:assert/strict";
import { drainInBatches } from "../drain.ts";

Deno.test("drainInBatches lets timers run while a source is flooding", async () => {
  // the source always has a message ready, as a socket does while a kernel floods output
  let handled = 0;
  const ticks: number[] = [];
  const ticker = setInterval(() => ticks.push(handled), 5);
  let open = true;
  setTimeout(() => (open = false), 100);
  await drainInBatches(() => Promise.resolve(1), () => handled++, { isOpen: () => open });
  clearInterval(ticker);
  assert.equal(open, false, "the timer that closes the source ran");
  assert.ok(ticks.length >= 3, `the interval ran ${ticks.length} times during the flood`);
  // and messages were handled between the ticks, not only before or after them
  assert.ok(ticks.some((count, i) => i > 0 && count > ticks[i - 1]!), String(ticks));
});

Deno.test("drainInBatches yields after the message bound of a batch", async () => {
  const seen: number[] = [];
  let sent = 0;
  let open = true;
  const done = drainInBatches(() => Promise.resolve(++sent), (n) => seen.push(n), {
    isOpen: () => open,
    batchMessages: 10,
    batchMilliseconds: 60_000,
  });
  await new Promise((resolve) => setTimeout(resolve, 0));
  const atFirstTurn = seen.length;
  open = false;
  await done;
  // a timer queued before the drain runs at the first turn, after exactly one batch of 10
  assert.equal(atFirstTurn, 10);
});

Deno.test("drainInBatches stops when the source closes and refuses bad bounds", async () => {
  let left = 3;
  const seen: string[] = [];
  await drainInBatches(
    () => (left-- > 0 ? Promise.resolve(`m${left}`) : Promise.reject(new Error("socket closed"))),
    (m) => seen.push(m),
    { isOpen: () => true },
  );
  assert.deepEqual(seen, ["m2", "m1", "m0"]);
  const never = () => Promise.resolve(0);
  await assert.rejects(drainInBatches(never, () => {}, { isOpen: () => true, batchMessages: 0 }), {
    name: "RangeError",
    message: "Expected 'batchMessages' an integer >= 1, got 0",
  });
  await assert.rejects(
    drainInBatches(never, () => {}, { isOpen: () => true, batchMilliseconds: Number.NaN }),
    { name: "RangeError", message: "Expected 'batchMilliseconds' > 0, got NaN" },
  );
});
