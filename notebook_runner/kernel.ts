/**
 * A client for the real Deno Jupyter kernel (`deno jupyter --kernel --conn FILE`) over ZeroMQ:
 * writes a connection file (random free ports on 127.0.0.1, random HMAC key), starts the kernel
 * in its own process group, connects shell (DEALER), iopub (SUB), control (DEALER), stdin
 * (DEALER) and heartbeat (REQ) sockets, and executes code with signed messages (protocol 5.3).
 *
 * Shutdown is always complete: `shutdown_request` on control, then the whole process group is
 * killed, so no process started for a notebook outlives the run.
 *
 * @module
 */
import { randomBytes, randomUUID } from "node:crypto";
import * as zmq from "zeromq";
import { drainInBatches } from "./drain.ts";
import {
  createMessage,
  deserializeMessage,
  type JupyterMessage,
  serializeMessage,
} from "./protocol.ts";

/** The content of a Jupyter connection file. */
export interface ConnectionInfo {
  /** Transport ("tcp"). */
  transport: "tcp";
  /** Address the kernel binds to. */
  ip: string;
  /** Shell (ROUTER on the kernel side) port. */
  shell_port: number;
  /** IOPub (PUB) port. */
  iopub_port: number;
  /** Stdin (ROUTER) port. */
  stdin_port: number;
  /** Control (ROUTER) port. */
  control_port: number;
  /** Heartbeat (REP) port. */
  hb_port: number;
  /** HMAC key. */
  key: string;
  /** Signature scheme. */
  signature_scheme: "hmac-sha256";
  /** Kernel name. */
  kernel_name: string;
}

/** Why the kernel could not be used. */
export class KernelError extends Error {
  /** Creates a kernel error. */
  constructor(message: string, options?: ErrorOptions) {
    super(message, options);
    this.name = "KernelError";
  }
}

/** Options of {@linkcode DenoKernel.start}. */
export interface KernelStartOptions {
  /** Path of the deno binary (default: the running deno, `Deno.execPath()`). */
  denoPath?: string;
  /** Working directory of the kernel (the notebook's folder, as Jupyter does). */
  cwd?: string;
  /** How long to wait for `kernel_info_reply`, in milliseconds (default 60 000). */
  startupTimeoutMs?: number;
  /** Extra environment variables for the kernel process. */
  env?: Record<string, string>;
  /**
   * Close the ZeroMQ sockets in {@linkcode DenoKernel.kill} (default true). A short-lived process
   * that exits right after the run passes false: closing sockets whose peer was killed crashed
   * the npm zeromq addon under Deno now and then (SIGSEGV), and process exit frees them anyway.
   */
  closeSockets?: boolean;
  /**
   * Gives up the start when it fires (checked at least every 2.5 s): the kernel is killed and
   * `start` rejects with a {@linkcode KernelError} saying so.
   */
  signal?: AbortSignal;
}

/** The outcome of {@linkcode DenoKernel.execute}. */
export interface ExecuteOutcome {
  /**
   * "ok" or "error" as the kernel replied; "timeout" when the per-cell limit passed; "died" when
   * the kernel process ended; "aborted" when the caller's signal fired.
   */
  status: "ok" | "error" | "timeout" | "died" | "aborted";
  /** The execution count from `execute_reply` (null when no reply came). */
  executionCount: number | null;
  /** The error content of the reply (ename, evalue, traceback) when status is "error". */
  error?: { ename: string; evalue: string; traceback: string[] };
  /** Milliseconds from request to completion. */
  elapsedMs: number;
  /**
   * True when the time limit passed after the code had finished but while its output was still
   * arriving (status "timeout"): the stored output is incomplete.
   */
  outputPending?: boolean;
}

/** Options of {@linkcode DenoKernel.execute}. */
export interface ExecuteOptions {
  /** Per-cell time limit in milliseconds. */
  timeoutMs: number;
  /** Called with every iopub message that answers this request, in order. */
  onIopub?: (message: JupyterMessage) => void;
  /** Aborts the wait (the caller then kills the kernel). */
  signal?: AbortSignal;
}

