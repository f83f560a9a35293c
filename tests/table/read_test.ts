import assert from "node:assert/strict";
import {
  decodeUtf8,
  detectDelimiter,
  readTable,
  readTableFile,
  readTableStream,
  throwIfErrors,
} from "../../mod.ts";

const numeric = (t: ReturnType<typeof readTable>, name: string): Float64Array => {
  const c = t.columns.get(name);
  assert.ok(c?.kind === "numeric", `${name} is a numeric column`);
  return c.values;
};

Deno.test("the demo pediatric clinic list: columns by quantity, units converted, nothing dropped", async () => {
  // examples/data/pediatric_clinic.csv is INVENTED demo data
  const t = readTable(
    await Deno.readFile(new URL("../../examples/data/pediatric_clinic.csv", import.meta.url)),
    { source: "pediatric_clinic.csv", population: "pediatric" },
  );
  assert.equal(t.rowCount, 20);
  assert.deepEqual([...t.columns.keys()], [
    "patient",
    "sex",
    "age",
    "height",
    "weight",
    "lvEndDiastolicDiameter",
    "aorticRoot",
    "lvMass",
  ]);
  // mm → cm conversion of the declared header unit: 24 mm = 2.4 cm exactly (SI prefixes)
  assert.equal(numeric(t, "lvEndDiastolicDiameter")[0], 2.4);
  // two empty LV mass cells: noted as not measured with their lines, never dropped
  const notMeasured = t.issues.filter((x) => x.kind === "notMeasured");
  assert.deepEqual(notMeasured.map((x) => [x.line, x.field]), [[2, "lv mass [g]"], [
    20,
    "lv mass [g]",
  ]]);
  assert.ok(Number.isNaN(numeric(t, "lvMass")[0]!));
});

Deno.test("units from headers: brackets, the units option, a trailing unit word; converted exactly", () => {
  // 1 in = 2.54 cm and 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959)
  const t = readTable("h,w\n70.8661,176.37\n", {
    columns: { h: "height", w: "weight" },
    units: { h: "inch", w: "lb" },
  });
  assert.ok(Math.abs(numeric(t, "height")[0]! - 70.8661 * 2.54) < 1e-9);
  assert.ok(Math.abs(numeric(t, "weight")[0]! - 176.37 * 0.45359237) < 1e-9);
  const words = readTable("lvotDiameterMm,age [y]\n21,40\n");
  // 21 mm = 2.1 cm
  assert.equal(numeric(words, "lvotDiameter")[0], 2.1);
  assert.equal(numeric(words, "age")[0], 40);
  assert.throws(() => readTable("height,weight [kg]\n180,80\n"), {
    name: "TypeError",
    message:
      "table: line 1, column 'height' (Height) has no unit: expected it in the header, e.g. 'height [cm]', got 'height'",
  });
  assert.throws(() => readTable("height [mmHg],weight [kg]\n180,80\n", { source: "x.csv" }), {
    name: "TypeError",
    message:
      "x.csv: line 1, column 'height [mmHg]' (Height): expected a unit convertible to cm, got 'mmHg'",
  });
});

Deno.test("bad cells: line-numbered issues naming the column, the value and the valid range", () => {
  const csv = "id,height [cm],weight [kg]\nA,180,80\nB,175,abc\nC,900,70\nD,180,\n";
  const t = readTable(csv, { source: "clinic.csv" });
  const errors = t.issues.filter((i) => i.severity === "error");
  assert.deepEqual(errors.map((i) => [i.line, i.kind]), [[3, "type"], [4, "range"]]);
  assert.throws(() => throwIfErrors(t.issues), {
    name: "TypeError",
    message:
      `clinic.csv: line 3, expected 'weight [kg]' (Weight) as a number in [0.2, 650] kg, got "abc" (and 1 more problem)`,
  });
  assert.throws(() => readTable("id,height [cm],weight [kg]\nC,900,70\n", { onInvalid: "throw" }), {
    name: "RangeError",
    message: "table: line 2, expected 'height [cm]' (Height) in [15, 280] cm, got 900",
  });
  // converted units are checked after conversion: 2000 lb = 907 kg is outside the human range
  assert.throws(() => readTable("height [cm],weight [lb]\n180,2000\n", { onInvalid: "throw" }), {
    name: "RangeError",
    message:
      `table: line 2, expected 'weight [lb]' (Weight) in [0.2, 650] kg, got "2000 lb" (907.18474 kg)`,
  });
  // a short row is kept (its missing cell empty) and reported with its line
  const short = readTable("id,height [cm],weight [kg]\nA,180\n");
  assert.equal(short.rowCount, 1);
  assert.equal(short.issues[0]!.kind, "format");
  assert.equal(short.issues[0]!.line, 2);
});

Deno.test("blank lines and quoted multi-line cells keep every line number exact", () => {
  const csv = 'id,height [cm],weight [kg]\n"A\nsecond line",180,80\n\nB,175,abc\nC,170,70\n';
  const t = readTable(csv);
  assert.equal(t.rowCount, 3);
  assert.deepEqual(Array.from(t.lines), [2, 5, 6]);
  assert.deepEqual(t.blankLines, [4]);
  assert.equal(t.issues[0]!.line, 5);
});

