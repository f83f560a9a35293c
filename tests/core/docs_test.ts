import assert from "node:assert/strict";

Deno.test("docs/reference.md is generated from the current definitions (run `deno task docs`)", async () => {
  const out = await new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--allow-read",
      "--allow-env",
      "--allow-sys",
      new URL("../../cli/docs.ts", import.meta.url).pathname,
      "--check",
    ],
    stdout: "piped",
    stderr: "piped",
  }).output();
  assert.ok(out.success, new TextDecoder().decode(out.stderr));
  assert.match(
    new TextDecoder().decode(out.stdout),
    /docs\/reference\.md is current \(\d+ calculations\)/,
  );
});
