import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { Cautions } from "@/components/safety/Cautions";
import { cautionsFor, governingRule } from "@/lib/safety/cautions";
import { cautionsForCategories } from "@/lib/safety/trial-cautions";

const mentions = (category: Parameters<typeof cautionsFor>[0], words: RegExp) => cautionsFor(category).some((line) => words.test(line));

describe("cautionsFor", () => {
  it("gives check, hand weeding, mulch and other no cautions", () => {
    for (const category of ["check", "hand", "mulch", "other"] as const) expect(cautionsFor(category)).toEqual([]);
  });

  it("chemical: label, protective equipment, intervals, storage and disposal, licensed applicators", () => {
    expect(mentions("chemical", /label is the law/)).toBe(true);
    expect(mentions("chemical", /protective equipment/)).toBe(true);
    expect(mentions("chemical", /re-entry and pre-harvest intervals/)).toBe(true);
    expect(mentions("chemical", /dispose/)).toBe(true);
    expect(mentions("chemical", /licensed or certified applicators/)).toBe(true);
  });

  it("thermal: fire risk, water or extinguisher, fuel gas, heat injury, burn restrictions", () => {
    expect(mentions("thermal", /Fire risk/)).toBe(true);
    expect(mentions("thermal", /extinguisher/)).toBe(true);
    expect(mentions("thermal", /fuel gas/)).toBe(true);
    expect(mentions("thermal", /heat injury/)).toBe(true);
    expect(mentions("thermal", /burn restrictions/)).toBe(true);
  });

  it("cultivation and robotic: guards, people and animals clear, stop before clearing blockages", () => {
    for (const category of ["cultivation", "robotic"] as const) {
      expect(mentions(category, /guards/)).toBe(true);
      expect(mentions(category, /people and animals clear/)).toBe(true);
      expect(mentions(category, /Stop the machine .* before clearing blockages/)).toBe(true);
      expect(mentions(category, /batteries/)).toBe(true);
    }
    expect(mentions("robotic", /emergency stop/)).toBe(true);
    expect(mentions("cultivation", /emergency stop/)).toBe(false);
  });

  it("ends every non-empty list with the governing rule and gives no application advice", () => {
    expect(governingRule).toBe("The product label and local regulations govern; Hoebench gives no application advice; follow licensed practice.");
    for (const category of ["chemical", "thermal", "cultivation", "robotic"] as const) {
      const lines = cautionsFor(category);
      expect(lines.at(-1)).toBe(governingRule);
      expect(lines.join(" ")).not.toMatch(/\d+\s*(l|ml|g|kg)\s*\/\s*ha|litre|rate of/i);
    }
  });

  it("returns a copy, so callers cannot change the shared list", () => {
    cautionsFor("chemical").push("changed");
    expect(cautionsFor("chemical")).not.toContain("changed");
  });
});

describe("cautionsForCategories", () => {
  it("merges categories without repeats and with the governing rule once, last", () => {
    const lines = cautionsForCategories(["check", "robotic", "cultivation", "chemical"]);
    expect(new Set(lines).size).toBe(lines.length);
    expect(lines.filter((line) => line === governingRule)).toHaveLength(1);
    expect(lines.at(-1)).toBe(governingRule);
    expect(cautionsForCategories(["check", "mulch"])).toEqual([]);
  });
});

describe("Cautions", () => {
  it("renders a note box headed Safety, or nothing for no cautions", () => {
    const html = renderToStaticMarkup(createElement(Cautions, { cautions: cautionsFor("thermal") }));
    expect(html).toContain('role="note"');
    expect(html).toContain(">Safety</h2>");
    expect((html.match(/<li>/g) ?? []).length).toBe(cautionsFor("thermal").length);
    expect(renderToStaticMarkup(createElement(Cautions, { cautions: [] }))).toBe("");
  });
});
