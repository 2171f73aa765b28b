import { describe, expect, it } from "vitest";
import { resultsOptionsFrom, resultsQueryOf, type ResultsOptionsState } from "@/lib/analysis/results-options";

const defaults: ResultsOptionsState = { transform: "none", method: "lsd", alpha: "0.05", control: "WC", reference: "", margin: "" };
const codes = ["WC", "WF", "HH", "SR"];

describe("results options in the page address", () => {
  it("keeps every option the form could have set", () => {
    const options = resultsOptionsFrom({ transform: "sqrt", method: "tukey", alpha: "0.01", control: "", reference: "HH", margin: "1.5" }, defaults, codes);
    expect(options).toEqual({ transform: "sqrt", method: "tukey", alpha: "0.01", control: "", reference: "HH", margin: "1.5" });
    expect(resultsQueryOf(options)).toBe("transform=sqrt&method=tukey&alpha=0.01&reference=HH&margin=1.5");
  });

  it("falls back to the defaults for values the form could not have set", () => {
    const options = resultsOptionsFrom(
      { transform: "cube", method: ["lsd", "tukey"], alpha: "0.5", control: "<script>", reference: "ZZ", margin: "-2" },
      defaults,
      codes,
    );
    expect(options).toEqual(defaults);
    expect(resultsQueryOf(options)).toBe("transform=none&method=lsd&alpha=0.05&control=WC");
  });

  it("drops a margin without a reference", () => {
    expect(resultsOptionsFrom({ margin: "2" }, defaults, codes).margin).toBe("");
  });
});
