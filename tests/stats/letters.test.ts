// Compact letter display (Piepho 2004 insert-absorb). The significance patterns come from R:
// Tukey p-values of the shared InsectSprays reference (R emmeans pairs(adjust = "tukey")) and of
// the lost-plot RCBD fixture (scripts/r/designs.R). The letters must satisfy the definition of a
// letter display: two treatments share a letter exactly when R's Tukey p > alpha.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { compactLetterDisplay } from "@/lib/stats";
import { analyzeFixture, fixtureDirectory } from "./fixture-runner";

function checkAgainstPattern(levels: string[], means: number[], comparisons: Array<{ a: string; b: string; pTukey: number }>, alpha = 0.05) {
  const index = new Map(levels.map((level, position) => [level, position]));
  const significant = new Set(comparisons.filter((pair) => pair.pTukey <= alpha).map((pair) => `${index.get(pair.a)}|${index.get(pair.b)}`));
  const letters = compactLetterDisplay(means, (first, second) => significant.has(`${Math.min(first, second)}|${Math.max(first, second)}`));
  for (const pair of comparisons) {
    const first = letters[index.get(pair.a) as number];
    const second = letters[index.get(pair.b) as number];
    const share = [...first].some((letter) => second.includes(letter));
    expect(share, `${pair.a} (${first}) vs ${pair.b} (${second}), R Tukey p = ${pair.pTukey}`).toBe(pair.pTukey > alpha);
  }
  const best = means.indexOf(Math.max(...means));
  expect(letters[best]).toContain("a");
  return letters;
}

describe("compact letter display", () => {
  it("matches R's Tukey significance pattern for InsectSprays", () => {
    const expected = JSON.parse(readFileSync(path.join(fixtureDirectory, "reference/insect_sprays_crd.expected.json"), "utf8"));
    const letters = checkAgainstPattern(
      expected.means.map((line: any) => line.treatment),
      expected.means.map((line: any) => line.lsmean),
      expected.comparisons,
    );
    // F (16.7), B, A share "a"; C, D, E share "b" (R's Tukey p between the two groups all < 1e-5).
    expect(letters).toEqual(["a", "a", "b", "b", "b", "a"]);
  });
  it("matches R's Tukey-Kramer pattern for the unbalanced RCBD and is what analyzeTrial reports", () => {
    const { actual, expected } = analyzeFixture("rcbd_lost_plots");
    const levels = expected.means.map((line: any) => line.treatment);
    const letters = checkAgainstPattern(levels, expected.means.map((line: any) => line.lsmean), expected.comparisons);
    expect(actual.means.map((line: any) => line.group)).toEqual(letters);
  });
  it("handles overlapping (non-interval) patterns that sweep methods get wrong", () => {
    // means in order 1 > 2 > 3 > 4; significant: 1-3, 1-4, 2-4 only (definition gives a, ab, bc, c)
    const significant = new Set(["0|2", "0|3", "1|3"]);
    const letters = compactLetterDisplay([10, 8, 6, 4], (a, b) => significant.has(`${a}|${b}`));
    expect(letters).toEqual(["a", "ab", "bc", "c"]);
  });
  it("gives one letter to all when nothing differs, and distinct letters when everything differs", () => {
    expect(compactLetterDisplay([3, 2, 1], () => false)).toEqual(["a", "a", "a"]);
    expect(compactLetterDisplay([1, 3, 2], () => true)).toEqual(["c", "a", "b"]);
  });
  it("stays correct for 40 treatments with a random significance pattern", () => {
    let seed = 12345;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    const means = Array.from({ length: 40 }, () => random() * 100);
    const significant = (a: number, b: number) => Math.abs(means[a] - means[b]) > 30;
    const letters = compactLetterDisplay(means, significant);
    for (let a = 0; a < 40; a++) {
      for (let b = a + 1; b < 40; b++) {
        const share = [...letters[a]].some((letter) => letters[b].includes(letter));
        expect(share).toBe(!significant(a, b));
      }
    }
  });
});
