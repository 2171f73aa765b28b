import { describe, expect, it } from "vitest";
import { contrastRatio, perceivedLightness, relativeLuminance } from "@/lib/layout/contrast";
import { categoryStyles, mapInk, mapPaper } from "@/lib/layout/palette";
import { methodCategories } from "@/models/Treatment";

describe("WCAG colour measures", () => {
  it("match the WCAG 2.1 definitions at known points", () => {
    // Black on white is the maximum ratio, 21:1, by the definition in WCAG 2.1.
    expect(contrastRatio("#000000", "#ffffff")).toBeCloseTo(21, 10);
    expect(relativeLuminance("#ffffff")).toBeCloseTo(1, 12);
    expect(relativeLuminance("#000000")).toBe(0);
    // #767676 on white is the widely cited darkest-grey-that-passes example: 4.54:1.
    expect(contrastRatio("#767676", "#ffffff")).toBeCloseTo(4.54, 2);
    expect(perceivedLightness("#ffffff")).toBeCloseTo(100, 6);
  });

  it("rejects colours that are not #rrggbb", () => {
    expect(() => relativeLuminance("red")).toThrow("#rrggbb");
  });
});

describe("method category palette", () => {
  it("has a style for every method category", () => {
    expect(Object.keys(categoryStyles).sort()).toEqual([...methodCategories].sort());
  });

  // WCAG 2.1 §1.4.3 Contrast (Minimum): text needs at least 4.5:1 against its background.
  it.each(methodCategories.map((category) => [category]))("%s: text on fill has contrast ≥ 4.5:1 (WCAG 2.1 §1.4.3)", (category) => {
    const style = categoryStyles[category];
    expect(contrastRatio(style.text, style.fill)).toBeGreaterThanOrEqual(4.5);
  });

  it("map ink on paper has contrast ≥ 4.5:1", () => {
    expect(contrastRatio(mapInk, mapPaper)).toBeGreaterThanOrEqual(4.5);
  });

  /*
   * Greyscale channel: printed in grey, only lightness is left. A chosen margin of 8 CIE L*
   * units between every two fills (a step readily seen side by side; 1 unit is about the
   * smallest noticeable) keeps them apart; the fills are designed 10 units apart.
   */
  it("fills differ pairwise in lightness by at least 8 L* units", () => {
    const lightness = methodCategories.map((category) => ({ category, value: perceivedLightness(categoryStyles[category].fill) }));
    for (const a of lightness) {
      for (const b of lightness) {
        if (a.category < b.category) expect(Math.abs(a.value - b.value), `${a.category} vs ${b.category}`).toBeGreaterThanOrEqual(8);
      }
    }
  });

  // Pattern channel: every category has its own pattern, so nothing depends on colour alone.
  it("every category has a different pattern", () => {
    const patterns = methodCategories.map((category) => categoryStyles[category].pattern);
    expect(new Set(patterns).size).toBe(methodCategories.length);
  });
});
