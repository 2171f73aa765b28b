// Designs against R 4.2.2. Data and expected values: scripts/r/designs.R (set.seed, exported CSVs);
// each fixture JSON carries the exact R calls (lm, anova, emmeans, pairs, shapiro.test,
// car::leveneTest(center = median), friedman.test) in its r_calls field.
import { describe, expect, it } from "vitest";
import { analyzeFixture, compareWithR } from "./fixture-runner";
import { expectClose } from "./helpers";

describe("RCBD with 3 lost plots (R lm + emmeans, Tukey-Kramer)", () => {
  const { actual, expected } = analyzeFixture("rcbd_lost_plots");
  it("matches R's sequential ANOVA, lsmeans, SEs and pairwise p-values", () => {
    compareWithR(actual, expected);
    expect(actual.lsd).toBeNull();
    expect(actual.dropped).toBe(3);
  });
  it("matches R's TOST against T1 with margin 3", () => {
    expect(actual.equivalence.margin).toBe(3);
    expected.equivalence.results.forEach((line: any, index: number) => {
      const mine = actual.equivalence.results[index];
      expect([mine.treatment, mine.reference]).toEqual([line.treatment, line.reference]);
      expectClose(mine.diff, line.diff, 1e-9, 1e-12, "diff");
      expectClose(mine.se, line.se, 1e-9, 0, "se");
      expectClose(mine.p, line.p, 1e-9, 1e-300, `${line.treatment} p`);
      expectClose(mine.ci90[0], line.ci90[0], 1e-9, 1e-12, "ci90 lower");
      expectClose(mine.ci90[1], line.ci90[1], 1e-9, 1e-12, "ci90 upper");
      expect(mine.equivalent).toBe(line.equivalent);
    });
  });
  it("matches R's percent control against T1", () => {
    expected.percentControl.forEach((line: any, index: number) => {
      expect(actual.percentControl[index].treatment).toBe(line.treatment);
      expectClose(actual.percentControl[index].percent, line.percent, 1e-9, 1e-12, line.treatment);
    });
  });
});

describe("Latin square (R lm(y ~ row + col + trt))", () => {
  it("matches R for the complete 5 x 5 square", () => {
    const { actual, expected } = analyzeFixture("latin_square");
    compareWithR(actual, expected);
  });
  it("matches R with one lost plot (least-squares path)", () => {
    const { actual, expected } = analyzeFixture("latin_square_lost_plot");
    compareWithR(actual, expected);
    expect(actual.lsd).toBeNull();
  });
});

describe("RCBD combined over sites (treatment tested against site:treatment)", () => {
  it("matches R for the balanced 3 sites x 3 blocks x 5 treatments", () => {
    const { actual, expected } = analyzeFixture("combined_sites");
    compareWithR(actual, expected);
  });
  it("matches R's sequential SS and lsmeans with 2 lost plots", () => {
    const { actual, expected } = analyzeFixture("combined_sites_lost_plots");
    compareWithR(actual, expected);
  });
});

describe("transformations with back-transformed means (R emmeans on the transformed response)", () => {
  for (const name of ["transform_sqrt", "transform_log1p", "transform_asin_sqrt"]) {
    it(`matches R for ${name}`, () => {
      const { actual, expected } = analyzeFixture(name);
      compareWithR(actual, expected);
    });
  }
});

describe("Friedman test with ties (R friedman.test)", () => {
  it("matches R's tie-corrected statistic", () => {
    const { actual, expected } = analyzeFixture("friedman_ties");
    compareWithR(actual, expected);
  });
});

describe("Welch two-sample t-test (R t.test)", () => {
  it("matches R's t, df, p and 95% CI", () => {
    const { actual, expected } = analyzeFixture("welch_t_test");
    for (const key of ["t", "df", "p", "meanDiff"]) expectClose(actual.tTest[key], expected.tTest[key], 1e-9, 0, key);
    expectClose(actual.tTest.ci[0], expected.tTest.ci[0], 1e-9, 0, "ci lower");
    expectClose(actual.tTest.ci[1], expected.tTest.ci[1], 1e-9, 0, "ci upper");
    expect([actual.tTest.a, actual.tTest.b]).toEqual(["hand", "robot"]);
  });
});

describe("Gomez & Gomez (1984) rice seeding-rate RCBD", () => {
  const { actual, expected, fixture } = analyzeFixture("gomez_rcbd");
  it("reproduces the published ANOVA sums of squares (book table stated from memory, rounded to units)", () => {
    expectClose(actual.anova[0].ss, fixture.published.ssReplication, 0, 0.5, "replication SS");
    expectClose(actual.anova[1].ss, fixture.published.ssTreatment, 0, 0.5, "treatment SS");
    expectClose(actual.anova[2].ss, fixture.published.ssError, 0, 0.5, "error SS");
  });
  it("matches R on the same data", () => compareWithR(actual, expected));
});
