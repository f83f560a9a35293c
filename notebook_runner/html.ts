/**
 * Self-contained HTML export of an executed notebook: rendered Markdown (marked), code cells,
 * text outputs (ANSI colour codes stripped, escaped), HTML tables, inline SVG figures, PNG/JPEG as
 * data URIs, and vega / vega-lite outputs shown through their static SVG (or PNG) twin. The page
 * carries a small inline stylesheet and a Content-Security-Policy that forbids every network
 * load, so it views identically offline.
 *
 * @module
 */
import { Marked, type Tokens } from "marked";
import { type Cell, joinText, type MimeData, type Notebook, type Output } from "./nbformat.ts";

/**
 * Escapes the five HTML-significant characters. The runner is a package of its own and imports
 * nothing from the echo library, so it keeps this one-liner rather than sharing the library's.
 */
function escapeHtml(text: string): string {
  return text.replaceAll("&", "&amp;").replaceAll("<", "&lt;").replaceAll(">", "&gt;")
    .replaceAll('"', "&quot;").replaceAll("'", "&#39;");
}

// ESC [ params intermediates final  |  ESC ] ... BEL/ST  |  other two-byte ESC sequences
// deno-lint-ignore no-control-regex -- matching ESC is the point of this pattern
const ANSI_PATTERN = /\x1b\[[0-?]*[ -\/]*[@-~]|\x1b\][^\x07\x1b]*(?:\x07|\x1b\\)|\x1b[@-Z\\-_]/g;

/**
 * Removes ANSI escape sequences (colours, cursor moves, hyperlinks) from terminal text.
 *
 * @param text Text that may contain ANSI sequences.
 * @returns The text without them.
 */
export function stripAnsi(text: string): string {
  return text.replace(ANSI_PATTERN, "");
}

/** Options of {@linkcode notebookToHtml}. */
export interface HtmlExportOptions {
  /** Document title (default: the first Markdown heading, else "Notebook"). */
  title?: string;
  /** A label for the footer, e.g. the notebook path. */
  sourceLabel?: string;
  /**
   * Resolves a relative image reference in Markdown to a data URI (or undefined to leave it).
   * The runner passes one that reads files beside the notebook.
   */
  resolveImage?: (href: string) => string | undefined;
}

/** MIME types of vega and vega-lite specifications (any version). */
const VEGA_MIME = /^application\/vnd\.vega(?:lite)?\.v\d+\+json$/;

const STYLE = `
:root{--fg:#1d232a;--muted:#5b6570;--line:#d8dde3;--code:#f5f7f9;--err:#fbeaea;--errfg:#8a1c1c}
*{box-sizing:border-box}
body{margin:0;font:15px/1.55 system-ui,-apple-system,"Segoe UI",Roboto,sans-serif;color:var(--fg);background:#fff}
main{max-width:980px;margin:0 auto;padding:24px 20px 48px}
.cell{margin:14px 0}
.markdown h1,.markdown h2,.markdown h3{line-height:1.25;margin:1.1em 0 .5em}
.markdown table,.html-output table{border-collapse:collapse;margin:6px 0}
.markdown th,.markdown td{border:1px solid var(--line);padding:3px 8px}
.markdown img{max-width:100%}
.input{display:flex;gap:8px}
.prompt{flex:0 0 64px;color:var(--muted);font:12px/1.9 ui-monospace,monospace;text-align:right;user-select:none}
.body{flex:1;min-width:0}
pre{margin:0;padding:8px 10px;overflow-x:auto;font:13px/1.45 ui-monospace,SFMono-Regular,Menlo,Consolas,monospace;white-space:pre-wrap;word-break:break-word}
.source{background:var(--code);border:1px solid var(--line);border-radius:4px}
.outputs{margin-top:4px}
.output{display:flex;gap:8px;margin:2px 0}
.stream.stderr pre{background:#fff8e6}
.error pre{background:var(--err);color:var(--errfg);border-radius:4px}
.html-output{overflow-x:auto;padding:4px 0}
.figure svg,.figure img{max-width:100%;height:auto}
.note{color:var(--muted);font-style:italic}
footer{margin-top:32px;color:var(--muted);font-size:12px;border-top:1px solid var(--line);padding-top:8px}
`;

