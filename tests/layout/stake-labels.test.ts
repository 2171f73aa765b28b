import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { StakeLabels } from "@/components/field/StakeLabels";
import { qrSvg } from "@/lib/layout/qr";

const categories = ["check", "hand", "mulch", "cultivation", "thermal", "robotic", "chemical", "other"] as const;
const plots = Array.from({ length: 22 }, (_, index) => ({
  number: 101 + index,
  block: 1,
  treatmentCode: `T${(index % 8) + 1}`,
  category: categories[index % 8],
  url: `https://hoebench.example/plots/${101 + index}`,
}));

describe("qrSvg", () => {
  it("returns an SVG QR code that depends on the text", async () => {
    const first = await qrSvg("https://hoebench.example/plots/101");
    expect(first.startsWith("<svg")).toBe(true);
    expect(first).toContain("viewBox");
    expect(await qrSvg("https://hoebench.example/plots/102")).not.toBe(first);
  });
});

describe("StakeLabels", () => {
  it("prints one label per plot, 21 to a sheet, with number, block, code, title and QR code", async () => {
    const html = renderToStaticMarkup(await StakeLabels({ trialTitle: "A very long trial title that will not fit on a stake label", plots }));
    expect((html.match(/<article/g) ?? []).length).toBe(22);
    expect((html.match(/<section/g) ?? []).length).toBe(2);
    expect(html).toContain("Stake labels, sheet 2 of 2");
    expect((html.match(/<svg/g) ?? []).length).toBe(22);
    expect(html).toContain('aria-label="QR code for plot 122"');
    expect(html).toContain(">122</p>");
    expect(html).toContain(">Block 1</p>");
    expect(html).toContain(">T8</p>");
    expect(html).toContain("A very long trial title that will…");
    expect(html).toContain("print:break-after-page");
  });

  it("marks plots treated with a herbicide, flame or a machine, and only those", async () => {
    const html = renderToStaticMarkup(await StakeLabels({ trialTitle: "Onion weeding", plots: plots.slice(0, 8) }));
    const warnings = html.match(/⚠ [^<]+/g) ?? [];
    expect(warnings).toEqual([
      "⚠ Machinery: moving parts",
      "⚠ Flamed plot: fire and burn risk",
      "⚠ Weeding robot: moving parts",
      "⚠ Treated plot: keep to the label&#x27;s re-entry interval",
    ]);
  });
});
