import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { StakeLabels } from "@/components/field/StakeLabels";
import { qrSvg } from "@/lib/layout/qr";

const plots = Array.from({ length: 22 }, (_, index) => ({
  number: 101 + index,
  block: 1,
  treatmentCode: `T${(index % 8) + 1}`,
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
});
