/**
 * Decoding a table's bytes into text, strictly: UTF-8 unless the caller names another encoding
 * (a WHATWG label such as "windows-1252"), always with a fatal decoder, so that a byte the
 * encoding cannot hold is an error naming its byte offset and line, never a silent U+FFFD. Works on
 * a whole file or chunk by chunk (a stream), with the same messages.
 *
 * @module
 */

/** Encodings named most often for exported tables, in the messages about an unknown label. */
const COMMON_ENCODINGS = "utf-8, windows-1252, iso-8859-1, iso-8859-15, utf-16le, utf-16be";

/**
 * A fatal decoder for an encoding label, or a TypeError naming the label received and the labels
 * accepted (the WHATWG Encoding Standard's).
 */
function fatalDecoder(encoding: string, source: string): TextDecoder {
  try {
    return new TextDecoder(encoding, { fatal: true, ignoreBOM: false });
  } catch {
    throw new TypeError(
      `${source}: expected 'encoding' as an encoding label of the WHATWG Encoding Standard (${COMMON_ENCODINGS}, …), got ${
        JSON.stringify(encoding)
      }`,
    );
  }
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 §4), or the length when none does. */
function firstInvalidUtf8(b: Uint8Array, from: number): number {
  let i = from;
  while (i < b.length) {
    const c = b[i]!;
    const n = c < 0x80
      ? 0
      : c >= 0xc2 && c <= 0xdf
      ? 1
      : c >= 0xe0 && c <= 0xef
      ? 2
      : c >= 0xf0 && c <= 0xf4
      ? 3
      : -1;
    if (n < 0) return i;
    for (let k = 1; k <= n; k++) {
      const d = b[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
    }
    const second = b[i + 1] ?? 0;
    if (
      (c === 0xe0 && second < 0xa0) || (c === 0xed && second > 0x9f) ||
      (c === 0xf0 && second < 0x90) || (c === 0xf4 && second > 0x8f)
    ) {
      return i;
    }
    i += n + 1;
  }
  return b.length;
}

/** Offset where a fresh fatal decoder first fails on `b` (any encoding): the shortest failing
 * prefix, found by bisection (a streaming decode fails on a prefix once it holds a bad sequence). */
function firstUndecodable(b: Uint8Array, from: number, encoding: string): number {
  const fails = (end: number) => {
    try {
      new TextDecoder(encoding, { fatal: true }).decode(b.subarray(from, end), { stream: true });
      return false;
    } catch {
      return true;
    }
  };
  if (!fails(b.length)) return b.length;
  let lo = from; // never fails
  let hi = b.length; // fails
  while (hi - lo > 1) {
    const mid = (lo + hi) >>> 1;
    if (fails(mid)) hi = mid;
    else lo = mid;
  }
  return lo;
}

function countLineBreaks(text: string): number {
  let n = 0;
  for (let k = text.indexOf("\n"); k !== -1; k = text.indexOf("\n", k + 1)) n++;
  return n;
}

/**
 * A strict decoder of one file's bytes, fed chunk by chunk: it keeps the byte offset and the line
 * reached, so that a byte the encoding cannot hold is reported where it is.
 *
 * @example
 * ```ts
 * import { TableDecoder } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const d = new TableDecoder("demo.csv");
 * // "é" split across two chunks is decoded once both halves are in
 * assert.equal(d.decode(Uint8Array.of(0x61, 0x0a, 0xc3)) + d.decode(Uint8Array.of(0xa9), true),
 *   "a\né");
 * // "Ren" + 0xE8 ("è" in Windows-1252) is not UTF-8: byte 3, line 1
 * assert.throws(() => new TableDecoder("x.csv").decode(Uint8Array.of(0x52, 0x65, 0x6e, 0xe8), true),
 *   /x\.csv: expected UTF-8 text, got an invalid byte 0xe8 at byte 3, line 1/);
 * // the same bytes, named as Windows-1252
 * assert.equal(new TableDecoder("x.csv", "windows-1252")
 *   .decode(Uint8Array.of(0x52, 0x65, 0x6e, 0xe8), true), "Renè");
 * ```
 */
export class TableDecoder {
  readonly #source: string;
  readonly #encoding: string;
  readonly #decoder: TextDecoder;
  /** Bytes fed before the previous chunk, and line breaks decoded before it. */
  #bytesBefore = 0;
  #linesBefore = 0;
  /** The previous chunk (to place an error that straddles two chunks). */
  #previous: Uint8Array = new Uint8Array(0);
  #previousLines = 0;

  /**
   * A decoder for one file.
   *
   * @param source Name of the file, for messages.
   * @param encoding A WHATWG encoding label. @default "utf-8"
   * @throws {TypeError} For a label the platform does not know.
   */
  constructor(source: string, encoding = "utf-8") {
    this.#source = source;
    this.#decoder = fatalDecoder(encoding, source);
    this.#encoding = this.#decoder.encoding;
  }

  /** The encoding's canonical name ("utf-8", "windows-1252", …). */
  get encoding(): string {
    return this.#encoding;
  }

  /**
   * Decodes the next chunk (with `last` for the final one: an unfinished sequence at the end is
   * then an error).
   *
   * @throws {TypeError} At the first byte the encoding cannot hold, naming its offset and line.
   */
  decode(bytes: Uint8Array, last = false): string {
    if (
      this.#bytesBefore + this.#previous.length === 0 && !this.#encoding.startsWith("utf-") &&
      bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf
    ) {
      throw new TypeError(
        `${this.#source}: expected ${this.#encoding} text as named, got a file that starts with the UTF-8 byte-order mark (bytes 0-2, line 1): read it as UTF-8, the default`,
      );
    }
    let text: string;
    try {
      text = this.#decoder.decode(bytes, { stream: !last });
    } catch {
      throw this.#error(bytes);
    }
    const lines = countLineBreaks(text);
    this.#bytesBefore += this.#previous.length;
    this.#linesBefore += this.#previousLines;
    this.#previous = bytes;
    this.#previousLines = lines;
    return text;
  }

  /** The error for a chunk that failed: the bad byte located in the previous chunk and this one. */
  #error(bytes: Uint8Array): TypeError {
    const window = new Uint8Array(this.#previous.length + bytes.length);
    window.set(this.#previous, 0);
    window.set(bytes, this.#previous.length);
    let at: number;
    if (this.#encoding === "utf-8") {
      // start at the first character boundary of the previous chunk (not a continuation byte)
      let from = 0;
      while (from < this.#previous.length && (window[from]! & 0xc0) === 0x80) from++;
      at = firstInvalidUtf8(window, from);
    } else {
      at = firstUndecodable(window, 0, this.#encoding);
      if (at < this.#previous.length) {
        at = firstUndecodable(window, this.#previous.length, this.#encoding);
      }
    }
    if (at >= window.length) at = window.length - 1;
    const before = new TextDecoder(this.#encoding).decode(window.subarray(0, at));
    const line = this.#linesBefore + countLineBreaks(before) + 1;
    const byte = window[at]!.toString(16).padStart(2, "0");
    const offset = this.#bytesBefore + at;
    return new TypeError(
      this.#encoding === "utf-8"
        ? `${this.#source}: expected UTF-8 text, got an invalid byte 0x${byte} at byte ${offset}, line ${line}: save the file as UTF-8, or name its encoding (a Windows-1252 or Latin-1 export turns "é" into one such byte)`
        : `${this.#source}: expected ${this.#encoding} text, got a byte sequence it cannot hold (0x${byte}) at byte ${offset}, line ${line}: name the file's actual encoding`,
    );
  }
}

/**
 * Checks that bytes are UTF-8 and decodes them; an invalid sequence is an error naming its byte
 * offset and line (RFC 3629 for what UTF-8 allows). For another encoding, use a
 * {@linkcode TableDecoder} or the `encoding` option of the table readers.
 *
 * @param bytes The file's bytes.
 * @param source Name for messages.
 * @returns The text, without a leading byte-order mark.
 * @throws {TypeError} At the first invalid byte, with its offset and line.
 *
 * @example
 * ```ts
 * import { decodeUtf8 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(decodeUtf8(new TextEncoder().encode("René"), "demo.csv"), "René");
 * // "Ren" + 0xE8 (è in Latin-1) is not UTF-8
 * assert.throws(() => decodeUtf8(Uint8Array.of(0x52, 0x65, 0x6e, 0xe8), "demo.csv"),
 *   /byte 3, line 1/);
 * ```
 */
export function decodeUtf8(bytes: Uint8Array, source: string): string {
  return new TableDecoder(source).decode(bytes, true);
}
