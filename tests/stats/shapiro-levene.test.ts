// Shapiro-Wilk and Brown-Forsythe Levene against R 4.2.2: scripts/r/shapiro-levene.R
// (shapiro.test(values); car::leveneTest(y ~ g, center = median)), data generated there with set.seed.
import { describe, expect, it } from "vitest";
import { brownForsytheLevene, encodeFactor, shapiroWilk, StatsInputError } from "@/lib/stats";
import { loadFixture } from "./fixture-runner";
import { expectClose } from "./helpers";

const fixture = loadFixture("shapiro_levene");

describe("Shapiro-Wilk (AS R94) vs R shapiro.test", () => {
  for (const sample of fixture.shapiro) {
    it(`n = ${sample.values.length}`, () => {
      const result = shapiroWilk(sample.values);
      expectClose(result.w, sample.w, 1e-10, 0, "W");
      expectClose(result.p, sample.p, 1e-8, 1e-12, "p");
    });
  }
  it("rejects n < 3, n > 5000 and constant data", () => {
    expect(() => shapiroWilk([1, 2])).toThrow(StatsInputError);
    expect(() => shapiroWilk(new Float64Array(5001).map((_, index) => Math.sin(index)))).toThrow(StatsInputError);
    expect(() => shapiroWilk([3, 3, 3, 3])).toThrow(/shapiro-wilk requires/);
  });
});

describe("Brown-Forsythe Levene vs car::leveneTest(center = median)", () => {
  it("matches F, df and p on unbalanced groups", () => {
    const { groups, values, f, df1, df2, p } = fixture.levene;
    const result = brownForsytheLevene(Float64Array.from(values), encodeFactor(groups));
    expectClose(result.f, f, 1e-10, 0, "F");
    expect([result.dfTreatment, result.dfResidual]).toEqual([df1, df2]);
    expectClose(result.p, p, 1e-10, 0, "p");
  });
});
