import assert from "node:assert/strict";
import {
  createMessage,
  DELIMITER,
  deserializeMessage,
  PROTOCOL_VERSION,
  serializeMessage,
  signFrames,
} from "../protocol.ts";

const encode = (frames: (string | Uint8Array)[]) =>
  frames.map((f) => (typeof f === "string" ? new TextEncoder().encode(f) : f));

Deno.test("signFrames is HMAC-SHA256 over the concatenated frames (RFC 4231 test case 2)", () => {
  // RFC 4231, section 4.3 (test case 2): key "Jefe", data "what do ya want for nothing?",
  // HMAC-SHA-256 = 5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843.
  // Split over two frames, the signature must equal the HMAC of the concatenation, as the
  // Jupyter wire protocol prescribes (signature over header, parent, metadata, content in order).
  assert.equal(
    signFrames("Jefe", ["what do ya want ", "for nothing?"]),
    "5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843",
  );
});

Deno.test("signFrames returns an empty signature when the key is empty", () => {
  // Jupyter messaging docs, "The Wire Protocol": with an empty key, signing is disabled and the
  // signature frame is the empty string.
  assert.equal(signFrames("", ["{}", "{}", "{}", "{}"]), "");
});

Deno.test("createMessage builds a protocol 5.3 header with a fresh id", () => {
  const a = createMessage("kernel_info_request", {}, { session: "s1" });
  const b = createMessage("kernel_info_request", {}, { session: "s1" });
  assert.equal(PROTOCOL_VERSION, "5.3");
  assert.equal(a.header.version, "5.3");
  assert.equal(a.header.msg_type, "kernel_info_request");
  assert.equal(a.header.session, "s1");
  assert.notEqual(a.header.msg_id, b.header.msg_id);
  assert.ok(!Number.isNaN(Date.parse(a.header.date)));
  assert.deepEqual(a.parent_header, {});
});

Deno.test("serializeMessage lays out identities, delimiter, signature and four JSON frames", () => {
  const message = createMessage("execute_request", { code: "1 + 1" }, { session: "s" });
  message.identities = [new Uint8Array([1, 2, 3])];
  const frames = serializeMessage(message, "secret");
  // Jupyter messaging docs, "The Wire Protocol": [ids..., "<IDS|MSG>", hmac, header,
  // parent_header, metadata, content, buffers...].
  assert.equal(frames.length, 7);
  assert.deepEqual(frames[0], new Uint8Array([1, 2, 3]));
  assert.equal(frames[1], DELIMITER);
  assert.equal(frames[2], signFrames("secret", frames.slice(3, 7) as string[]));
  assert.deepEqual(JSON.parse(frames[6] as string), { code: "1 + 1" });
});

Deno.test("deserializeMessage round-trips a signed message and keeps identities", () => {
  const message = createMessage("status", { execution_state: "idle" }, { session: "s" });
  message.identities = [new TextEncoder().encode("peer")];
  const parsed = deserializeMessage(encode(serializeMessage(message, "k")), "k");
  assert.deepEqual(parsed.header, message.header);
  assert.deepEqual(parsed.content, { execution_state: "idle" });
  assert.equal(new TextDecoder().decode(parsed.identities[0]!), "peer");
  assert.equal(parsed.buffers.length, 0);
});

Deno.test("deserializeMessage rejects a tampered message", () => {
  const frames = serializeMessage(createMessage("status", { a: 1 }, { session: "s" }), "k");
  frames[5] = JSON.stringify({ a: 2 }); // the content frame (no identities here)
  assert.throws(() => deserializeMessage(encode(frames), "k"), {
    name: "Error",
    message: /^Jupyter message: invalid HMAC signature, got '[0-9a-f]{64}'$/,
  });
});

Deno.test("deserializeMessage rejects a wrong key and missing frames", () => {
  const frames = encode(serializeMessage(createMessage("status", {}, { session: "s" }), "k"));
  assert.throws(() => deserializeMessage(frames, "other"), {
    name: "Error",
    message: /invalid HMAC signature/,
  });
  assert.throws(() => deserializeMessage(frames.slice(2), "k"), {
    name: "Error",
    message: "Jupyter message: missing the '<IDS|MSG>' delimiter frame",
  });
  assert.throws(() => deserializeMessage(frames.slice(0, 4), "k"), {
    name: "Error",
    message: "Jupyter message: expected at least 6 frames after the identities, got 4",
  });
});