/**
 * Picks `count` distinct free TCP ports on 127.0.0.1 by binding port 0. All listeners stay open
 * until every port is chosen, so the ports are distinct.
 *
 * @param count How many ports.
 * @returns The port numbers.
 */
export function findFreePorts(count: number): number[] {
  const listeners = Array.from(
    { length: count },
    () => Deno.listen({ hostname: "127.0.0.1", port: 0 }),
  );
  const ports = listeners.map((l) => (l.addr as Deno.NetAddr).port);
  for (const l of listeners) l.close();
  return ports;
}

/**
 * Builds connection information with fresh free ports and a random 256-bit key.
 *
 * @returns The connection information.
 */
export function newConnectionInfo(): ConnectionInfo {
  const [shell, iopub, stdin, control, hb] = findFreePorts(5) as [
    number,
    number,
    number,
    number,
    number,
  ];
  return {
    transport: "tcp",
    ip: "127.0.0.1",
    shell_port: shell,
    iopub_port: iopub,
    stdin_port: stdin,
    control_port: control,
    hb_port: hb,
    key: randomBytes(32).toString("hex"),
    signature_scheme: "hmac-sha256",
    kernel_name: "deno",
  };
}

/**
 * The deno binary to run: an explicit path, else `SONORIGOR_DENO`, else the running deno.
 *
 * @param explicit A path given on the command line.
 * @returns The path.
 */
export function resolveDenoPath(explicit?: string): string {
  if (explicit !== undefined && explicit !== "") return explicit;
  const fromEnv = Deno.env.get("SONORIGOR_DENO");
  if (fromEnv !== undefined && fromEnv !== "") return fromEnv;
  return Deno.execPath();
}

/**
 * The start of the marker an output barrier prints (a random id follows), by which the end of a
 * cell's console output is recognised; see {@linkcode DenoKernel.execute}.
 */
export const OUTPUT_BARRIER = "sonorigor-output-barrier-";

/**
 * Quiet time on iopub after a failed barrier (its code threw, so no marker comes) after which a
 * cell's output counts as complete, in milliseconds.
 */
const BARRIER_QUIET_MS = 1_000;

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/** Serializes sends on one socket (zeromq allows one pending send per socket). */
class SendQueue {
  #tail: Promise<unknown> = Promise.resolve();
  constructor(readonly socket: zmq.Writable & zmq.Socket) {}
  send(frames: (string | Uint8Array)[]): Promise<void> {
    const next = this.#tail.then(() => this.socket.send(frames));
    this.#tail = next.catch(() => {});
    return next;
  }
}

/** Wakes a waiting loop when what it waits for may have happened. */
class Progress {
  #wake: () => void = () => {};

  /** Wakes the current wait, if any. */
  notify(): void {
    this.#wake();
  }

  /** Waits up to `ms` for {@linkcode Progress.notify}, an abort or `end`. */
  async wait(ms: number, signal: AbortSignal | undefined, end: Promise<unknown>): Promise<void> {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const onAbort = () => this.#wake();
    await Promise.race([
      new Promise<void>((resolve) => {
        this.#wake = resolve;
        timer = setTimeout(resolve, Math.max(0, ms));
        signal?.addEventListener("abort", onAbort, { once: true });
      }),
      end,
    ]);
    clearTimeout(timer);
    signal?.removeEventListener("abort", onAbort);
    this.#wake = () => {};
  }
}

/** A running Deno kernel and the client sockets connected to it. */
export class DenoKernel {
  /** Process id of the kernel (also its process group id). */
  readonly pid: number;
  /** The connection information written to the connection file. */
  readonly connection: ConnectionInfo;
  /** Content of the `kernel_info_reply` (set once started). */
  kernelInfo: Record<string, unknown> = {};
  /** Exit status once the kernel process ended, else null. */
  exitStatus: Deno.CommandStatus | null = null;

