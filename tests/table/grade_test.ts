import assert from "node:assert/strict";
import {
  adultSeverityBySex,
  classifyAdult,
  gradeTable,
  readTable,
  renderIssue,
} from "../../mod.ts";

Deno.test("the demo adult list: every row graded as one value is (Lang 2015 Table 2, from memory)", async () => {
  // examples/data/adult_clinic.csv is INVENTED demo data; the check is that the table path gives
  // what the one-value path gives, for both sexes
  const t = readTable(
    await Deno.readFile(new URL("../../examples/data/adult_clinic.csv", import.meta.url)),
  );
  const g = gradeTable(
    gradeTable(t, "ejectionFraction", adultSeverityBySex("lvEjectionFraction")),
    "laVolumeIndex",
    adultSeverityBySex("laVolumeIndex"),
  );
  const sex = g.columns.get("sex")!.values as string[];
  const ef = g.columns.get("ejectionFraction")!.values as Float64Array;
  const efClass = g.columns.get("ejectionFraction class")!.values as string[];
  const la = g.columns.get("laVolumeIndex")!.values as Float64Array;
  const laClass = g.columns.get("laVolumeIndex class")!.values as string[];
  for (let i = 0; i < g.rowCount; i++) {
    const s = sex[i] === "F" ? "female" : "male";
    assert.equal(efClass[i], classifyAdult("lvEjectionFraction", s, ef[i]!).grade);
    assert.equal(laClass[i], classifyAdult("laVolumeIndex", s, la[i]!).grade);
  }
  // A03: woman, LVEF 48 % → mildly abnormal (41–53); LAVI 38 → mildly abnormal (35–41)
  assert.deepEqual([efClass[2], laClass[2]], ["mildly abnormal", "mildly abnormal"]);
  assert.ok(g.cautions.some((c) => /from memory/.test(c)));
  assert.ok(g.cautions.some((c) => /^Classes of LV ejection fraction: .*Lang RM/.test(c)));
  assert.ok(g.cautions.some((c) => /Not a diagnosis/.test(c)));
});

Deno.test("a row whose table cannot be chosen keeps its place, with an issue on its line", () => {
  const t = readTable("patient,sex,lvef [%]\nA,F,60\nB,?,60\nC,M,\n");
  const g = gradeTable(t, "ejectionFraction", adultSeverityBySex("lvEjectionFraction"));
  assert.deepEqual(g.columns.get("ejectionFraction class")!.values, ["normal", "", ""]);
  const issue = g.issues.find((i) => i.row === 1 && i.kind === "range")!;
  assert.equal(
    renderIssue(issue),
    `Adult reference: line 3, expected 'sex' one of "F", "M", "female", "male", got "?"`,
  );
  assert.throws(() => gradeTable(t, "patient", adultSeverityBySex("lvEjectionFraction")), {
    name: "TypeError",
    message:
      "Grading 'patient': expected a numeric column of the table, one of ejectionFraction, got 'patient'",
  });
});
