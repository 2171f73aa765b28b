import { describe, expect, it } from "vitest";
import { randomizeLayout } from "@/lib/layout/randomize";
import type { PlannedPlot, RandomizeInput } from "@/lib/layout/types";
import { pearsonUniformityTest } from "./chi-square";

const eightByFour: RandomizeInput = { design: "rcbd", treatmentCount: 8, blocks: 4, seed: 20240501, serpentine: false };

function byRow(plots: PlannedPlot[]): Map<number, PlannedPlot[]> {
  const rows = new Map<number, PlannedPlot[]>();
  for (const plot of plots) rows.set(plot.row, [...(rows.get(plot.row) ?? []), plot]);
  return rows;
}

function sortedTreatments(plots: PlannedPlot[]): number[] {
  return plots.map((plot) => plot.treatmentIndex).sort((a, b) => a - b);
}

const everyTreatment = (count: number) => Array.from({ length: count }, (_, index) => index);

describe("randomizeLayout: design properties", () => {
  it.each([
    [2, 1],
    [8, 4],
    [13, 6],
    [60, 50],
  ])("RCBD with %i treatments in %i blocks puts every treatment once in every block", (treatmentCount, blocks) => {
    const plots = randomizeLayout({ design: "rcbd", treatmentCount, blocks, seed: 11, serpentine: false });
    expect(plots).toHaveLength(treatmentCount * blocks);
    const rows = byRow(plots);
    expect(rows.size).toBe(blocks);
    for (const [row, rowPlots] of rows) {
      expect(rowPlots.every((plot) => plot.block === row)).toBe(true);
      expect(sortedTreatments(rowPlots)).toEqual(everyTreatment(treatmentCount));
    }
  });

  it.each([2, 3, 5, 8, 12])("a %i × %i Latin square has every treatment once per row and once per column", (size) => {
    for (const seed of [1, 2, 3, 99]) {
      const plots = randomizeLayout({ design: "latin", treatmentCount: size, blocks: size, seed, serpentine: seed % 2 === 0 });
      expect(plots).toHaveLength(size * size);
      for (let line = 1; line <= size; line++) {
        expect(sortedTreatments(plots.filter((plot) => plot.row === line))).toEqual(everyTreatment(size));
        expect(sortedTreatments(plots.filter((plot) => plot.column === line))).toEqual(everyTreatment(size));
      }
    }
  });

  it("CRD uses every treatment exactly `blocks` times and fills the rows × treatments grid", () => {
    const plots = randomizeLayout({ design: "crd", treatmentCount: 6, blocks: 5, seed: 8, serpentine: false });
    expect(plots).toHaveLength(30);
    for (const treatment of everyTreatment(6)) {
      expect(plots.filter((plot) => plot.treatmentIndex === treatment)).toHaveLength(5);
    }
    const cells = new Set(plots.map((plot) => `${plot.row}:${plot.column}`));
    expect(cells.size).toBe(30);
    expect(Math.max(...plots.map((plot) => plot.row))).toBe(5);
    expect(Math.max(...plots.map((plot) => plot.column))).toBe(6);
  });

  it("CRD does not keep to blocks: some seed puts a treatment twice in one row", () => {
    const anyRowRepeats = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10].some((seed) => {
      const rows = byRow(randomizeLayout({ design: "crd", treatmentCount: 8, blocks: 4, seed, serpentine: false }));
      return [...rows.values()].some((rowPlots) => new Set(rowPlots.map((plot) => plot.treatmentIndex)).size < rowPlots.length);
    });
    expect(anyRowRepeats).toBe(true);
  });
});

describe("randomizeLayout: reproducibility", () => {
  it("gives the identical layout for the same seed", () => {
    for (const design of ["rcbd", "crd"] as const) {
      expect(randomizeLayout({ ...eightByFour, design })).toEqual(randomizeLayout({ ...eightByFour, design }));
    }
    const latin = { ...eightByFour, design: "latin" as const, blocks: 8 };
    expect(randomizeLayout(latin)).toEqual(randomizeLayout(latin));
  });

  it("gives a different layout for a different seed", () => {
    const treatmentsFor = (seed: number) => randomizeLayout({ ...eightByFour, seed }).map((plot) => plot.treatmentIndex).join(",");
    expect(treatmentsFor(1)).not.toBe(treatmentsFor(2));
    // 8!^4 ≈ 4.4e18 layouts: 200 seeds should never collide.
    const layouts = new Set(Array.from({ length: 200 }, (_, seed) => treatmentsFor(seed)));
    expect(layouts.size).toBe(200);
  });
});

