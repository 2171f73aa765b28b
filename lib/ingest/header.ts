import type { IngestProblem } from "./types";

export interface ColumnMap {
  format: "long" | "wide";
  plot: number;
  quadrat: number | null;
  species: number | null;
  value: number | null;
  /** Wide format: column index → quadrat number. */
  quadratColumns: Map<number, number>;
  treatment: number | null;
  unit: number | null;
  headerUnit: string | null;
}

const normalize = (cell: string) =>
  cell.replace(/^\ufeff/, "").trim().toLowerCase().replace(/[_\s]+/g, " ");

const aliases: Record<string, string[]> = {
  plot: ["plot", "plot number", "plot no", "plot no.", "plotnumber", "plot #"],
  quadrat: ["quadrat", "quadrat number", "quadrat no", "q"],
  species: ["species", "weed species", "weed"],
  value: ["value", "count", "weight", "reading", "rating", "yield", "hours"],
  treatment: ["treatment", "treatment code", "trt"],
  unit: ["unit", "units"],
  block: ["block", "rep", "replicate"],
  notes: ["notes", "note", "comment", "comments", "remarks"],
};

function kindOf(name: string): { kind: string; unit: string | null } | { kind: "wide"; quadrat: number } | null {
  const wide = /^(?:q|quadrat) ?(\d{1,2})$/.exec(name);
  if (wide) return { kind: "wide", quadrat: Number(wide[1]) };
  const withUnit = /^(.*?) ?[([](.+)[)\]]$/.exec(name);
  const base = withUnit ? withUnit[1] : name;
  for (const [kind, names] of Object.entries(aliases)) {
    if (names.includes(base)) return { kind, unit: withUnit ? withUnit[2].trim() : null };
  }
  return null;
}

export const sameUnit = (a: string, b: string) => normalize(a).replace(/\s/g, "") === normalize(b).replace(/\s/g, "");

/**
 * Reads the header row: the long layout (plot, quadrat, species, value) or the wide one
 * (plot, q1 … qN), as the printed data sheets have them.
 */
export function readHeader(cells: string[], expectedUnit: string, quadratsPerPlot: number): { map: ColumnMap | null; problems: IngestProblem[] } {
  const problems: IngestProblem[] = [];
  const found = new Map<string, number>();
  const quadratColumns = new Map<number, number>();
  let headerUnit: string | null = null;

  cells.forEach((cell, index) => {
    const name = normalize(cell);
    const kind = kindOf(name);
    if (!kind) {
      if (name !== "") {
        problems.push({ severity: "warning", code: "extra-column", row: 1, column: cell.trim(), message: `The column "${cell.trim()}" is not used; its values are ignored.` });
      }
      return;
    }
    if (kind.kind === "wide") {
      quadratColumns.set(index, (kind as { quadrat: number }).quadrat);
      return;
    }
    if (found.has(kind.kind)) {
      problems.push({ severity: "error", code: "extra-column", row: 1, column: cell.trim(), message: `There are two "${kind.kind}" columns; keep one.` });
      return;
    }
    found.set(kind.kind, index);
    const unit = (kind as { unit: string | null }).unit;
    if (kind.kind === "value" && unit) headerUnit = unit;
  });

  if (!found.has("plot")) {
    problems.push({ severity: "error", code: "missing-column", row: 1, column: "plot", message: 'The header has no "plot" column. Use the data sheet template: plot, quadrat, species, value.' });
    return { map: null, problems };
  }
  if (headerUnit && !sameUnit(headerUnit, expectedUnit)) {
    problems.push({
      severity: "error",
      code: "wrong-unit",
      row: 1,
      column: cells[found.get("value")!].trim(),
      message: `The values are in ${headerUnit}, but this assessment records ${expectedUnit}. Convert them or check that this is the right assessment.`,
    });
  }

  const format = quadratColumns.size > 0 && !found.has("value") ? "wide" : "long";
  if (format === "wide") {
    const columnOf = new Map<number, number>();
    for (const [index, quadrat] of quadratColumns) {
      const earlier = columnOf.get(quadrat);
      if (earlier !== undefined) {
        problems.push({
          severity: "error",
          code: "extra-column",
          row: 1,
          column: cells[index].trim(),
          message: `Columns "${cells[earlier].trim()}" and "${cells[index].trim()}" are both quadrat ${quadrat}; keep one.`,
        });
        quadratColumns.delete(index);
        continue;
      }
      columnOf.set(quadrat, index);
      if (quadrat < 1 || quadrat > quadratsPerPlot) {
        problems.push({
          severity: "error",
          code: "bad-quadrat",
          row: 1,
          column: cells[index].trim(),
          message: `Column "${cells[index].trim()}" is quadrat ${quadrat}, but this assessment has ${quadratsPerPlot} quadrat${quadratsPerPlot === 1 ? "" : "s"} per plot.`,
        });
        quadratColumns.delete(index);
      }
    }
  } else {
    if (!found.has("value")) {
      problems.push({ severity: "error", code: "missing-column", row: 1, column: "value", message: 'The header has no "value" column (or q1, q2, … columns for one column per quadrat).' });
      return { map: null, problems };
    }
    if (!found.has("quadrat") && quadratsPerPlot > 1) {
      problems.push({ severity: "error", code: "missing-column", row: 1, column: "quadrat", message: `The header has no "quadrat" column, and this assessment has ${quadratsPerPlot} quadrats per plot.` });
      return { map: null, problems };
    }
    for (const index of quadratColumns.keys()) {
      problems.push({ severity: "warning", code: "extra-column", row: 1, column: cells[index].trim(), message: `The column "${cells[index].trim()}" is not used in a file with a value column; its values are ignored.` });
    }
    quadratColumns.clear();
  }

  return {
    map: {
      format,
      plot: found.get("plot")!,
      quadrat: found.get("quadrat") ?? null,
      species: found.get("species") ?? null,
      value: found.get("value") ?? null,
      quadratColumns,
      treatment: found.get("treatment") ?? null,
      unit: found.get("unit") ?? null,
      headerUnit,
    },
    problems,
  };
}
