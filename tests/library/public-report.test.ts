import { inflateSync } from "node:zlib";
import { afterAll, describe, expect, it } from "vitest";
import { reportSafetyLines } from "@/lib/reports/report-pdf";
import { Site, Trial } from "@/models";
import { testDatabase } from "../support/database";
import { TestClient } from "../support/http";

/** The words a pdfkit PDF draws: each stream inflated, each TJ array's strings joined, lines joined by spaces. */
function pdfText(pdf: Buffer): string {
  const raw = pdf.toString("latin1");
  const lines: string[] = [];
  for (const match of raw.matchAll(/stream\r?\n([\s\S]*?)\r?\nendstream/g)) {
    let content: string;
    try {
      content = inflateSync(Buffer.from(match[1], "latin1")).toString("latin1");
    } catch {
      continue;
    }
    for (const array of content.matchAll(/\[([^\]]*)\]\s*TJ/g)) {
      lines.push([...array[1].matchAll(/<([0-9a-fA-F]*)>/g)].map((hex) => Buffer.from(hex[1], "hex").toString("latin1")).join(""));
    }
  }
  return lines.join(" ").replace(/\s+/g, " ");
}

describe("the report's safety and scope lines", () => {
  it("give machinery cautions for cultivation, the governing rule last, and the summary's scope words", () => {
    const { cautions, scope } = reportSafetyLines(["check", "hand", "mulch", "cultivation"], "North Field", "2025");
    expect(cautions).toEqual([
      "Keep guards and shields in place while the machine runs.",
      "Keep people and animals clear of the working area.",
      "Stop the machine and wait for moving parts to halt before clearing blockages or making adjustments.",
      "Moving tines, blades, wheels and batteries are hazards; follow the maker's instructions.",
      "The product label and local regulations govern; Hoebench gives no application advice; follow licensed practice.",
    ]);
    expect(scope).toBe(
      "These results are from one trial at one site in one season (North Field, 2025). Weeds, soil and weather differ between farms and years, so treat them as one piece of evidence, not a recommendation.",
    );
  });

  it("give the fire and label cautions for flame and chemical methods, and none for hand weeding and mulch", () => {
    const flameAndChemical = reportSafetyLines(["thermal", "chemical"], "North Field", "2025").cautions;
    expect(flameAndChemical).toContain("Keep water or a fire extinguisher at hand while flaming.");
    expect(flameAndChemical).toContain("Read the product label before use and follow it; where the law makes the label binding, the label is the law.");
    expect(flameAndChemical.filter((line) => line.startsWith("The product label and local regulations govern"))).toHaveLength(1);
    expect(reportSafetyLines(["check", "hand", "mulch"], "North Field", "2025").cautions).toEqual([]);
  });
});

describe("the technical report from the library", () => {
  it("is a PDF anyone can read for a published trial, and 404 for any other", async () => {
    testDatabase();
    const published = (await Trial.findOne({ where: { status: "published" } }))!;
    const active = (await Trial.findOne({ where: { status: "active" } }))!;
    const visitor = new TestClient();
    const report = await visitor.request(`/api/library/${published.id}/report`);
    expect(report.status).toBe(200);
    expect(report.headers.get("content-type")).toBe("application/pdf");
    expect(Buffer.from(await report.arrayBuffer()).subarray(0, 5).toString("latin1")).toBe("%PDF-");
    expect((await visitor.request(`/api/library/${active.id}/report`)).status).toBe(404);
  }, 60_000);

  it("carries the cautions for the demo's finger cultivation and says the results are from that site and season only", async () => {
    testDatabase();
    const onion = (await Trial.findOne({ where: { status: "published", crop: "Onion" } }))!;
    const text = pdfText(Buffer.from(await (await new TestClient().request(`/api/library/${onion.id}/report`)).arrayBuffer()));
    expect(text).toContain("Safety and scope");
    expect(text).toContain("Keep guards and shields in place while the machine runs.");
    expect(text).toContain("The product label and local regulations govern; Hoebench gives no application advice; follow licensed practice.");
    const site = (await Site.findByPk(onion.siteId))!;
    expect(text).toContain(`These results are from one trial at one site in one season (${site.name}, ${onion.season}).`);
    expect(text).toContain("not a recommendation.");
  }, 60_000);
});

afterAll(async () => {
  await testDatabase().close();
});