  readonly #child: Deno.ChildProcess;
  /** The private temporary folder holding the connection file (removed by `kill`). */
  readonly connectionFolder: string;
  readonly #session = randomUUID();
  readonly #shell = new zmq.Dealer({ linger: 0 });
  readonly #control = new zmq.Dealer({ linger: 0 });
  readonly #stdin = new zmq.Dealer({ linger: 0 });
  readonly #iopub = new zmq.Subscriber({ linger: 0 });
  readonly #hb = new zmq.Dealer({ linger: 0 });
  readonly #hbQueue = new SendQueue(this.#hb);
  readonly #pings = new Map<string, () => void>();
  readonly #shellQueue = new SendQueue(this.#shell);
  readonly #controlQueue = new SendQueue(this.#control);
  readonly #replyWaiters = new Map<string, (message: JupyterMessage) => void>();
  readonly #iopubListeners = new Map<string, (message: JupyterMessage) => void>();
  readonly #exited: Promise<Deno.CommandStatus>;
  #stderrTail = "";
  #closed = false;
  #closeSockets = true;

  private constructor(child: Deno.ChildProcess, connection: ConnectionInfo, dir: string) {
    this.#child = child;
    this.pid = child.pid;
    this.connection = connection;
    this.connectionFolder = dir;
    this.#exited = child.status.then((s) => (this.exitStatus = s));
    this.#drain(child.stdout, false);
    this.#drain(child.stderr, true);
  }

  /**
   * Starts the kernel and waits for its `kernel_info_reply` and for iopub to deliver.
   *
   * @param options Binary, working directory, startup timeout, environment.
   * @returns The started kernel.
   * @throws {KernelError} When the binary is missing, the process exits early or does not answer.
   */
  static async start(options: KernelStartOptions = {}): Promise<DenoKernel> {
    const denoPath = resolveDenoPath(options.denoPath);
    const connection = newConnectionInfo();
    const dir = await Deno.makeTempDir({ prefix: "sonorigor-kernel-" });
    const connectionFile = `${dir}/connection.json`;
    await Deno.writeTextFile(connectionFile, JSON.stringify(connection, null, 2), { mode: 0o600 });
    let child: Deno.ChildProcess;
    try {
      child = new Deno.Command(denoPath, {
        args: ["jupyter", "--kernel", "--conn", connectionFile],
        cwd: options.cwd ?? Deno.cwd(),
        env: { DENO_NO_UPDATE_CHECK: "1", ...options.env },
        stdin: "null",
        stdout: "piped",
        stderr: "piped",
        detached: true, // own session and process group, so the whole group can be killed
      }).spawn();
    } catch (error) {
      await Deno.remove(dir, { recursive: true }).catch(() => {});
      if (error instanceof Deno.errors.NotFound) {
        throw new KernelError(
          `Deno binary not found: '${denoPath}' (set --deno PATH or SONORIGOR_DENO)`,
          { cause: error },
        );
      }
      if (error instanceof Deno.errors.PermissionDenied) {
        throw new KernelError(`Deno binary not executable: '${denoPath}'`, { cause: error });
      }
      throw new KernelError(`Could not start the kernel with '${denoPath}': ${error}`, {
        cause: error,
      });
    }
    const kernel = new DenoKernel(child, connection, dir);
    kernel.#closeSockets = options.closeSockets ?? true;
    try {
      const startupMs = options.startupTimeoutMs ?? 60_000;
      const deadline = Date.now() + startupMs;
      await kernel.#connect(startupMs, options.signal);
      // the first barrier saves the console functions later barriers print with
      const ready = await kernel.#outputBarrier(undefined, deadline, options.signal);
      if (ready === "died") throw kernel.#diedError("while starting");
      if (ready === "aborted") throw new KernelError("Kernel start interrupted");
      if (ready === "timeout") {
        throw new KernelError(
          `Kernel did not deliver console output within ${
            startupMs / 1000
          } s${kernel.#stderrSuffix()}`,
        );
      }
    } catch (error) {
      await kernel.kill();
      throw error;
    }
    return kernel;
  }

