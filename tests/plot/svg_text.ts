/**
 * The text a reader sees in an SVG rendered by vega: the content of every `<text>` element, its
 * lines (`<tspan>`s) joined by a space and its entities decoded. Shared by the chart tests.
 *
 * @module
 */

const ENTITIES: Readonly<Record<string, string>> = {
  "&amp;": "&",
  "&lt;": "<",
  "&gt;": ">",
  "&quot;": '"',
  "&#39;": "'",
  "&apos;": "'",
};

/** Every text element of an SVG as one line of plain text. */
export function svgTexts(svg: string): string[] {
  // an empty text element is self-closing (`<text …/>`): no text, and not the start of the next
  return [...svg.matchAll(/<text\b[^>]*?(?:\/>|>([\s\S]*?)<\/text>)/g)].map((m) =>
    (m[1] ?? "").replace(/<tspan\b[^>]*>/g, " ").replace(/<\/tspan>/g, "")
      .replace(/&(amp|lt|gt|quot|#39|apos);/g, (e) => ENTITIES[e]!)
      .replace(/\s+/g, " ").trim()
  );
}

/** All the text of an SVG, one element per line. */
export function svgText(svg: string): string {
  return svgTexts(svg).join("\n");
}
