import assert from "node:assert/strict";
import {
  CATALOG,
  catalogCalculations,
  catalogMarkdown,
  INPUT_UNCERTAINTY_CALCULATIONS,
  INPUT_UNCERTAINTY_FAMILIES,
  rebuild,
} from "../../mod.ts";

Deno.test("uncertainty models: calculations and families registered, members documented and rebuilt", () => {
  for (const c of INPUT_UNCERTAINTY_CALCULATIONS) {
    assert.equal(CATALOG.calculations.get(c.id), c);
  }
  const all = catalogCalculations(CATALOG);
  const md = catalogMarkdown(CATALOG);
  for (const f of INPUT_UNCERTAINTY_FAMILIES) {
    assert.equal(CATALOG.families.get(f.id), f);
    assert.ok(f.members.length > 0);
    for (const p of f.members) {
      const member = f.calculation(p);
      assert.ok(all.includes(member), member.id);
      assert.ok(md.includes(`(\`${member.id}\`)`), member.id);
      assert.equal(rebuild(CATALOG, structuredClone(member.recipe)), member);
    }
  }
});