Deno.test("delimiters: comma, semicolon and tab detected from the header line", () => {
  assert.equal(detectDelimiter("a;b;c\n1;2;3"), ";");
  assert.equal(detectDelimiter('"a,b";c\n'), ";");
  assert.equal(detectDelimiter("a\tb\n"), "\t");
  const t = readTable("id;height [cm];weight [kg]\nA;180;80\n");
  assert.equal(numeric(t, "height")[0], 180);
});

Deno.test("strict UTF-8: an invalid byte is an error with its offset and line, never replaced", () => {
  // "Ren" + 0xE8: "è" in Latin-1, not UTF-8 (RFC 3629); "é" before it takes two bytes, so the
  // bad byte is byte 16 (0-based) of line 3
  const bytes = Uint8Array.of(
    ...new TextEncoder().encode("id,v\nRené,1\n"),
    0x52,
    0x65,
    0x6e,
    0xe8,
  );
  assert.throws(() => decodeUtf8(bytes, "people.csv"), {
    name: "TypeError",
    message: /^people\.csv: expected UTF-8 text, got an invalid byte 0xe8 at byte 16, line 3/,
  });
  assert.throws(() => readTable(bytes, { source: "people.csv" }), TypeError);
  assert.equal(decodeUtf8(new TextEncoder().encode("René"), "x"), "René");
});

Deno.test("malformed files: unclosed quote by line, an empty file, two columns of one quantity", () => {
  assert.throws(() => readTable('id,height [cm]\nA,180\n"B,170\n'), {
    name: "TypeError",
    message:
      "table: line 3, expected every quoted field to be closed, got a quote that opens a field here and is never closed",
  });
  assert.throws(() => readTable(""), {
    name: "TypeError",
    message: "table: expected a header line, got an empty file",
  });
  assert.throws(() => readTable("height [cm],stature [cm]\n1,2\n"), {
    name: "TypeError",
    message:
      "table: line 1, columns 'height [cm]' and 'stature [cm]' both hold Height; expected one (map one of them as text)",
  });
});

// ---------------------------------------------------------------------------------------------
// Hostile files: encodings, delimiters, quotes, line endings, streams

/** Windows-1252 bytes of a text whose characters are all in Latin-1 (é = 0xE9, è = 0xE8). */
function latin1(text: string): Uint8Array {
  return Uint8Array.from(text, (ch) => ch.charCodeAt(0));
}

Deno.test("a Windows-1252 file is refused as UTF-8 (offset and line) and read exactly when named", () => {
  // "René" and "Renè": two people, whose names differ only by the accent
  const csv = "patient,observer,lvef percent\nRené,A,55\nRené,B,57\nRenè,A,60\nRenè,B,61\n";
  const bytes = latin1(csv);
  // 0xE9 is the 34th byte (0-based 33): "patient,observer,lvef percent\n" is 30 bytes, "Ren" 3
  assert.throws(() => readTable(bytes, { source: "people.csv" }), {
    name: "TypeError",
    message:
      /^people\.csv: expected UTF-8 text, got an invalid byte 0xe9 at byte 33, line 2: save the file as UTF-8, or name its encoding/,
  });
  const t = readTable(bytes, { source: "people.csv", encoding: "windows-1252" });
  const patient = t.columns.get("patient")!;
  assert.ok(patient.kind === "text");
  // WHATWG Encoding Standard, index windows-1252: 0xE9 → U+00E9 é, 0xE8 → U+00E8 è
  assert.deepEqual([...new Set(patient.values)], ["René", "Renè"]);
  assert.equal(t.rowCount, 4);
});

Deno.test("encodings: an unknown label, a byte the named encoding lacks, a UTF-8 mark under another name", () => {
  assert.throws(() => readTable(latin1("a\n1\n"), { encoding: "latin-9000" }), {
    name: "TypeError",
    message:
      "table: expected 'encoding' as an encoding label of the WHATWG Encoding Standard (utf-8, windows-1252, iso-8859-1, iso-8859-15, utf-16le, utf-16be, …), got \"latin-9000\"",
  });
  // ISO-8859-3 leaves 0xA5 unassigned (WHATWG index iso-8859-3): byte 7, line 3
  assert.throws(
    () =>
      readTable(Uint8Array.of(0x69, 0x64, 0x0a, 0x41, 0x0a, 0x42, 0x43, 0xa5), {
        source: "x.csv",
        encoding: "iso-8859-3",
      }),
    {
      name: "TypeError",
      message:
        "x.csv: expected iso-8859-3 text, got a byte sequence it cannot hold (0xa5) at byte 7, line 3: name the file's actual encoding",
    },
  );
  assert.throws(
    () =>
      readTable(Uint8Array.of(0xef, 0xbb, 0xbf, 0x69, 0x64, 0x0a), { encoding: "windows-1252" }),
    /expected windows-1252 text as named, got a file that starts with the UTF-8 byte-order mark/,
  );
  // UTF-16 with its byte-order mark, named (the mark is taken off)
  const utf16 = new Uint8Array([
    0xff,
    0xfe,
    ...new Uint8Array(
      new Uint16Array(
        Array.from("id,height [cm]\nA,180\n", (c) => c.charCodeAt(0)),
      ).buffer,
    ),
  ]);
  assert.equal(numeric(readTable(utf16, { encoding: "utf-16le" }), "height")[0], 180);
});

