import assert from "node:assert/strict";

Deno.test("the calculation module imports and computes with no permission at all", async () => {
  const script = new URL("./fixtures/zero_permissions.ts", import.meta.url);
  const out = await new Deno.Command(Deno.execPath(), {
    args: ["run", "--no-prompt", "--quiet", script.pathname],
    stdout: "piped",
    stderr: "piped",
  }).output();
  const stderr = new TextDecoder().decode(out.stderr);
  assert.equal(out.code, 0, stderr);
  const r = JSON.parse(new TextDecoder().decode(out.stdout));
  // 4·4² = 64 mmHg (simplified Bernoulli, Hatle 1978: hand computation)
  assert.equal(r.exact, 64);
  // π·1²·20/80 = 0.785 cm² (continuity equation, Zoghbi 2003 / Baumgartner 2017: hand computation)
  assert.ok(Math.abs(r.gum - Math.PI / 4) < 1e-12);
  // Monte Carlo mean of 4v² for v ~ N(4, 0.1): 4(16 + 0.01) = 64.04 (moments of the normal)
  assert.ok(Math.abs(r.mc - 64.04) < 0.2);
  // t(0.975, 4) = 2.776 (JCGM 100:2008 Table G.2)
  assert.ok(Math.abs(r.t - 2.776) < 0.001);
  assert.ok(Number.isFinite(r.z));
});
