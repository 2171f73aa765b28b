import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { PlotMap, renderPlotMapSvg } from "@/components/field/PlotMap";
import { planPlotMap } from "@/lib/layout/plot-map-geometry";
import { renderStaticMarkup } from "@/lib/layout/static-markup";
import { sampleMapProps, sampleTreatments } from "./fixtures";

describe("PlotMap", () => {
  const props = sampleMapProps();
  const svg = renderPlotMapSvg(props);

  it("is an accessible SVG image with a label and title", () => {
    expect(svg.startsWith("<svg")).toBe(true);
    expect(svg).toContain('role="img"');
    expect(svg).toMatch(/aria-label="Carrot weed control trial: plot map, randomized complete block design, 32 plots in 4 blocks of 8; north is at the top\."/);
    expect(svg).toContain("<title>Carrot weed control trial</title>");
  });

  it("draws every plot with its number and treatment code, and labels the blocks", () => {
    for (const plot of props.plots) {
      expect(svg).toContain(`>${plot.number}</text>`);
      expect(svg).toContain(`>${plot.treatmentCode}</text>`);
    }
    for (const block of [1, 2, 3, 4]) expect(svg).toContain(`>Block ${block}</text>`);
    expect(svg).toContain(">weedy check</text>");
    expect(svg).toContain(">weed-free check</text>");
  });

  it("has a legend, a north arrow and the dimensions", () => {
    for (const treatment of sampleTreatments) expect(svg).toContain(treatment.name);
    expect(svg).toContain(">N</text>");
    expect(svg).toContain("16 m (8 × 2 m)");
    expect(svg).toContain("40 m (4 × 10 m)");
    expect(svg).toContain("Plot 10 m long × 2 m wide. Field 16 m (west–east) × 40 m (north–south) = 640 m²");
  });

  it("fills cells with a pattern per category as a second channel beside colour", () => {
    for (const category of ["mulch", "hand", "cultivation", "thermal", "robotic", "chemical", "other"]) {
      expect(svg).toContain(`id="plotmap-pattern-${category}"`);
    }
    expect(svg).toContain('fill="url(#plotmap-pattern-thermal)"');
    expect(renderPlotMapSvg({ ...props, idPrefix: "second" })).toContain('id="second-pattern-robotic"');
  });

  it("labels rows instead of blocks for CRD and Latin layouts", () => {
    const crd = renderPlotMapSvg(sampleMapProps({ design: "crd" }));
    expect(crd).toContain(">Row 1</text>");
    expect(crd).not.toContain(">Block 1</text>");
    const latin = renderPlotMapSvg(sampleMapProps({ design: "latin", blocks: 8 }));
    expect(latin).toContain(">Row 8</text>");
  });

  it("shows walking arrows only when serpentine, pointing east then west", () => {
    expect(svg).not.toContain("Serpentine walk");
    const serpentineProps = sampleMapProps({ serpentine: true });
    const serpentine = renderPlotMapSvg(serpentineProps);
    expect(serpentine).toContain("Serpentine walk");
    expect(planPlotMap(serpentineProps).bands.map((band) => band.walksEast)).toEqual([true, false, true, false]);
  });

  it("shows walking-order badges on request", () => {
    const withOrder = renderPlotMapSvg({ ...sampleMapProps({ serpentine: true }), showWalkingOrder: true });
    expect((withOrder.match(/<circle /g) ?? []).length - (svg.match(/<circle /g) ?? []).length).toBe(32);
    expect(withOrder).toContain(">32</text>");
  });

  it("escapes text", () => {
    const tricky = renderPlotMapSvg({ ...props, title: `A <b> & "quoted" trial` });
    expect(tricky).toContain("<title>A &lt;b&gt; &amp; &quot;quoted&quot; trial</title>");
  });

  it("places no two cells on top of each other and keeps them inside the drawing", () => {
    const geometry = planPlotMap(props);
    const corners = new Set(geometry.cells.map((cell) => `${cell.x},${cell.y}`));
    expect(corners.size).toBe(geometry.cells.length);
    for (const cell of geometry.cells) {
      expect(cell.x).toBeGreaterThan(0);
      expect(cell.x + 100).toBeLessThan(geometry.width);
      expect(cell.y + 80).toBeLessThan(geometry.height);
    }
  });

  it("renderPlotMapSvg gives exactly what react-dom/server's renderToStaticMarkup gives", () => {
    for (const mapProps of [props, { ...sampleMapProps({ design: "latin", blocks: 8, serpentine: true }), showWalkingOrder: true }]) {
      expect(renderPlotMapSvg(mapProps)).toBe(renderToStaticMarkup(createElement(PlotMap, mapProps)));
    }
  });
});

describe("renderStaticMarkup", () => {
  it("renders fragments, numbers, void elements and skips null, false and handlers", () => {
    const tree = createElement(
      "div",
      { className: "a", onClick: () => undefined, hidden: false },
      createElement("br"),
      null,
      false,
      3,
      createElement("span", { dangerouslySetInnerHTML: { __html: "<i>raw</i>" } }),
    );
    expect(renderStaticMarkup(tree)).toBe(renderToStaticMarkup(tree));
  });

  it("refuses style objects rather than render them wrongly", () => {
    expect(() => renderStaticMarkup(createElement("div", { style: { color: "red" } }))).toThrow("style");
  });
});
