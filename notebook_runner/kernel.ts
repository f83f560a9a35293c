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

/** Quiet time on iopub after "idle" before a cell counts as finished, in milliseconds. */
const SETTLE_MS = 60;

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
  readonly #connectionDir: string;
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
    this.#connectionDir = dir;
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
      await kernel.#connect(options.startupTimeoutMs ?? 60_000);
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

  async #receiveLoop(socket: zmq.Readable & zmq.Socket, iopub: boolean): Promise<void> {
    while (!this.#closed) {
      let frames: Uint8Array[];
      try {
        frames = await socket.receive();
      } catch {
        return; // socket closed
      }
      let message: JupyterMessage;
      try {
        message = deserializeMessage(frames, this.connection.key);
      } catch (error) {
        console.error(`warning: dropped a kernel message: ${(error as Error).message}`);
        continue;
      }
      const parentId = message.parent_header.msg_id;
      if (parentId === undefined) continue;
      const handler = iopub ? this.#iopubListeners.get(parentId) : this.#replyWaiters.get(parentId);
      handler?.(message);
    }
  }

  async #connect(timeoutMs: number): Promise<void> {
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
   * Executes code and waits until the kernel has replied and gone idle for this request.
   *
   * @param code The cell source.
   * @param options Time limit, iopub callback, abort signal.
   * @returns How the execution ended.
   */
  async execute(code: string, options: ExecuteOptions): Promise<ExecuteOutcome> {
    const started = Date.now();
    const request = createMessage("execute_request", {
      code,
      silent: false,
      store_history: true,
      user_expressions: {},
      allow_stdin: false,
      stop_on_error: true,
    }, { session: this.#session });
    const id = request.header.msg_id;
    let reply: JupyterMessage | null = null;
    let idle = false;
    let wake: () => void = () => {};
    const progressed = () => wake();
    let lastIopubAt = Date.now();
    this.#iopubListeners.set(id, (message) => {
      lastIopubAt = Date.now();
      options.onIopub?.(message);
      if (message.header.msg_type === "status" && message.content.execution_state === "idle") {
        idle = true;
        progressed();
      }
    });
    this.#replyWaiters.set(id, (message) => {
      reply = message;
      progressed();
    });
    const finish = (status: ExecuteOutcome["status"]): ExecuteOutcome => {
      // The iopub listener stays: the Deno kernel forwards console output asynchronously, so a
      // stream message may arrive after "idle", even while the next cell runs; it still carries
      // this request as parent and so still reaches this cell's outputs.
      this.#replyWaiters.delete(id);
      const content = (reply as JupyterMessage | null)?.content;
      const count = content?.execution_count;
      const outcome: ExecuteOutcome = {
        status,
        executionCount: typeof count === "number" ? count : null,
        elapsedMs: Date.now() - started,
      };
      if (status === "error" && content !== undefined) {
        outcome.error = {
          ename: String(content.ename ?? "Error"),
          evalue: String(content.evalue ?? ""),
          traceback: Array.isArray(content.traceback) ? content.traceback.map(String) : [],
        };
      }
      return outcome;
    };
    if (this.exitStatus !== null) return finish("died");
    await this.#shellQueue.send(serializeMessage(request, this.connection.key));
    const deadline = started + options.timeoutMs;
    while (true) {
      if (reply !== null && idle) {
        // let late console output settle: wait for a short quiet spell on iopub
        const quiet = Date.now() - lastIopubAt;
        if (quiet >= SETTLE_MS || Date.now() - deadline >= 0) {
          const status = (reply as JupyterMessage).content.status;
          return finish(status === "ok" ? "ok" : "error");
        }
        await sleep(SETTLE_MS - quiet);
        continue;
      }
      if (options.signal?.aborted) return finish("aborted");
      if (this.exitStatus !== null) return finish("died");
      const remaining = deadline - Date.now();
      if (remaining <= 0) return finish("timeout");
      let timer: ReturnType<typeof setTimeout> | undefined;
      let onAbort: (() => void) | undefined;
      await Promise.race([
        new Promise<void>((resolve) => {
          wake = resolve;
          timer = setTimeout(resolve, remaining);
          onAbort = () => resolve();
          options.signal?.addEventListener("abort", onAbort, { once: true });
        }),
        this.#exited,
      ]);
      clearTimeout(timer);
      if (onAbort !== undefined) options.signal?.removeEventListener("abort", onAbort);
    }
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
   * Kills the kernel's whole process group (SIGTERM, then SIGKILL), waits for the kernel process
   * to be reaped, closes the sockets and removes the connection file. Safe to call twice.
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
    if (this.exitStatus === null) {
      signalGroup("SIGTERM");
      await Promise.race([this.#exited, sleep(1_500)]);
    }
    signalGroup("SIGKILL"); // also reaches anything the notebook started in the group
    await this.#exited;
    if (!this.#closed) {
      this.#closed = true;
      if (this.#closeSockets) {
        for (const s of [this.#shell, this.#control, this.#stdin, this.#iopub, this.#hb]) s.close();
      }
      this.#iopubListeners.clear();
      await Deno.remove(this.#connectionDir, { recursive: true }).catch(() => {});
    }
  }
}
