// Planning and trade measures. Expected values: scripts/r/planning.R (R 4.2.2) ->
// tests/fixtures/stats/planning_measures.json; the R call for planning is
//   power <- pf(qf(1 - alpha, t - 1, (t - 1)(b - 1)), t - 1, (t - 1)(b - 1), ncp = b * (d / cv)^2 / 2, lower.tail = FALSE)
// with b increased from 2 until power >= target.
import { describe, expect, it } from "vitest";
import {
  abbottCorrection,
  blocksNeeded,
  hendersonTilton,
  percentControl,
  perSquareFootToPerSquareMetre,
  perSquareMetreToPerSquareFoot,
  plotYieldPerArea,
  quadratDensity,
  residualDfCheck,
  StatsInputError,
  weedControlEfficiency,
  weedIndex,
} from "@/lib/stats";
import { loadFixture } from "./fixture-runner";
import { expectClose } from "./helpers";

const fixture = loadFixture("planning_measures");

describe("blocks needed (noncentral F power, R pf with ncp)", () => {
  for (const scenario of fixture.scenarios) {
    it(`${scenario.treatments} treatments, CV ${scenario.cvPercent}%, difference ${scenario.differencePercent}%`, () => {
      const result = blocksNeeded({
        treatments: scenario.treatments,
        cvPercent: scenario.cvPercent,
        difference: scenario.differencePercent,
        differenceKind: "percent",
        alpha: scenario.alpha,
        power: scenario.targetPower,
      });
      expect(result.blocks).toBe(scenario.blocks);
      expect(result.dfResidual).toBe(scenario.dfResidual);
      expectClose(result.power, scenario.power, 1e-8, 0, "power");
      expectClose(result.criticalF, scenario.criticalF, 1e-10, 0, "critical F");
      expectClose(result.noncentrality, scenario.noncentrality, 1e-12, 0, "ncp");
      expect(result.residualDf.adequate).toBe(scenario.dfResidual >= 12);
    });
  }
  it("accepts an absolute difference with the expected mean (same as the percent form)", () => {
    // 30% of a mean of 4 t/ha = 1.2 t/ha: the first R scenario (6 treatments, CV 15%) needs 8 blocks.
    expect(blocksNeeded({ treatments: 6, cvPercent: 15, difference: 1.2, differenceKind: "absolute", mean: 4 }).blocks).toBe(8);
    expect(() => blocksNeeded({ treatments: 6, cvPercent: 15, difference: 1.2, differenceKind: "absolute" })).toThrow(StatsInputError);
  });
  it("flags fewer than 12 residual df (EPPO PP 1/152 common practice)", () => {
    expect(residualDfCheck(11).adequate).toBe(false);
    expect(residualDfCheck(12).adequate).toBe(true);
    expect(residualDfCheck(9).message).toMatch(/at least 12/);
  });
});

describe("trade measures (R arithmetic of the published formulas)", () => {
  const m = fixture.measures;
  it("percent control, weed control efficiency, weed index", () => {
    expectClose(percentControl(m.percentControl.treated, m.percentControl.check), m.percentControl.value, 1e-14, 0, "percent control");
    expectClose(weedControlEfficiency(m.weedControlEfficiency.control, m.weedControlEfficiency.treated), m.weedControlEfficiency.value, 1e-14, 0, "WCE");
    expectClose(weedIndex(m.weedIndex.weedFree, m.weedIndex.treated), m.weedIndex.value, 1e-13, 0, "weed index");
  });
  it("Abbott and Henderson-Tilton corrections", () => {
    expectClose(abbottCorrection(m.abbott.treated, m.abbott.control), m.abbott.value, 1e-14, 0, "Abbott");
    const { tb, ta, cb, ca, value } = m.hendersonTilton;
    expectClose(hendersonTilton({ treatedBefore: tb, treatedAfter: ta, checkBefore: cb, checkAfter: ca }), value, 1e-14, 0, "Henderson-Tilton");
  });
  it("quadrat counts to plants per m²", () => {
    expectClose(quadratDensity(m.quadrat.counts, m.quadrat.area), m.quadrat.value, 1e-14, 0, "density");
  });
  it("plot yield to t/ha and lb/acre", () => {
    const result = plotYieldPerArea(m.yield.kg, m.yield.area);
    expectClose(result.tonnesPerHectare, m.yield.tonnesPerHectare, 1e-14, 0, "t/ha");
    expectClose(result.poundsPerAcre, m.yield.poundsPerAcre, 1e-14, 0, "lb/acre");
    // Published factor: 1 kg/ha = 0.892179 lb/acre (NIST SP 811 Appendix B, stated from memory).
    expectClose(plotYieldPerArea(1, 10000).poundsPerAcre, 0.892179, 1e-6, 0, "1 kg/ha in lb/acre");
  });
  it("per ft² and per m² (1 ft² = 0.09290304 m² exactly, NIST SP 811)", () => {
    expectClose(perSquareFootToPerSquareMetre(m.perSquareFoot.value), m.perSquareFoot.perSquareMetre, 1e-14, 0, "per m²");
    expectClose(perSquareMetreToPerSquareFoot(1), 0.09290304, 1e-15, 0, "per ft²");
    expectClose(perSquareMetreToPerSquareFoot(perSquareFootToPerSquareMetre(7)), 7, 1e-15, 0, "round trip");
  });
  it("refuses impossible inputs with the common error phrasing", () => {
    expect(() => percentControl(1, 0)).toThrow(/^percent control requires/);
    expect(() => abbottCorrection(50, 100)).toThrow(/^abbott correction requires/);
    expect(() => quadratDensity([], 0.25)).toThrow(/^quadrat density requires/);
  });
});
