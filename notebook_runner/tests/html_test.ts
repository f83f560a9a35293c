import assert from "node:assert/strict";
import { notebookTitle, notebookToHtml, renderMimeBundle, stripAnsi } from "../html.ts";
import type { Notebook } from "../nbformat.ts";

Deno.test("stripAnsi removes SGR colours, OSC hyperlinks and cursor sequences", () => {
  // ECMA-48 (5th ed., 1991), 5.4: CSI sequences are ESC [ parameters intermediates final byte;
  // OSC strings end with BEL or ESC \ (ST). The Deno kernel colours numbers yellow (SGR 33).
  assert.equal(stripAnsi("\x1b[33m42\x1b[39m"), "42");
  assert.equal(
    stripAnsi('{ a: \x1b[33m1\x1b[39m, b: \x1b[32m"two"\x1b[39m }'),
    '{ a: 1, b: "two" }',
  );
  assert.equal(stripAnsi("\x1b]8;;file:///x\x07link\x1b]8;;\x07"), "link");
  assert.equal(stripAnsi("a\x1b[2K\x1b[1Gb\x1b[0m"), "ab");
  assert.equal(stripAnsi("plain [33m text"), "plain [33m text");
});

Deno.test("renderMimeBundle prefers HTML, escapes plain text and inlines figures", () => {
  assert.equal(
    renderMimeBundle({ "text/html": "<table><tr><td>1</td></tr></table>", "text/plain": "1" }),
    '<div class="html-output"><table><tr><td>1</td></tr></table></div>',
  );
  assert.equal(
    renderMimeBundle({ "text/plain": "\x1b[33m<b>&</b>\x1b[39m" }),
    "<pre>&lt;b&gt;&amp;&lt;/b&gt;</pre>",
  );
  assert.equal(
    renderMimeBundle({
      "image/svg+xml": '<?xml version="1.0"?>\n<!DOCTYPE svg>\n<svg><rect/></svg>',
      "text/plain": "fig",
    }),
    '<div class="figure"><svg><rect/></svg></div>',
  );
  assert.equal(
    renderMimeBundle({ "image/png": "iVBO\nRw==" }, { "image/png": { width: 20 } }),
    '<div class="figure"><img src="data:image/png;base64,iVBORw==" alt="figure" width="20"></div>',
  );
  assert.match(renderMimeBundle({ "text/markdown": "*hi*" }), /<em>hi<\/em>/);
  assert.equal(
    renderMimeBundle({ "application/json": { a: 1 } }),
    "<pre>{\n  &quot;a&quot;: 1\n}</pre>",
  );
  assert.match(
    renderMimeBundle({ "application/x-custom": "?" }),
    /application\/x-custom format, not shown/,
  );
});

Deno.test("renderMimeBundle shows vega-lite through its static twin, never its script", () => {
  const spec = { mark: "point" };
  const withSvg = renderMimeBundle({
    "application/vnd.vegalite.v5+json": spec,
    "text/html": '<div id="v"></div><script>vegaEmbed("#v")</script>',
    "image/svg+xml": '<svg id="twin"></svg>',
  });
  assert.equal(withSvg, '<div class="figure"><svg id="twin"></svg></div>');
  const withPng = renderMimeBundle({ "application/vnd.vega.v6+json": spec, "image/png": "AA==" });
  assert.match(withPng, /^<div class="figure"><img src="data:image\/png;base64,AA=="/);
  const bare = renderMimeBundle({
    "application/vnd.vegalite.v6+json": spec,
    "text/plain": "chart",
  });
  assert.match(bare, /without a static SVG or PNG rendering/);
  assert.doesNotMatch(bare + withSvg + withPng, /<script/);
});

const sample: Notebook = {
  metadata: { kernelspec: { name: "deno", display_name: "Deno" } },
  nbformat: 4,
  nbformat_minor: 5,
  cells: [
    {
      id: "m1",
      cell_type: "markdown",
      metadata: {},
      source: ["# Valve study\n", "\n", "Text with **bold** and ![dot](attachment:dot.png).\n"],
      attachments: { "dot.png": { "image/png": "AAAA" } },
    },
    {
      id: "c1",
      cell_type: "code",
      metadata: {},
      source: "const s = '<tag>';\ns",
      execution_count: 4,
      outputs: [
        { output_type: "stream", name: "stderr", text: ["warn <x>\n"] },
        {
          output_type: "execute_result",
          execution_count: 4,
          data: { "text/plain": "'<tag>'" },
          metadata: {},
        },
        {
          output_type: "error",
          ename: "RangeError",
          evalue: "bad",
          traceback: ["\x1b[31mRangeError\x1b[0m: bad", "    at <anonymous>:1:1"],
        },
      ],
    },
    { id: "r1", cell_type: "raw", metadata: {}, source: "<raw & text>" },
  ],
};

Deno.test("notebookToHtml writes a self-contained document", () => {
  const html = notebookToHtml(sample, { sourceLabel: "notebooks/x.ipynb" });
  assert.match(html, /^<!DOCTYPE html>/);
  assert.match(html, /<title>Valve study<\/title>/);
  assert.match(html, /<h1>Valve study<\/h1>/);
  assert.match(html, /<strong>bold<\/strong>/);
  assert.match(html, /<img src="data:image\/png;base64,AAAA" alt="dot">/);
  assert.match(html, /In \[4\]:/);
  assert.match(html, /Out \[4\]:/);
  assert.match(html, /const s = &#39;&lt;tag&gt;&#39;;/);
  assert.match(html, /warn &lt;x&gt;/);
  assert.ok(html.includes("RangeError: bad\n    at &lt;anonymous&gt;:1:1"));
  assert.match(html, /&lt;raw &amp; text&gt;/);
  assert.match(html, /<style>[^<]+<\/style>/);
  assert.match(html, /Exported by the sonorigor notebook runner from notebooks\/x\.ipynb/);
  // Nothing to fetch: a CSP that forbids network loads, and no external references.
  assert.match(html, /Content-Security-Policy" content="default-src 'none'; img-src data:/);
  assert.doesNotMatch(html, /(src|href)="(https?:)?\/\//);
  assert.doesNotMatch(html, /<script|<link/);
  assert.ok(!html.includes("\x1b"), "no ANSI escape left");
});

Deno.test("notebookToHtml inlines local Markdown images through the resolver", () => {
  const nb: Notebook = {
    ...sample,
    cells: [{
      id: "m",
      cell_type: "markdown",
      metadata: {},
      source: "![a](fig.svg) ![b](https://x.test/b.png)",
    }],
  };
  const seen: string[] = [];
  const html = notebookToHtml(nb, {
    resolveImage: (href) => {
      seen.push(href);
      return "data:image/svg+xml;base64,PHN2Zy8+";
    },
  });
  assert.deepEqual(seen, ["fig.svg"]); // absolute URLs are never resolved
  assert.match(html, /<img src="data:image\/svg\+xml;base64,PHN2Zy8\+" alt="a">/);
});

Deno.test("notebookTitle falls back when there is no level-1 heading", () => {
  assert.equal(notebookTitle(sample), "Valve study");
  assert.equal(notebookTitle({ ...sample, cells: [] }), "Notebook");
});
