/**
 * Jupyter messaging protocol 5.3: message construction, HMAC-SHA256 signing and the wire format
 * (identities, delimiter, signature, four JSON frames, optional buffers). Pure functions, no
 * sockets; the kernel client in `kernel.ts` moves the frames.
 *
 * Reference: Jupyter Client documentation, "Messaging in Jupyter", protocol version 5.3
 * (wire protocol and message types).
 *
 * @module
 */
import { createHmac, randomUUID, timingSafeEqual } from "node:crypto";

/** The protocol version this client speaks. */
export const PROTOCOL_VERSION = "5.3";

/** The frame that separates the routing identities from the message frames. */
export const DELIMITER = "<IDS|MSG>";

/** A Jupyter message header. */
export interface MessageHeader {
  /** Unique id of this message. */
  msg_id: string;
  /** Message type, e.g. "execute_request". */
  msg_type: string;
  /** The client session id (one per client). */
  session: string;
  /** User name. */
  username: string;
  /** ISO 8601 creation time. */
  date: string;
  /** Protocol version. */
  version: string;
}

/** A decoded Jupyter message. */
export interface JupyterMessage {
  /** Routing identities that preceded the delimiter (empty for DEALER/SUB traffic). */
  identities: Uint8Array[];
  /** The header of this message. */
  header: MessageHeader;
  /** The header of the request this message answers (empty object when none). */
  parent_header: Partial<MessageHeader>;
  /** Message metadata. */
  metadata: Record<string, unknown>;
  /** Message content; its shape depends on `header.msg_type`. */
  content: Record<string, unknown>;
  /** Binary buffers that follow the content frame. */
  buffers: Uint8Array[];
}

/** Options of {@linkcode createMessage}. */
export interface CreateMessageOptions {
  /** The client session id. */
  session: string;
  /** The parent header, when the message answers another one. */
  parent?: MessageHeader;
  /** Metadata (default: empty). */
  metadata?: Record<string, unknown>;
  /** User name (default "sonorigor"). */
  username?: string;
}

/**
 * Builds a message with a fresh header.
 *
 * @param msgType The message type, e.g. "kernel_info_request".
 * @param content The message content.
 * @param options Session id and optional parent, metadata and user name.
 * @returns The message (without identities or buffers).
 */
export function createMessage(
  msgType: string,
  content: Record<string, unknown>,
  options: CreateMessageOptions,
): JupyterMessage {
  return {
    identities: [],
    header: {
      msg_id: randomUUID(),
      msg_type: msgType,
      session: options.session,
      username: options.username ?? "sonorigor",
      date: new Date().toISOString(),
      version: PROTOCOL_VERSION,
    },
    parent_header: options.parent ?? {},
    metadata: options.metadata ?? {},
    content,
    buffers: [],
  };
}

/**
 * HMAC-SHA256 signature (lower-case hex) of the four JSON frames, as the protocol prescribes:
 * HMAC(key, header ‖ parent_header ‖ metadata ‖ content). An empty key means signing is off and
 * the signature is the empty string.
 *
 * @param key The shared key from the connection file.
 * @param frames The four serialized frames, in order.
 * @returns The hex signature, or "" when the key is empty.
 */
export function signFrames(key: string, frames: readonly (string | Uint8Array)[]): string {
  if (key === "") return "";
  const hmac = createHmac("sha256", key);
  for (const frame of frames) hmac.update(frame);
  return hmac.digest("hex");
}

/**
 * Serializes a message to wire frames: identities, delimiter, signature, header, parent header,
 * metadata, content, buffers.
 *
 * @param message The message.
 * @param key The signing key ("" disables signing).
 * @returns The frames to send.
 */
export function serializeMessage(message: JupyterMessage, key: string): (string | Uint8Array)[] {
  const json = [
    JSON.stringify(message.header),
    JSON.stringify(message.parent_header),
    JSON.stringify(message.metadata),
    JSON.stringify(message.content),
  ];
  return [...message.identities, DELIMITER, signFrames(key, json), ...json, ...message.buffers];
}

const decoder = new TextDecoder();

/**
 * Parses wire frames into a message and checks the signature in constant time.
 *
 * @param frames The received frames.
 * @param key The signing key ("" disables the check).
 * @returns The decoded message.
 * @throws {Error} When the delimiter is missing, frames are missing, the signature does not match
 *   or a frame is not JSON.
 */
export function deserializeMessage(frames: readonly Uint8Array[], key: string): JupyterMessage {
  const at = frames.findIndex((f) => decoder.decode(f) === DELIMITER);
  if (at < 0) throw new Error("Jupyter message: missing the '<IDS|MSG>' delimiter frame");
  if (frames.length < at + 6) {
    throw new Error(
      `Jupyter message: expected at least 6 frames after the identities, got ${frames.length - at}`,
    );
  }
  const signature = decoder.decode(frames[at + 1]!);
  const json = frames.slice(at + 2, at + 6);
  if (key !== "") {
    const expected = signFrames(key, json);
    const a = new TextEncoder().encode(expected);
    const b = new TextEncoder().encode(signature);
    if (a.length !== b.length || !timingSafeEqual(a, b)) {
      throw new Error(`Jupyter message: invalid HMAC signature, got '${signature}'`);
    }
  }
  const parse = (i: number) => JSON.parse(decoder.decode(json[i]!));
  return {
    identities: frames.slice(0, at).map((f) => new Uint8Array(f)),
    header: parse(0) as MessageHeader,
    parent_header: parse(1) as Partial<MessageHeader>,
    metadata: parse(2) as Record<string, unknown>,
    content: parse(3) as Record<string, unknown>,
    buffers: frames.slice(at + 6).map((f) => new Uint8Array(f)),
  };
}