const CSP = "default-src 'none'; img-src data:; style-src 'unsafe-inline'; font-src data:";

function renderMarkdown(source: string, cell: Cell, options: HtmlExportOptions): string {
  const attachments = "attachments" in cell ? cell.attachments ?? {} : {};
  const marked = new Marked({ gfm: true, async: false });
  marked.use({
    walkTokens(token) {
      if (token.type !== "image") return;
      const image = token as Tokens.Image;
      if (image.href.startsWith("attachment:")) {
        const bundle = attachments[image.href.slice("attachment:".length)];
        const mime = bundle === undefined ? undefined : Object.keys(bundle)[0];
        if (bundle !== undefined && mime !== undefined) {
          image.href = `data:${mime};base64,${joinText(bundle[mime]).replace(/\s+/g, "")}`;
        }
      } else if (!/^[a-z][a-z0-9+.-]*:/i.test(image.href)) {
        const resolved = options.resolveImage?.(image.href);
        if (resolved !== undefined) image.href = resolved;
      }
    },
  });
  return marked.parse(source, { async: false });
}

/** Removes an XML declaration and DOCTYPE so an SVG document can sit inline in HTML. */
function inlineSvg(svg: string): string {
  return svg.replace(/<\?xml[^>]*\?>/g, "").replace(/<!DOCTYPE[^>]*>/gi, "").trim();
}

function imageTag(mime: string, data: unknown, metadata: Record<string, unknown>): string {
  const meta = (metadata[mime] ?? {}) as Record<string, unknown>;
  const size = ["width", "height"].filter((k) => typeof meta[k] === "number")
    .map((k) => ` ${k}="${meta[k]}"`).join("");
  const base64 = joinText(data).replace(/\s+/g, "");
  return `<img src="data:${mime};base64,${base64}" alt="figure"${size}>`;
}

/**
 * Renders one MIME bundle as static HTML, choosing the richest representation that needs no
 * script and no network.
 *
 * @param data The bundle.
 * @param metadata Per-MIME metadata (image sizes).
 * @returns The HTML fragment.
 */
export function renderMimeBundle(data: MimeData, metadata: Record<string, unknown> = {}): string {
  const has = (mime: string) => data[mime] !== undefined;
  const isVega = Object.keys(data).some((m) => VEGA_MIME.test(m));
  const html = has("text/html") ? joinText(data["text/html"]) : undefined;
  const staticFigure = () => {
    if (has("image/svg+xml")) {
      return `<div class="figure">${inlineSvg(joinText(data["image/svg+xml"]))}</div>`;
    }
    for (const mime of ["image/png", "image/jpeg", "image/gif"]) {
      if (has(mime)) return `<div class="figure">${imageTag(mime, data[mime], metadata)}</div>`;
    }
    return undefined;
  };
  // A vega/vega-lite bundle's HTML would need a script to draw: use its static twin instead,
  // and likewise for any HTML that carries a script when a static figure exists.
  if (isVega || (html !== undefined && /<script\b/i.test(html))) {
    const figure = staticFigure();
    if (figure !== undefined) return figure;
    if (isVega) {
      return `<p class="note">Chart specification without a static SVG or PNG rendering.</p>${
        has("text/plain") ? `<pre>${escapeHtml(stripAnsi(joinText(data["text/plain"])))}</pre>` : ""
      }`;
    }
  }
  if (html !== undefined) return `<div class="html-output">${html}</div>`;
  const figure = staticFigure();
  if (figure !== undefined) return figure;
  if (has("text/markdown")) {
    return `<div class="markdown">${
      new Marked({ gfm: true, async: false }).parse(joinText(data["text/markdown"]), {
        async: false,
      })
    }</div>`;
  }
  if (has("application/json")) {
    return `<pre>${escapeHtml(JSON.stringify(data["application/json"], null, 2))}</pre>`;
  }
  if (has("text/plain")) return `<pre>${escapeHtml(stripAnsi(joinText(data["text/plain"])))}</pre>`;
  return `<p class="note">Output in ${
    escapeHtml(Object.keys(data).join(", ") || "no")
  } format, not shown.</p>`;
}

