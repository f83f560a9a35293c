import assert from "node:assert/strict";
import {
  ejectionFraction,
  gradeSeverity,
  MITRAL_REGURGITATION_2017,
  normal,
  propagate,
  volumetricRegurgitation,
} from "../../mod.ts";

// The cases of an expert review: Monte Carlo must complete where a draw is physically impossible
// and say how often that happened, instead of stopping at the first such draw.

Deno.test("EF by Monte Carlo with ESV close to EDV completes and reports the share of impossible draws", () => {
  const inputs = { endDiastolicVolumeMl: normal(150, 10), endSystolicVolumeMl: normal(120, 10) };
  const correlated = propagate(ejectionFraction, inputs, {
    method: "monteCarlo",
    trials: 1_000_000,
    seed: 7,
    correlations: [["endDiastolicVolumeMl", "endSystolicVolumeMl", 0.7]],
  });
  // P(ESV > EDV) = Φ(−30/√(10² + 10² − 2·0.7·10·10)) = Φ(−3.873) = 5.38e-5 (standard normal CDF,
  // scipy.stats.norm.cdf): about 54 of 10⁶ trials, binomial σ ≈ 7.3
  const excluded = correlated.monteCarlo!.excludedTrials;
  assert.ok(Math.abs(excluded - 53.8) < 4 * 7.3, String(excluded));
  assert.ok(
    correlated.warnings.some((w) =>
      // the share to one significant digit below 0.1 %
      w.startsWith(
        `${excluded} of 1000000 trials (${
          (100 * excluded / 1e6).toPrecision(1)
        } %) were physically inconsistent and were excluded (draws breaking ` +
          "'endSystolicVolumeMl' (LV end-systolic volume) ≤ 'endDiastolicVolumeMl' (LV end-diastolic volume))",
      )
    ),
    correlated.warnings.join("\n"),
  );
  const ef = correlated.outputs.ejectionFractionPercent;
  // every kept trial is possible; excluded ones are NaN in the samples
  let nan = 0;
  for (const v of ef.samples!) {
    if (Number.isNaN(v)) nan++;
    else assert.ok(v >= 0 && v <= 100);
  }
  assert.equal(nan, excluded);
  // uncorrelated: Φ(−30/√200) = Φ(−2.121) = 0.01695 (scipy.stats.norm.cdf), σ ≈ 0.00041
  const independent = propagate(ejectionFraction, inputs, {
    method: "monteCarlo",
    trials: 100_000,
    seed: 7,
  });
  assert.ok(Math.abs(independent.monteCarlo!.excludedTrials / 1e5 - 0.01695) < 0.0017);
  // refusal is a choice, and then the run is an error naming what was inconsistent
  assert.throws(
    () =>
      propagate(ejectionFraction, inputs, {
        method: "monteCarlo",
        trials: 100_000,
        seed: 7,
        inconsistentTrials: "refuse",
      }),
    {
      name: "RangeError",
      message:
        /breaks the relation 'endSystolicVolumeMl' \(LV end-systolic volume\) ≤ 'endDiastolicVolumeMl' \(LV end-diastolic volume\)/,
    },
  );
});

Deno.test("volumetric regurgitation near zero grades, with the inconsistent share reported", () => {
  const r = propagate(volumetricRegurgitation, {
    totalStrokeVolumeMl: normal(90, 10),
    forwardStrokeVolumeMl: normal(75, 8),
  }, { method: "monteCarlo", trials: 200_000, seed: 3 });
  // P(forward > total) = Φ(−15/√(10² + 8²)) = Φ(−1.1713) = 0.1207 (scipy.stats.norm.cdf),
  // binomial σ ≈ 0.00073
  const share = r.monteCarlo!.excludedTrials / 200_000;
  assert.ok(Math.abs(share - 0.1207) < 0.003, String(share));
  const grade = gradeSeverity(
    MITRAL_REGURGITATION_2017.regurgitantVolume,
    r.outputs.regurgitantVolumeMl,
  );
  assert.equal(grade.excluded, r.monteCarlo!.excludedTrials);
  assert.equal(grade.count, 200_000 - grade.excluded);
  assert.ok(Math.abs(grade.probabilities.reduce((s, p) => s + p.probability, 0) - 1) < 1e-12);
  assert.match(grade.basis, /trials excluded as physically inconsistent are not counted/);
  // the kept trials are those with forward ≤ total: RVol ≥ 0, so the mildest class is certain
  // here (Zoghbi 2017 MR regurgitant volume < 30 mL is mild, from memory)
  assert.equal(grade.mostLikely, "mild");
});
