/**
 * Draining a message source in bounded batches. A ZeroMQ socket with queued messages resolves
 * each `receive()` at once, so a plain `while (true) await socket.receive()` loop runs on
 * microtasks alone while a kernel floods output: timers (the per-cell limit), signal listeners
 * (SIGINT, SIGTERM) and child-process events never get a turn. {@linkcode drainInBatches} hands
 * the event loop a turn after every batch, bounded both in messages and in milliseconds.
 *
 * @module
 */

/** Options of {@linkcode drainInBatches}. */
export interface DrainOptions {
  /** Whether to go on; checked before each receive and after each wait. */
  isOpen: () => boolean;
  /** Messages handled between two turns of the event loop (default 256). */
  batchMessages?: number;
  /** Milliseconds spent handling messages between two turns of the event loop (default 20). */
  batchMilliseconds?: number;
}

/** Default batch bounds of {@linkcode drainInBatches}. */
export const DRAIN_BATCH: Readonly<{ messages: number; milliseconds: number }> = {
  messages: 256,
  milliseconds: 20,
};

/**
 * Resolves after the event loop has run a turn (timers, signals, I/O), unlike a resolved
 * promise, whose continuation runs before any of them.
 *
 * @returns When the event loop has turned.
 *
 * @example
 * ```ts
 * import { yieldToEventLoop } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * let timerRan = false;
 * setTimeout(() => (timerRan = true), 0);
 * await Promise.resolve();
 * assert.equal(timerRan, false); // a microtask does not let the timer run
 * await yieldToEventLoop();
 * assert.equal(timerRan, true);
 * ```
 */
export function yieldToEventLoop(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/**
 * Receives and handles messages until the source closes (its `receive` rejects) or `isOpen`
 * turns false, yielding to the event loop after each batch.
 *
 * @param receive Returns the next message; rejects once the source is closed.
 * @param handle Handles one message (synchronously; it should not throw).
 * @param options When to stop, and the batch bounds.
 * @returns When the source is closed or `isOpen` turned false.
 * @throws {RangeError} When a batch bound is not a positive number.
 *
 * @example An endless source that answers at once still lets a timer stop it
 * ```ts
 * import { drainInBatches } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * let open = true;
 * let handled = 0;
 * setTimeout(() => (open = false), 20);
 * await drainInBatches(() => Promise.resolve("line\n"), () => handled++, { isOpen: () => open });
 * assert.ok(handled > 0);
 * assert.equal(open, false);
 * ```
 */
export async function drainInBatches<T>(
  receive: () => Promise<T>,
  handle: (message: T) => void,
  options: DrainOptions,
): Promise<void> {
  const batchMessages = options.batchMessages ?? DRAIN_BATCH.messages;
  const batchMilliseconds = options.batchMilliseconds ?? DRAIN_BATCH.milliseconds;
  if (!(Number.isInteger(batchMessages) && batchMessages >= 1)) {
    throw new RangeError(`Expected 'batchMessages' an integer >= 1, got ${batchMessages}`);
  }
  if (!(batchMilliseconds > 0)) {
    throw new RangeError(`Expected 'batchMilliseconds' > 0, got ${batchMilliseconds}`);
  }
  let handled = 0;
  let batchStarted = performance.now();
  while (options.isOpen()) {
    let message: T;
    try {
      message = await receive();
    } catch {
      return; // the source was closed
    }
    handle(message);
    handled++;
    if (handled >= batchMessages || performance.now() - batchStarted >= batchMilliseconds) {
      await yieldToEventLoop();
      handled = 0;
      batchStarted = performance.now();
    }
  }
}