function renderOutput(output: Output): string {
  switch (output.output_type) {
    case "stream":
      return `<div class="output stream ${escapeHtml(output.name)}"><div class="prompt"></div>` +
        `<div class="body"><pre>${escapeHtml(stripAnsi(joinText(output.text)))}</pre></div></div>`;
    case "error": {
      const traceback = output.traceback.length > 0
        ? output.traceback.map(stripAnsi).join("\n")
        : `${output.ename}: ${output.evalue}`;
      return `<div class="output error"><div class="prompt"></div><div class="body"><pre>${
        escapeHtml(traceback)
      }</pre></div></div>`;
    }
    case "execute_result":
      return `<div class="output result"><div class="prompt">Out [${
        output.execution_count ?? " "
      }]:</div><div class="body">${renderMimeBundle(output.data, output.metadata)}</div></div>`;
    case "display_data":
      return `<div class="output display"><div class="prompt"></div><div class="body">${
        renderMimeBundle(output.data, output.metadata)
      }</div></div>`;
  }
}

function renderCell(cell: Cell, options: HtmlExportOptions): string {
  const id = `cell-${escapeHtml(cell.id)}`;
  const source = joinText(cell.source);
  if (cell.cell_type === "markdown") {
    return `<section class="cell markdown" id="${id}">${
      renderMarkdown(source, cell, options)
    }</section>`;
  }
  if (cell.cell_type === "raw") {
    return `<section class="cell raw" id="${id}"><pre>${escapeHtml(source)}</pre></section>`;
  }
  const prompt = `In [${cell.execution_count ?? " "}]:`;
  return `<section class="cell code" id="${id}"><div class="input"><div class="prompt">${prompt}` +
    `</div><div class="body"><pre class="source"><code class="language-typescript">${
      escapeHtml(source)
    }</code></pre></div></div><div class="outputs">${
      cell.outputs.map(renderOutput).join("")
    }</div></section>`;
}

/**
 * The title of a notebook: its first Markdown level-1 heading, else "Notebook".
 *
 * @param notebook The notebook.
 * @returns The title text.
 */
export function notebookTitle(notebook: Notebook): string {
  for (const cell of notebook.cells) {
    if (cell.cell_type !== "markdown") continue;
    const match = /^#\s+(.+)$/m.exec(joinText(cell.source));
    if (match?.[1] !== undefined) return match[1].trim();
  }
  return "Notebook";
}

/**
 * Exports a notebook as one self-contained HTML document.
 *
 * @param notebook The (executed) notebook.
 * @param options Title, footer label and image resolver.
 * @returns The HTML document.
 */
export function notebookToHtml(notebook: Notebook, options: HtmlExportOptions = {}): string {
  const title = options.title ?? notebookTitle(notebook);
  const kernel = notebook.metadata.kernelspec?.display_name ?? "Deno";
  const footer = `Exported by the sonorigor notebook runner${
    options.sourceLabel === undefined ? "" : ` from ${escapeHtml(options.sourceLabel)}`
  } · kernel: ${escapeHtml(kernel)}`;
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta http-equiv="Content-Security-Policy" content="${CSP}">
<meta name="generator" content="sonorigor notebook runner">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main class="notebook">
${notebook.cells.map((cell) => renderCell(cell, options)).join("\n")}
<footer>${footer}</footer>
</main>
</body>
</html>
`;
}