Deno.test("an invalid byte found in a later chunk of a stream: its offset and line in the file", async () => {
  const good = new TextEncoder().encode("id,note\nA,é\nB,x\n"); // 17 bytes, "é" is two
  const bad = Uint8Array.of(0x43, 0x2c, 0xff, 0x0a); // "C," then 0xFF, never valid UTF-8
  const stream = ReadableStream.from([good.subarray(0, 11), good.subarray(11), bad]);
  await assert.rejects(() => readTableStream(stream, { source: "s.csv" }), {
    name: "TypeError",
    message: /^s\.csv: expected UTF-8 text, got an invalid byte 0xff at byte 19, line 4:/,
  });
});

Deno.test("delimiters: a semicolon file read with a comma is named; tab and semicolon detected", () => {
  assert.throws(
    () => readTable("id;height [cm];weight [kg]\nA;180;80\n", { delimiter: ",", source: "s.csv" }),
    {
      name: "TypeError",
      message:
        "s.csv: line 1, expected columns separated by ',' (the delimiter given), got one column 'id;height [cm];weight [kg]' holding ';': set the delimiter to ';' or 'auto'",
    },
  );
  const tabs = readTable("id\theight [cm]\nA\t180\n");
  assert.equal(numeric(tabs, "height")[0], 180);
  // a comma inside a quoted header does not outvote the semicolons
  assert.equal(detectDelimiter('"a,b,c";d;e\n'), ";");
});

Deno.test("line numbers: quoted line breaks, CRLF, old Mac line ends, comments, unclosed quotes", () => {
  // a CRLF file whose first row holds a quoted line break: the error of the next row is on line 4
  const crlf = readTable('id,note,weight [kg]\r\nA,"one\r\ntwo",80\r\nB,x,abc\r\n', {
    source: "crlf.csv",
  });
  assert.deepEqual(Array.from(crlf.lines), [2, 4]);
  assert.equal(crlf.issues[0]!.line, 4);
  const note = crlf.columns.get("note")!;
  assert.ok(note.kind === "text" && note.values[0] === "one\r\ntwo" && note.values[1] === "x");
  // lines ended by "\r" alone
  const mac = readTable("id,weight [kg]\rA,80\r\rB,abc\r");
  assert.deepEqual(Array.from(mac.lines), [2, 4]);
  assert.deepEqual(mac.blankLines, [3]);
  assert.equal(mac.issues[0]!.line, 4);
  // the comment lines a writer puts first count as lines
  const commented = readTable('# a caution\n"# another, quoted"\nid,weight [kg]\nA,abc\n');
  assert.equal(commented.issues[0]!.line, 4);
  // an unclosed quote is reported on the line where it opens, after a quoted line break
  assert.throws(() => readTable('id,note\nA,"two\nlines"\nB,ok\nC,"never closed\nD,x\n'), {
    name: "TypeError",
    message:
      "table: line 5, expected every quoted field to be closed, got a quote that opens a field here and is never closed",
  });
  // text after a closing quote
  assert.throws(() => readTable('id,note\nA,ok\nB,"x"y\n'), {
    name: "TypeError",
    message: /^table: line 3, expected a quoted field to end at its closing quote, got text after/,
  });
});

Deno.test("a file read from disk, streamed, is the table read from its bytes", async () => {
  const csv = 'patient;weight [kg];note\nA;80;"x\ny"\nB;abc;z\n';
  const path = await Deno.makeTempFile({ suffix: ".csv" });
  await Deno.writeTextFile(path, csv);
  const fromFile = await readTableFile(path, { source: "t.csv" });
  const fromText = readTable(csv, { source: "t.csv" });
  assert.deepEqual(Array.from(fromFile.lines), Array.from(fromText.lines));
  assert.deepEqual(fromFile.issues, fromText.issues);
  assert.deepEqual(numeric(fromFile, "weight"), numeric(fromText, "weight"));
  await Deno.remove(path);
});

// V8 keeps the subject of the last regular-expression match alive (the legacy RegExp.input, a
// de-facto standard of JavaScript engines); a long cell is a slice that holds its whole chunk of
// the file, so a table read must not leave a cell there (measured: a 10⁶-row text, 60 MB, stayed
// in memory; common practice, no source)
Deno.test("reading a table leaves no cell of the file as the engine's last regular-expression match", () => {
  const lines = ["height [cm],weight [kg]"];
  for (let i = 0; i < 2_000; i++) lines.push(`${120 + i / 7000},${25 + i / 9000}`);
  const t = readTable(lines.join("\n") + "\n", { population: "pediatric" });
  assert.equal(t.rowCount, 2_000);
  assert.equal((RegExp as unknown as { input: string }).input, "");
});
