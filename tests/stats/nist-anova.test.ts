// NIST Statistical Reference Datasets, one-way ANOVA, SmLs01-SmLs09
// (https://www.itl.nist.gov/div898/strd/anova/anova.html). The data are rebuilt from their
// published description by scripts/r/nist.R (decimal strings, tests/fixtures/stats/nist_smls0*.csv).
// Certified values below are stated from memory of the NIST pages; they also follow exactly from
// the data description (between SS = n_j · Σ(c_j - 1.4)² = n_j · 0.08, within SS = 9 · (n_j - 1) · 0.01),
// and R's anova(lm()) on the same data agrees for SmLs01-03 (stored in nist_anova.json).
import { describe, expect, it } from "vitest";
import { analyzeTrial } from "@/lib/stats";
import { loadFixture, loadRows } from "./fixture-runner";
import { logRelativeError } from "./helpers";

const certified: Record<string, { dfBetween: number; ssBetween: number; msBetween: number; dfWithin: number; ssWithin: number; msWithin: number; f: number; rSquared: number }> = {
  small: { dfBetween: 8, ssBetween: 1.68, msBetween: 0.21, dfWithin: 180, ssWithin: 1.8, msWithin: 0.01, f: 21, rSquared: 0.482758620689655 },
  medium: { dfBetween: 8, ssBetween: 16.08, msBetween: 2.01, dfWithin: 1800, ssWithin: 18, msWithin: 0.01, f: 201, rSquared: 0.471830985915493 },
  large: { dfBetween: 8, ssBetween: 160.08, msBetween: 20.01, dfWithin: 18000, ssWithin: 180, msWithin: 0.01, f: 2001, rSquared: 0.470712773465067 },
};
const sizeOf = ["small", "medium", "large"];
const fixture = loadFixture("nist_anova");

describe("NIST StRD one-way ANOVA (certified values), at least 9 correct digits", () => {
  for (const [name, set] of Object.entries<any>(fixture.sets)) {
    it(`${name}: ${set.n} observations`, () => {
      const values = certified[sizeOf[(Number(name.slice(4)) - 1) % 3]];
      const result = analyzeTrial(loadRows(set.file), { design: "crd", response: "y", treatment: "treatment" });
      const [between, within] = result.anova!;
      expect(between.df).toBe(values.dfBetween);
      expect(within.df).toBe(values.dfWithin);
      const digits = {
        ssBetween: logRelativeError(between.ss, values.ssBetween),
        msBetween: logRelativeError(between.ms, values.msBetween),
        ssWithin: logRelativeError(within.ss, values.ssWithin),
        msWithin: logRelativeError(within.ms, values.msWithin),
        f: logRelativeError(between.f as number, values.f),
        rSquared: logRelativeError(between.ss / (between.ss + within.ss), values.rSquared),
      };
      for (const [quantity, lre] of Object.entries(digits)) {
        expect(lre, `${name} ${quantity} has ${lre.toFixed(1)} correct digits`).toBeGreaterThanOrEqual(9);
      }
    });
  }
});

describe("R on the same NIST data (cross-check of the reconstruction)", () => {
  it("R's anova(lm()) gives the certified values for SmLs01-03 (where double precision suffices)", () => {
    for (const name of ["SmLs01", "SmLs02", "SmLs03"]) {
      const values = certified[sizeOf[(Number(name.slice(4)) - 1) % 3]];
      expect(logRelativeError(fixture.sets[name].r.ssBetween, values.ssBetween)).toBeGreaterThan(11);
      expect(logRelativeError(fixture.sets[name].r.ssWithin, values.ssWithin)).toBeGreaterThan(11);
    }
  });
});