  /** The last few kilobytes the kernel wrote to stderr. */
  get stderrTail(): string {
    return this.#stderrTail;
  }

  async #drain(stream: ReadableStream<Uint8Array>, keep: boolean): Promise<void> {
    const decoder = new TextDecoder();
    try {
      for await (const chunk of stream) {
        if (keep) this.#stderrTail = (this.#stderrTail + decoder.decode(chunk)).slice(-8192);
      }
    } catch {
      // the stream ends when the process is killed
    }
  }

  #url(port: number): string {
    return `tcp://${this.connection.ip}:${port}`;
  }

  /**
   * Dispatches every message of a socket to its waiter or listener, in bounded batches: a flood
   * of iopub messages must not starve the timers, signal listeners and process events that stop
   * a cell (see drain.ts).
   */
  #receiveLoop(socket: zmq.Readable & zmq.Socket, iopub: boolean): Promise<void> {
    return drainInBatches(() => socket.receive(), (frames) => {
      let message: JupyterMessage;
      try {
        message = deserializeMessage(frames, this.connection.key);
      } catch (error) {
        console.error(`warning: dropped a kernel message: ${(error as Error).message}`);
        return;
      }
      const parentId = message.parent_header.msg_id;
      if (parentId === undefined) return;
      const handler = iopub ? this.#iopubListeners.get(parentId) : this.#replyWaiters.get(parentId);
      handler?.(message);
    }, { isOpen: () => !this.#closed });
  }

  async #connect(timeoutMs: number, signal: AbortSignal | undefined): Promise<void> {
    this.#shell.connect(this.#url(this.connection.shell_port));
    this.#control.connect(this.#url(this.connection.control_port));
    this.#stdin.connect(this.#url(this.connection.stdin_port));
    this.#iopub.connect(this.#url(this.connection.iopub_port));
    this.#iopub.subscribe();
    this.#hb.connect(this.#url(this.connection.hb_port));
    this.#receiveLoop(this.#shell, false);
    this.#receiveLoop(this.#control, false);
    this.#receiveLoop(this.#iopub, true);
    this.#heartbeatLoop();
    const deadline = Date.now() + timeoutMs;
    // A SUB socket misses what is published before its subscription reaches the kernel, so ask
    // for kernel_info until a reply AND its iopub status message both arrive.
    while (true) {
      const remaining = deadline - Date.now();
      if (this.exitStatus !== null) throw this.#diedError("while starting");
      if (signal?.aborted) throw new KernelError("Kernel start interrupted");
      if (remaining <= 0) {
        throw new KernelError(
          `Kernel did not answer kernel_info_request within ${
            timeoutMs / 1000
          } s${this.#stderrSuffix()}`,
        );
      }
      const request = createMessage("kernel_info_request", {}, { session: this.#session });
      let sawIopub = false;
      this.#iopubListeners.set(request.header.msg_id, () => (sawIopub = true));
      const reply = this.#waitReply(request.header.msg_id, Math.min(remaining, 2_000));
      await this.#shellQueue.send(serializeMessage(request, this.connection.key));
      const message = await Promise.race([reply, this.#exited.then(() => null)]);
      if (message !== null) {
        this.kernelInfo = message.content;
        // give iopub a moment to deliver the status that accompanies the reply
        for (let i = 0; i < 20 && !sawIopub; i++) await sleep(25);
      }
      this.#iopubListeners.delete(request.header.msg_id);
      if (message !== null && sawIopub) return;
    }
  }

  #waitReply(msgId: string, timeoutMs: number): Promise<JupyterMessage | null> {
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.#replyWaiters.delete(msgId);
        resolve(null);
      }, timeoutMs);
      this.#replyWaiters.set(msgId, (message) => {
        clearTimeout(timer);
        this.#replyWaiters.delete(msgId);
        resolve(message);
      });
    });
  }

  #stderrSuffix(): string {
    const tail = this.#stderrTail.trim();
    return tail === "" ? "" : `; kernel stderr:\n${tail.split("\n").slice(-15).join("\n")}`;
  }

  #diedError(when: string): KernelError {
    const s = this.exitStatus;
    const how = s === null ? "" : s.signal !== null ? ` (signal ${s.signal})` : ` (exit ${s.code})`;
    return new KernelError(
      `Kernel process ${this.pid} exited ${when}${how}${this.#stderrSuffix()}`,
    );
  }

  /**
   * Checks the heartbeat channel: sends pings until one is echoed or the time runs out.
   *
   * The kernel's heartbeat socket is a REP socket. The client speaks to it with a DEALER socket
   * that adds the empty envelope frame a REQ socket would add (wire-identical to REQ), because a
   * REQ socket waits forever for a lost echo: the Deno kernel was seen to drop the first ping on
   * a fresh connection, and the npm `zeromq` REQ socket then never recovered under Deno.
   *
   * @param timeoutMs How long to wait for an echo in total.
   * @returns Whether an echo came back in time.
   */
  async heartbeat(timeoutMs = 5_000): Promise<boolean> {
    if (this.#closed || this.exitStatus !== null) return false;
    const deadline = Date.now() + timeoutMs;
    while (Date.now() < deadline && this.exitStatus === null) {
      const ping = `ping ${randomUUID()}`;
      let timer: ReturnType<typeof setTimeout> | undefined;
      const echoed = new Promise<boolean>((resolve) => {
        this.#pings.set(ping, () => resolve(true));
        timer = setTimeout(() => resolve(false), Math.min(1_000, deadline - Date.now()));
      });
      try {
        await this.#hbQueue.send(["", ping]);
      } catch {
        return false;
      }
      const ok = await echoed;
      clearTimeout(timer);
      this.#pings.delete(ping);
      if (ok) return true;
    }
    return false;
  }

  async #heartbeatLoop(): Promise<void> {
    const decoder = new TextDecoder();
    while (!this.#closed) {
      try {
        const frames = await this.#hb.receive();
        const payload = frames[frames.length - 1];
        if (payload !== undefined) this.#pings.get(decoder.decode(payload))?.();
      } catch {
        return; // socket closed
      }
    }
  }

  /**
   * Executes code and waits until the kernel has replied, gone idle, and delivered all the
   * console output of the code.
   *
   * The Deno kernel forwards console output asynchronously, after "idle", and labels each stream
   * message with the request running when it is sent: the tail of a flood would otherwise land
   * in the next cell, or be lost when the kernel shuts down. So once the code has finished, an
   * output barrier runs (see {@linkcode OUTPUT_BARRIER}) and the stream text that comes before
   * its markers, the rest of the cell's output, is passed to `onIopub` too.
   *
   * The time limit covers the code and the delivery of its output, and is checked while
   * messages pour in; an abort or the kernel's exit ends the wait at any point.
   *
   * @param code The cell source.
   * @param options Time limit, iopub callback, abort signal.
   * @returns How the execution ended.
   */
  async execute(code: string, options: ExecuteOptions): Promise<ExecuteOutcome> {
    const started = Date.now();
    const deadline = started + options.timeoutMs;
    const { signal } = options;
    const progress = new Progress();
    const request = this.#request(code, false);
    const id = request.header.msg_id;
    let reply: JupyterMessage | null = null;
    let idle = false;
    // The listener stays after this call: console output that a timer of the cell prints later
    // is labelled with this request (or its barrier's) until the next cell runs.
    this.#iopubListeners.set(id, (message) => {
      if (Date.now() >= deadline) progress.notify(); // the limit passed while messages pour in
      options.onIopub?.(message);
      if (message.header.msg_type === "status" && message.content.execution_state === "idle") {
        idle = true;
        progress.notify();
      }
    });
    this.#replyWaiters.set(id, (message) => {
      reply = message;
      progress.notify();
    });
    const finish = (status: ExecuteOutcome["status"], outputPending = false): ExecuteOutcome => {
      this.#replyWaiters.delete(id);
      const content = (reply as JupyterMessage | null)?.content;
      const count = content?.execution_count;
      const outcome: ExecuteOutcome = {
        status,
        executionCount: typeof count === "number" ? count : null,
        elapsedMs: Date.now() - started,
      };
      if (outputPending) outcome.outputPending = true;
      if (status === "error" && content !== undefined) {
        outcome.error = {
          ename: String(content.ename ?? "Error"),
          evalue: String(content.evalue ?? ""),
          traceback: Array.isArray(content.traceback) ? content.traceback.map(String) : [],
        };
      }
      return outcome;
    };
    const before = this.#stopReason(deadline, signal);
    if (before !== undefined) return finish(before); // not sent: the kernel stays idle
    await this.#shellQueue.send(serializeMessage(request, this.connection.key));
    while (reply === null || !idle) {
      const stop = this.#stopReason(deadline, signal);
      if (stop !== undefined) return finish(stop);
      await progress.wait(deadline - Date.now(), signal, this.#exited);
    }
    const status = (reply as JupyterMessage).content.status === "ok" ? "ok" : "error";
    const delivery = await this.#outputBarrier(options.onIopub, deadline, signal);
    if (delivery === "delivered" || delivery === "unconfirmed") return finish(status);
    if (delivery === "timeout") {
      // The code ended in time, but its output is still pouring in. "ok" here would let the
      // rest land in the next cell or be lost at shutdown: the cell has not finished.
      return status === "ok" ? finish("timeout", true) : finish("error");
    }
    return finish(delivery);
  }

  /** Why a wait must end now: an abort, the kernel's exit, or the deadline. */
  #stopReason(
    deadline: number,
    signal: AbortSignal | undefined,
  ): "aborted" | "died" | "timeout" | undefined {
    if (signal?.aborted) return "aborted";
    if (this.exitStatus !== null) return "died";
    if (Date.now() >= deadline) return "timeout";
    return undefined;
  }

  /**
   * Runs an output barrier: a silent request, kept out of the history (no execution count), that
   * prints a unique marker on stdout and on stderr through console functions saved at the first
   * barrier (so a cell that replaces `console` cannot silence it). The kernel delivers console
   * output in order, so once both markers have come, all console output printed before the
   * barrier has been delivered: the text before the markers goes to `onOutput`, the markers do
   * not.
   *
   * @param onOutput Receives the stream messages (markers removed) labelled with the barrier.
   * @param deadline Time (ms since the epoch) after which the wait gives up.
   * @param signal Ends the wait when it fires.
   * @returns "delivered"; "unconfirmed" when the barrier code itself failed and iopub stayed
   *   quiet for a second; else why the wait ended.
   */
  async #outputBarrier(
    onOutput: ((message: JupyterMessage) => void) | undefined,
    deadline: number,
    signal: AbortSignal | undefined,
  ): Promise<"delivered" | "unconfirmed" | "aborted" | "died" | "timeout"> {
    const marker = `${OUTPUT_BARRIER}${randomUUID()}`;
    const request = this.#request(
      `(globalThis[Symbol.for("sonorigor.outputBarrier")] ??= ` +
        `[console.log.bind(console), console.error.bind(console)])` +
        `.forEach((print) => print(${JSON.stringify(marker)}));`,
      true,
    );
    const id = request.header.msg_id;
    const progress = new Progress();
    const marked = new Set<string>();
    let reply: JupyterMessage | null = null;
    let lastIopubAt = Date.now();
    this.#iopubListeners.set(id, (message) => {
      lastIopubAt = Date.now();
      if (lastIopubAt >= deadline) progress.notify();
      if (message.header.msg_type !== "stream") return;
      const text = String(message.content.text ?? "");
      const rest = text.replace(`${marker}\n`, "");
      if (rest !== text) {
        marked.add(String(message.content.name));
        progress.notify();
      }
      if (rest !== "") onOutput?.({ ...message, content: { ...message.content, text: rest } });
    });
    this.#replyWaiters.set(id, (message) => {
      reply = message;
      progress.notify();
    });
    try {
      await this.#shellQueue.send(serializeMessage(request, this.connection.key));
      while (marked.size < 2) {
        const stop = this.#stopReason(deadline, signal);
        if (stop !== undefined) return stop;
        let waitMs = deadline - Date.now();
        if ((reply as JupyterMessage | null)?.content.status === "error") {
          const quiet = Date.now() - lastIopubAt;
          if (quiet >= BARRIER_QUIET_MS) return "unconfirmed";
          waitMs = Math.min(waitMs, BARRIER_QUIET_MS - quiet);
        }
        await progress.wait(waitMs, signal, this.#exited);
      }
      return "delivered";
    } finally {
      this.#replyWaiters.delete(id);
    }
  }

  /** An execute_request; a barrier is silent and kept out of the history. */
  #request(code: string, barrier: boolean): JupyterMessage {
    return createMessage("execute_request", {
      code,
      silent: barrier,
      store_history: !barrier,
      user_expressions: {},
      allow_stdin: false,
      stop_on_error: true,
    }, { session: this.#session });
  }

  /**
   * Shuts the kernel down: `shutdown_request` on control, a wait for the reply and the process to
   * exit (up to `graceMs`), then the process group is killed in any case and resources freed.
   *
   * @param graceMs How long the kernel may take to exit on its own.
   * @returns Whether the kernel exited by itself within the grace period.
   */
  async shutdown(graceMs = 5_000): Promise<boolean> {
    let clean = false;
    if (this.exitStatus === null && !this.#closed) {
      const request = createMessage("shutdown_request", { restart: false }, {
        session: this.#session,
      });
      try {
        const reply = this.#waitReply(request.header.msg_id, graceMs);
        await this.#controlQueue.send(serializeMessage(request, this.connection.key));
        // the Deno kernel may exit before its shutdown_reply reaches us: either one will do
        await Promise.race([reply, this.#exited]);
        await Promise.race([this.#exited, sleep(graceMs)]);
        clean = this.exitStatus !== null;
      } catch {
        clean = false;
      }
    }
    await this.kill();
    return clean;
  }

  /**
   * Stops the kernel's whole process group: an interrupt first (SIGINT, as a Jupyter front end
   * interrupts a kernel without a message interrupt mode; the Deno kernel exits on it), then
   * SIGTERM, then SIGKILL, each after a short grace; waits for the kernel process to be reaped,
   * closes the sockets and removes the connection file. Safe to call twice. Takes at most about
   * 2 s plus the reaping.
   *
   * @returns When the kernel process has exited and been reaped.
   */
  async kill(): Promise<void> {
    const signalGroup = (signal: Deno.Signal) => {
      try {
        Deno.kill(-this.pid, signal);
      } catch {
        // no such process group: already gone
      }
    };
    for (const [signal, graceMs] of [["SIGINT", 500], ["SIGTERM", 1_500]] as const) {
      if (this.exitStatus !== null) break;
      signalGroup(signal);
      await Promise.race([this.#exited, sleep(graceMs)]);
    }
    signalGroup("SIGKILL"); // also reaches anything the notebook started in the group
    await this.#exited;
    if (!this.#closed) {
      this.#closed = true;
      if (this.#closeSockets) {
        for (const s of [this.#shell, this.#control, this.#stdin, this.#iopub, this.#hb]) s.close();
      }
      this.#iopubListeners.clear();
      await Deno.remove(this.connectionFolder, { recursive: true }).catch(() => {});
    }
  }
}
