// The small @example inputs of fitLatinSquare and fitCombinedSites, checked against R
// (scripts/r/doc-examples.R, tests/fixtures/stats/doc_examples.json), and the numbers the doc
// comments print checked against what the functions return, so the examples stay exact.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { encodeFactor, fitCombinedSites, fitLatinSquare } from "@/lib/stats";
import { loadFixture } from "./fixture-runner";
import { expectClose } from "./helpers";

const fixture = loadFixture("doc_examples");
const source = (file: string) => readFileSync(path.resolve(__dirname, "../../lib/stats/designs", file), "utf8");

function compareTable(anova: Array<{ df: number; ss: number; f?: number; p?: number }>, expected: { df: number[]; ss: number[]; f: number[]; p: number[] }, label: string) {
  expect(anova.map((line) => line.df)).toEqual(expected.df);
  anova.forEach((line, index) => {
    expectClose(line.ss, expected.ss[index], 1e-12, 1e-13, `${label} ss[${index}]`);
    if (index < expected.f.length) {
      expectClose(line.f as number, expected.f[index], 1e-12, 0, `${label} f[${index}]`);
      expectClose(line.p as number, expected.p[index], 1e-12, 0, `${label} p[${index}]`);
    }
  });
}

describe("doc-comment examples of the designs agree with R and print the exact output", () => {
  it("fitLatinSquare on a 3 × 3 square (R: anova(lm(y ~ row + column + treatment)))", () => {
    const data = fixture.latin;
    const fit = fitLatinSquare(new Float64Array(data.y), encodeFactor(data.treatment), encodeFactor(data.row), encodeFactor(data.column));
    compareTable(fit.anova, data, "latin");
    const printed = fit.anova.map((line) => line.ss);
    expect(source("fit-latin-square.ts")).toContain(` * // [${printed.join(", ")}]`);
  });

  it("fitCombinedSites on 2 sites × 2 blocks × 2 treatments (R: sequential anova, F against the random-site error terms)", () => {
    const data = fixture.combined;
    const fit = fitCombinedSites(new Float64Array(data.y), encodeFactor(data.trt), encodeFactor(data.block), encodeFactor(data.site));
    compareTable(fit.anova, data, "combined");
    const printed = fit.anova.map((line) => `["${line.source}", ${line.ss}, ${line.f}]`).join(", ");
    const documented = source("fit-combined-sites.ts").match(/\.anova\.map\(\(row\) => \[row\.source, row\.ss, row\.f\]\)\n \* \/\/ \[([\s\S]*?)\]\n \* \/\/ R/);
    expect(documented).not.toBeNull();
    expect(documented![1].replace(/\n \* \/\/ {1,2}/g, " ")).toBe(printed);
  });
});
