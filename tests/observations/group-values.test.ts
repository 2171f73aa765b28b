import { describe, expect, it } from "vitest";
import { groupValuesByPlot } from "@/lib/observations/group-values";
import { columnsOf, type PlotValue } from "@/lib/observations/value-columns";

describe("grouping a version's values by plot", () => {
  it("keeps each plot's values in the order they came, plots in order of first appearance", () => {
    const grouped = groupValuesByPlot(
      columnsOf([
        { plotNumber: 102, quadrat: 2, species: "", value: 4 },
        { plotNumber: 101, quadrat: 1, species: "pigweed", value: 7 },
        { plotNumber: 102, quadrat: 1, species: "", value: 3 },
        { plotNumber: 101, quadrat: 1, species: "purslane", value: 0 },
      ]),
      [101, 102, 103],
    );
    expect(grouped).toEqual([
      { plotNumber: 102, quadrats: [2, 1], speciesNames: [""], speciesNumbers: [1, 1], values: [4, 3] },
      { plotNumber: 101, quadrats: [1, 1], speciesNames: ["pigweed", "purslane"], speciesNumbers: [1, 2], values: [7, 0] },
    ]);
  });

  it("refuses a second value for a plot, quadrat and species, an unknown plot, and a quadrat that is not a count from 1", () => {
    const twice = [
      { plotNumber: 101, quadrat: 3, species: "pigweed", value: 1 },
      { plotNumber: 101, quadrat: 3, species: "pigweed", value: 2 },
    ];
    expect(() => groupValuesByPlot(columnsOf(twice), [101])).toThrow("Plot 101, quadrat 3, pigweed has more than one value.");
    expect(() => groupValuesByPlot(columnsOf([{ plotNumber: 999, quadrat: 1, species: "", value: 1 }]), [101])).toThrow("Plot 999 is not in this trial.");
    expect(() => groupValuesByPlot(columnsOf([{ plotNumber: 101, quadrat: 0, species: "", value: 1 }]), [101])).toThrow("Quadrat 0 is not a quadrat number.");
    expect(() => groupValuesByPlot(columnsOf([{ plotNumber: 101, quadrat: 1.5, species: "", value: 1 }]), [101])).toThrow("Quadrat 1.5 is not a quadrat number.");
  });

  it("tells duplicates apart from neighbours when the slots outgrow the table and keys are hashed instead", () => {
    // 3 plots × 60 species × 65,536 quadrat slots: past the one-byte table.
    const values: PlotValue[] = [];
    for (let species = 0; species < 60; species += 1) values.push({ plotNumber: 2, quadrat: 65_535, species: `s${species}`, value: species });
    values.push({ plotNumber: 3, quadrat: 1, species: "s0", value: 1 });
    expect(groupValuesByPlot(columnsOf(values), [1, 2, 3]).map((plot) => plot.quadrats.length)).toEqual([60, 1]);
    expect(() => groupValuesByPlot(columnsOf([...values, { plotNumber: 2, quadrat: 65_535, species: "s59", value: 9 }]), [1, 2, 3])).toThrow("Plot 2, quadrat 65535, s59 has more than one value.");
  });
});
