/**
 * Writes docs/calculations.md: the reference of every calculation and family member of the
 * catalog, derived from the definitions (run `deno task docs`; `--check` fails when stale).
 *
 * @module
 */
import { CATALOG, catalogCalculations, catalogMarkdown } from "../mod.ts";

const text = catalogMarkdown(CATALOG);
const count = catalogCalculations(CATALOG).length;
const target = new URL("../docs/calculations.md", import.meta.url);
if (Deno.args.includes("--check")) {
  const current = await Deno.readTextFile(target).catch(() => "");
  if (current !== text) {
    console.error("docs/calculations.md is out of date: run `deno task docs`");
    Deno.exit(1);
  }
  console.log(`docs/calculations.md is current (${count} calculations)`);
} else {
  await Deno.mkdir(new URL("../docs/", import.meta.url), { recursive: true });
  await Deno.writeTextFile(target, text);
  console.log(`Wrote docs/calculations.md (${count} calculations)`);
}
