// Compact letter display (Piepho 2004 insert-absorb). The significance patterns come from R:
// Tukey p-values of the shared InsectSprays reference (R emmeans pairs(adjust = "tukey")) and of
// the lost-plot RCBD fixture (scripts/r/designs.R). The letters must satisfy the definition of a
// letter display: two treatments share a letter exactly when R's Tukey p > alpha.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeTrial, compactLetterDisplay } from "@/lib/stats";
import { analyzeFixture, fixtureDirectory, loadFixture, loadRows } from "./fixture-runner";

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

/** A treatment's letters as a set; letter names are a Latin letter followed by primes (a, Z, a', b''). */
function letterSet(group: string): Set<string> {
  const letters = group.match(/[a-zA-Z]'{0,}/g) ?? [];
  expect(letters.join(""), `"${group}" is made of letter names only`).toBe(group);
  return new Set(letters);
}

function shares(first: Set<string>, second: Set<string>, without?: string): boolean {
  for (const letter of first) if (letter !== without && second.has(letter)) return true;
  return false;
}

/**
 * Checks the defining property (a pair shares a letter iff it is not significant) and minimality in
 * the insert-and-absorb sense: removing any one letter column must break the property, either by
 * separating a non-significant pair or by leaving a treatment without a letter.
 */
function checkDisplay(groups: string[], isSignificant: (first: number, second: number) => boolean, label: string): void {
  const sets = groups.map(letterSet);
  for (let first = 0; first < groups.length; first++) {
    expect(sets[first].size, `${label}: treatment ${first} has a letter`).toBeGreaterThan(0);
    for (let second = first + 1; second < groups.length; second++) {
      expect(shares(sets[first], sets[second]), `${label}: ${first} (${groups[first]}) vs ${second} (${groups[second]})`).toBe(!isSignificant(first, second));
    }
  }
  const columns = new Set(sets.flatMap((set) => [...set]));
  for (const column of columns) {
    let stillValid = sets.every((set) => set.size > 1 || !set.has(column));
    for (let first = 0; first < groups.length && stillValid; first++) {
      for (let second = first + 1; second < groups.length && stillValid; second++) {
        if (shares(sets[first], sets[second], column) !== !isSignificant(first, second)) stillValid = false;
      }
    }
    expect(stillValid, `${label}: letter ${column} is redundant`).toBe(false);
  }
}

describe("compact letter display: unbalanced trial with 15 treatments (R Tukey-Kramer p-values)", () => {
  // scripts/r/letters.R: set.seed(1504), 15 treatments with 3-8 plots, pairs(emmeans(fit, ~treatment), adjust = "tukey").
  const fixture = loadFixture("letters_unbalanced");
  const levels: string[] = Object.keys(fixture.n);
  const index = new Map(levels.map((level, position) => [level, position]));
  const rSignificant = new Set<string>();
  for (const pair of fixture.comparisons) {
    if (pair.pTukey <= fixture.options.alpha) rSignificant.add([index.get(pair.a), index.get(pair.b)].sort((x, y) => (x as number) - (y as number)).join("|"));
  }
  const isSignificant = (first: number, second: number) => rSignificant.has(`${Math.min(first, second)}|${Math.max(first, second)}`);

  it("uses an overlapping pattern (neither all nor none of the 105 pairs significant)", () => {
    expect(fixture.comparisons.length).toBe(105);
    expect(rSignificant.size).toBe(fixture.significantPairs);
    expect(rSignificant.size).toBeGreaterThan(20);
    expect(rSignificant.size).toBeLessThan(85);
  });

  it("analyzeTrial's letters share a letter exactly when R's Tukey p > alpha, and no letter is redundant", () => {
    const result = analyzeTrial(loadRows(fixture.data), fixture.options);
    const means = result.means as Array<{ treatment: string; n: number; group: string }>;
    expect(means.map((line) => line.treatment)).toEqual(levels);
    expect(means.map((line) => line.n)).toEqual(levels.map((level) => fixture.n[level]));
    checkDisplay(means.map((line) => line.group), isSignificant, "analyzeTrial");
  });

  it("the letter display built directly from R's significance pattern has the same properties", () => {
    const groups = compactLetterDisplay(levels.map((level) => fixture.lsmeans[level]), isSignificant);
    checkDisplay(groups, isSignificant, "R pattern");
  });
});

describe("compact letter display: minimality and letter names", () => {
  it("drops a column that insert-and-absorb leaves redundant", () => {
    // Found by search: insert-absorb alone gives 6 columns here, one of them covered by the others.
    const significant = new Set(["0|1", "0|4", "0|6", "2|5", "3|4", "4|6", "5|6"]);
    const isSignificant = (a: number, b: number) => significant.has(`${Math.min(a, b)}|${Math.max(a, b)}`);
    const groups = compactLetterDisplay([7, 6, 5, 4, 3, 2, 1], isSignificant);
    checkDisplay(groups, isSignificant, "constructed");
    expect(new Set(groups.flatMap((group) => [...letterSet(group)])).size).toBe(5);
  });

  it("stays minimal on random patterns", () => {
    let seed = 7;
    const random = () => ((seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648);
    for (let trial = 0; trial < 200; trial++) {
      const count = 5 + Math.floor(random() * 8);
      const probability = 0.2 + random() * 0.6;
      const significant = new Set<string>();
      for (let a = 0; a < count; a++) for (let b = a + 1; b < count; b++) if (random() < probability) significant.add(`${a}|${b}`);
      const isSignificant = (a: number, b: number) => significant.has(`${Math.min(a, b)}|${Math.max(a, b)}`);
      checkDisplay(compactLetterDisplay(Array.from({ length: count }, () => random()), isSignificant), isSignificant, `random ${trial}`);
    }
  });

  it("names letters beyond z and Z with primes, so joined letters split back unambiguously", () => {
    // 60 treatments, all different: 60 single letters a … z, A … Z, a' … h'.
    const all = compactLetterDisplay(Array.from({ length: 60 }, (_, i) => 60 - i), () => true);
    expect(all.slice(0, 3)).toEqual(["a", "b", "c"]);
    expect(all.slice(50, 60)).toEqual(["Y", "Z", "a'", "b'", "c'", "d'", "e'", "f'", "g'", "h'"]);
    checkDisplay(all, () => true, "all different");
    // A chain of 70 (neighbours alike, all else different): 69 two-member columns, so letters with
    // primes are joined to plain ones ("Za'") and must still split into the right sets.
    const chain = (a: number, b: number) => Math.abs(a - b) !== 1;
    const linked = compactLetterDisplay(Array.from({ length: 70 }, (_, i) => 70 - i), chain);
    expect(linked[52]).toBe("Za'");
    expect(linked[53]).toBe("a'b'");
    expect(linked[69]).toBe("q'");
    checkDisplay(linked, chain, "chain");
  });
});