describe("randomizeLayout: numbering and walking order", () => {
  it("numbers an 8 × 4 trial 101–108, 201–208, 301–308, 401–408", () => {
    const numbers = randomizeLayout(eightByFour).map((plot) => plot.number);
    const expected = [1, 2, 3, 4].flatMap((block) => [1, 2, 3, 4, 5, 6, 7, 8].map((position) => block * 100 + position));
    expect(numbers).toEqual(expected);
  });

  it("without serpentine, position is the column and every row is walked west to east", () => {
    const plots = randomizeLayout(eightByFour);
    expect(plots.every((plot) => plot.position === plot.column)).toBe(true);
    expect(plots.map((plot) => plot.walkOrder)).toEqual(plots.map((_, index) => index + 1));
    const startOfRowTwo = plots.find((plot) => plot.number === 201)!;
    expect(startOfRowTwo.column).toBe(1);
  });

  it("with serpentine, even rows are numbered and walked east to west so the walk snakes", () => {
    const plots = randomizeLayout({ ...eightByFour, serpentine: true });
    const plot = (number: number) => plots.find((candidate) => candidate.number === number)!;
    expect(plot(101).column).toBe(1);
    expect(plot(108).column).toBe(8);
    expect(plot(201).column).toBe(8);
    expect(plot(208).column).toBe(1);
    expect(plot(301).column).toBe(1);
    expect(plot(201).walkOrder).toBe(9);

    const walk = [...plots].sort((a, b) => a.walkOrder - b.walkOrder);
    expect(walk.map((step) => step.walkOrder)).toEqual(plots.map((_, index) => index + 1));
    expect(walk.map((step) => step.number)).toEqual([...plots].map((p) => p.number).sort((a, b) => a - b));
    // Every step of the walk goes to a neighbouring plot: no walking back along a row.
    for (let i = 1; i < walk.length; i++) {
      const distance = Math.abs(walk[i].row - walk[i - 1].row) + Math.abs(walk[i].column - walk[i - 1].column);
      expect(distance).toBe(1);
    }
  });

  it("numbers a Latin square row × 100 + column when not serpentine", () => {
    const plots = randomizeLayout({ design: "latin", treatmentCount: 5, blocks: 5, seed: 3, serpentine: false });
    expect(plots.every((plot) => plot.number === plot.row * 100 + plot.column && plot.block === plot.row)).toBe(true);
  });
});

describe("randomizeLayout: input checks", () => {
  it("refuses a Latin square whose rows differ from its treatments", () => {
    expect(() => randomizeLayout({ design: "latin", treatmentCount: 5, blocks: 4, seed: 1, serpentine: false })).toThrow(
      "a Latin square needs as many rows as treatments",
    );
  });

  it.each([
    [{ treatmentCount: 1 }, "number of treatments"],
    [{ treatmentCount: 61 }, "number of treatments"],
    [{ treatmentCount: 4.5 }, "number of treatments"],
    [{ blocks: 0 }, "number of blocks"],
    [{ blocks: 51 }, "number of blocks"],
    [{ seed: 1.5 }, "random seed"],
    [{ seed: Number.NaN }, "random seed"],
    [{ seed: 2 ** 40 }, "random seed"],
    [{ design: "split-plot" }, "Unknown design"],
  ])("refuses %o", (change, message) => {
    expect(() => randomizeLayout({ ...eightByFour, ...(change as Partial<RandomizeInput>) })).toThrow(message);
  });
});

/*
 * Uniformity over seeds, checked with Pearson's chi-square goodness-of-fit test.
 *
 * Each seed contributes to one cell only (cell = seed mod number of cells), so the counts
 * of different cells come from different seeds and are independent multinomial samples;
 * the statistic is then chi-square with (cells × (treatments − 1)) degrees of freedom.
 * p > 0.001 is a chosen false-alarm rate: a correct randomizer fails such a check once in a
 * thousand seed sets. The seeds are fixed, so the test is deterministic; a change of PRNG or
 * shuffle that skews the layout pushes p towards zero.
 */
describe("randomizeLayout: every treatment equally likely everywhere (Pearson chi-square)", () => {
  const seeds = Array.from({ length: 4000 }, (_, index) => index);
  const threshold = 0.001;

  it("RCBD 8 × 4: treatment by position within blocks", () => {
    const counts = Array.from({ length: 8 }, () => new Array<number>(8).fill(0));
    for (const seed of seeds) {
      const position = (seed % 8) + 1;
      for (const plot of randomizeLayout({ ...eightByFour, seed })) {
        if (plot.position === position) counts[position - 1][plot.treatmentIndex]++;
      }
    }
    const result = pearsonUniformityTest(counts);
    expect(result.degreesOfFreedom).toBe(56);
    expect(result.pValue).toBeGreaterThan(threshold);
  });

  it("Latin 5 × 5: treatment by cell", () => {
    const counts = Array.from({ length: 25 }, () => new Array<number>(5).fill(0));
    for (const seed of seeds) {
      const cell = seed % 25;
      const plots = randomizeLayout({ design: "latin", treatmentCount: 5, blocks: 5, seed, serpentine: false });
      const plot = plots.find((candidate) => (candidate.row - 1) * 5 + (candidate.column - 1) === cell)!;
      counts[cell][plot.treatmentIndex]++;
    }
    const result = pearsonUniformityTest(counts);
    expect(result.degreesOfFreedom).toBe(100);
    expect(result.pValue).toBeGreaterThan(threshold);
  });

  it("CRD 8 treatments × 4 replicates: treatment by plot", () => {
    const counts = Array.from({ length: 32 }, () => new Array<number>(8).fill(0));
    for (const seed of seeds) {
      const plotIndex = seed % 32;
      const plots = randomizeLayout({ ...eightByFour, design: "crd", seed });
      counts[plotIndex][plots[plotIndex].treatmentIndex]++;
    }
    const result = pearsonUniformityTest(counts);
    expect(result.degreesOfFreedom).toBe(224);
    expect(result.pValue).toBeGreaterThan(threshold);
  });

  it("the check itself notices a skewed layout", () => {
    // Guard against a test that cannot fail: a biased assignment (treatment 0 twice as likely
    // in one position) must give a tiny p.
    const counts = Array.from({ length: 8 }, (_, position) =>
      Array.from({ length: 8 }, (_, treatment) => (position === 0 && treatment === 0 ? 500 : 250)),
    );
    expect(pearsonUniformityTest(counts).pValue).toBeLessThan(threshold);
  });
});
