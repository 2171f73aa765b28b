import { readHeader, sameUnit, type ColumnMap } from "./header";
import type { CheckedPart } from "./checked-part";
import { floatColumn, intColumn } from "./column-builder";
import type { IngestContext, IngestProblem, IngestResult } from "./types";
import { readNumberCell, readWholeNumber } from "./values";

const MAX_PROBLEMS_SHOWN = 500;
const SPECIES_TABLES = 32;

function describePlots(numbers: number[]): string {
  const sorted = [...numbers].sort((a, b) => a - b);
  return sorted.length > 12 ? `${sorted.slice(0, 12).join(", ")} and ${sorted.length - 12} more` : sorted.join(", ");
}

const describeCell = (plotNumber: number, quadrat: number, species: string) => `plot ${plotNumber}, quadrat ${quadrat}${species ? `, ${species}` : ""}`;

const duplicateProblem = (row: number, column: string, cell: string, earlier: number): IngestProblem => ({
  severity: "error",
  code: "duplicate",
  row,
  column,
  message: `Row ${row}: ${cell} already has a value in row ${earlier}. Keep one of them.`,
});

export interface RowCheckerOptions {
  /**
   * Whether the header's own problems are reported: not by the checker of a file's later part,
   * which gets the header only to know the columns (the first part's checker reports them).
   */
  reportHeader?: boolean;
}

function isBlank(cells: string[]): boolean {
  for (const cell of cells) if (cell !== "" && cell.trim() !== "") return false;
  return true;
}

/**
 * Checks a data file row by row as it streams in: every problem gets its row number and a
 * plain message; errors stop the commit, warnings (a value outside the plausible range, a
 * lost plot) are shown and left to the uploader's judgement.
 */
export class RowChecker {
  private map: ColumnMap | null = null;
  private headerSeen = false;
  private headerWidth = 0;
  /** Plot number → position in context.plots. */
  private readonly plotIndexes: Map<number, number>;
  /** Slots per plot in the tables below: quadrats 1 … quadratsPerPlot. */
  private readonly stride: number;
  /**
   * The row of every value so far (0: none yet), per species (numbered in speciesNumbers),
   * at plot index × stride + quadrat: flat arrays, since a 100,000-row file fills every slot.
   * Species past the first SPECIES_TABLES share one map instead, to bound the memory.
   */
  private readonly seen: Int32Array[] = [];
  private readonly seenOverflow = new Map<number, number>();
  /** 1 where a plot's quadrat has a value of any species. */
  private readonly quadratsWithValues: Uint8Array;
  private readonly speciesNumbers = new Map<string, number>();
  /**
   * Each spelling met so far, with its species number (spellings that differ only in case are
   * one species) and its place in spellingNames, which the values refer to.
   */
  private readonly spellings = new Map<string, { number: number; name: string; spelling: number }>();
  private readonly spellingNames: string[] = [];
  /** The values taken, as columns: the file's line, the plot (its place in context.plots), quadrat, spelling, value. */
  private readonly rows = intColumn();
  private readonly valuePlotIndexes = intColumn();
  private readonly quadrats = intColumn();
  private readonly valueSpellings = intColumn();
  private readonly values = floatColumn();
  /** The duplicates listed, with the row they repeat (absorb may have to name an earlier one). */
  private readonly duplicatesListed: { problem: number; cell: string; earlier: number }[] = [];
  /** The values (by index) that drew a range warning. */
  private readonly implausibleValues: number[] = [];
  private readonly reportHeader: boolean;
  private readonly problems: IngestProblem[] = [];
  private problemCount = 0;
  private errors = 0;
  private rowsRead = 0;

  constructor(
    private readonly context: IngestContext,
    options: RowCheckerOptions = {},
  ) {
    this.reportHeader = options.reportHeader ?? true;
    this.plotIndexes = new Map(context.plots.map((plot, index) => [plot.number, index]));
    this.stride = context.quadratsPerPlot + 1;
    this.quadratsWithValues = new Uint8Array(context.plots.length * this.stride);
  }

  private report(problem: IngestProblem): void {
    this.problemCount += 1;
    if (problem.severity === "error") this.errors += 1;
    if (this.problems.length < MAX_PROBLEMS_SHOWN) this.problems.push(problem);
  }

  get errorCount(): number {
    return this.errors;
  }

  /** Feed one parsed row (header first); `row` is the file's line number, 1 for the header. */
  accept(cells: string[], row: number): void {
    if (!this.headerSeen) {
      this.headerSeen = true;
      this.headerWidth = cells.length;
      const { map, problems } = readHeader(cells, this.context.unit, this.context.quadratsPerPlot);
      if (this.reportHeader) problems.forEach((problem) => this.report(problem));
      this.map = map;
      return;
    }
    if (!this.map) return;
    if (isBlank(cells)) return;
    this.rowsRead += 1;
    if (cells.length > this.headerWidth) {
      this.report({
        severity: "error",
        code: "ragged-row",
        row,
        message: `Row ${row} has ${cells.length} cells but the header has ${this.headerWidth}. A value like 12,5 with a comma as decimal mark splits a cell: use 12.5.`,
      });
      return;
    }
    const map = this.map;
    const plotNumber = readWholeNumber(cells[map.plot]);
    if (plotNumber === null) {
      this.report({ severity: "error", code: "unknown-plot", row, column: "plot", message: `Row ${row}: "${(cells[map.plot] ?? "").trim()}" is not a plot number.` });
      return;
    }
    const plotIndex = this.plotIndexes.get(plotNumber);
    if (plotIndex === undefined) {
      this.report({ severity: "error", code: "unknown-plot", row, column: "plot", message: `Row ${row}: plot ${plotNumber} is not in this trial.` });
      return;
    }
    if (map.treatment !== null) {
      const treatmentCode = this.context.plots[plotIndex].treatmentCode;
      const stated = (cells[map.treatment] ?? "").trim();
      if (stated && stated.toLowerCase() !== treatmentCode.toLowerCase()) {
        this.report({
          severity: "error",
          code: "treatment-mismatch",
          row,
          column: "treatment",
          message: `Row ${row}: plot ${plotNumber} carries treatment ${treatmentCode} in this trial, not ${stated}. Check the plot number.`,
        });
        return;
      }
    }
    if (map.unit !== null) {
      const stated = (cells[map.unit] ?? "").trim();
      if (stated && !sameUnit(stated, this.context.unit)) {
        this.report({ severity: "error", code: "wrong-unit", row, column: "unit", message: `Row ${row}: the value is in ${stated}, but this assessment records ${this.context.unit}.` });
        return;
      }
    }
    const species = map.species !== null ? (cells[map.species] ?? "").trim().slice(0, 80) : "";
    if (map.format === "wide") {
      for (const [index, quadrat] of map.quadratColumns) this.acceptValue(cells[index], row, `q${quadrat}`, plotNumber, plotIndex, quadrat, species);
      return;
    }
    let quadrat = 1;
    if (map.quadrat !== null) {
      const parsed = readWholeNumber(cells[map.quadrat]);
      if (parsed === null || parsed < 1 || parsed > this.context.quadratsPerPlot) {
        this.report({
          severity: "error",
          code: "bad-quadrat",
          row,
          column: "quadrat",
          message: `Row ${row}: quadrat "${(cells[map.quadrat] ?? "").trim()}" is not between 1 and ${this.context.quadratsPerPlot}.`,
        });
        return;
      }
      quadrat = parsed;
    }
    this.acceptValue(cells[map.value!], row, "value", plotNumber, plotIndex, quadrat, species);
  }

  private acceptValue(raw: string | undefined, row: number, column: string, plotNumber: number, plotIndex: number, quadrat: number, species: string): void {
    const reading = readNumberCell(raw);
    if (reading.kind === "missing") {
      this.report({ severity: "warning", code: "no-value", row, column, message: `Row ${row}: no value for ${describeCell(plotNumber, quadrat, species)}; it is left out (a lost quadrat).` });
      return;
    }
    if (reading.kind === "decimal-comma") {
      this.report({ severity: "error", code: "not-a-number", row, column, message: `Row ${row}: "${(raw ?? "").trim()}" uses a comma as decimal mark; write it with a point (${(raw ?? "").trim().replace(",", ".")}).` });
      return;
    }
    if (reading.kind === "text") {
      this.report({ severity: "error", code: "not-a-number", row, column, message: `Row ${row}: "${(raw ?? "").trim().slice(0, 40)}" for ${describeCell(plotNumber, quadrat, species)} is not a number.` });
      return;
    }
    if (reading.value < 0) {
      this.report({ severity: "error", code: "negative", row, column, message: `Row ${row}: ${reading.value} for ${describeCell(plotNumber, quadrat, species)} is negative; counts, weights and ratings cannot be.` });
      return;
    }
    const slot = plotIndex * this.stride + quadrat;
    const { number: speciesNumber, spelling } = this.speciesOf(species);
    const earlier = this.earlierRow(speciesNumber, slot);
    if (earlier !== 0) {
      const cell = describeCell(plotNumber, quadrat, species);
      if (this.problems.length < MAX_PROBLEMS_SHOWN) this.duplicatesListed.push({ problem: this.problems.length, cell, earlier });
      this.report(duplicateProblem(row, column, cell, earlier));
      return;
    }
    this.markSeen(speciesNumber, slot, row);
    const { plausibleMin, plausibleMax } = this.context;
    if ((plausibleMin !== null && reading.value < plausibleMin) || (plausibleMax !== null && reading.value > plausibleMax)) {
      this.implausibleValues.push(this.rows.length);
      this.report({
        severity: "warning",
        code: "implausible",
        row,
        column,
        message: `Row ${row}: ${reading.value} ${this.context.unit} for ${describeCell(plotNumber, quadrat, species)} is outside the usual range (${plausibleMin ?? "–"} to ${plausibleMax ?? "–"}). Check it; it will be kept if you confirm.`,
      });
    }
    this.take(row, plotIndex, quadrat, spelling, reading.value);
  }

  /** The row that already gave a value for this species at this slot, or 0. */
  private earlierRow(speciesNumber: number, slot: number): number {
    const table = this.seen[speciesNumber];
    return table ? table[slot] : (this.seenOverflow.get(speciesNumber * this.quadratsWithValues.length + slot) ?? 0);
  }

  private markSeen(speciesNumber: number, slot: number, row: number): void {
    const table = this.seen[speciesNumber];
    if (table) table[slot] = row;
    else this.seenOverflow.set(speciesNumber * this.quadratsWithValues.length + slot, row);
    this.quadratsWithValues[slot] = 1;
  }

  private take(row: number, plotIndex: number, quadrat: number, spelling: number, value: number): void {
    this.rows.push(row);
    this.valuePlotIndexes.push(plotIndex);
    this.quadrats.push(quadrat);
    this.valueSpellings.push(spelling);
    this.values.push(value);
  }

  private speciesOf(written: string): { number: number; name: string; spelling: number } {
    let spelling = this.spellings.get(written);
    if (spelling === undefined) {
      // Spellings that differ only in case are one species.
      const key = written.toLowerCase();
      let number = this.speciesNumbers.get(key);
      if (number === undefined) {
        number = this.speciesNumbers.size;
        this.speciesNumbers.set(key, number);
        if (number < SPECIES_TABLES) this.seen.push(new Int32Array(this.quadratsWithValues.length));
      }
      this.spellings.set(written, (spelling = { number, name: written, spelling: this.spellingNames.push(written) - 1 }));
    }
    return spelling;
  }

  /**
   * This checker's rows as typed columns for another thread to absorb (see absorb): the part
   * of a file after its first part, checked by this checker alone. Whole-file checks (lost
   * plots, an empty file) are left to the checker that absorbs it.
   */
  exportPart(): CheckedPart {
    return {
      rows: this.rows.view(),
      plotIndexes: this.valuePlotIndexes.view(),
      quadrats: this.quadrats.view(),
      speciesIndexes: this.valueSpellings.view(),
      speciesNames: this.spellingNames,
      values: this.values.view(),
      implausibleValues: Int32Array.from(this.implausibleValues),
      problems: this.problems,
      duplicatesListed: this.duplicatesListed,
      problemCount: this.problemCount,
      errors: this.errors,
      rowsRead: this.rowsRead,
    };
  }

  /**
   * absorb's loop, on its own so that it stays compiled: the values of the part that repeat none
   * of this checker's are taken in; the others become duplicates (listed up to the limit).
   */
  private takeInPart(part: CheckedPart, format: ColumnMap["format"]) {
    const spellings = part.speciesNames.map((name) => this.speciesOf(name));
    const { rows, plotIndexes, quadrats, speciesIndexes, values, implausibleValues } = part;
    const crossing: IngestProblem[] = [];
    let crossingCount = 0;
    /** Range warnings a duplicate takes the place of, by row and column. */
    const dropped = new Set<string>();
    /** This checker's row each of the part's values repeats, by the part's row and column. */
    const repeated = new Map<string, number>();
    // The values that drew a range warning, in increasing order: the next one to come.
    let nextImplausible = 0;
    const stride = this.stride;
    const plots = this.context.plots;
    for (let index = 0; index < rows.length; index += 1) {
      const plotIndex = plotIndexes[index];
      const quadrat = quadrats[index];
      const slot = plotIndex * stride + quadrat;
      const spelling = spellings[speciesIndexes[index]];
      const earlier = this.earlierRow(spelling.number, slot);
      const row = rows[index];
      // Bounds checked first: reading past a typed array's end is slow.
      const implausible = nextImplausible < implausibleValues.length && implausibleValues[nextImplausible] === index;
      if (implausible) nextImplausible += 1;
      if (earlier !== 0) {
        crossingCount += 1;
        const column = format === "wide" ? `q${quadrat}` : "value";
        const cell = describeCell(plots[plotIndex].number, quadrat, spelling.name);
        if (crossing.length < MAX_PROBLEMS_SHOWN) crossing.push(duplicateProblem(row, column, cell, earlier));
        // Read in one pass, the duplicate would have been reported instead of its range warning.
        if (implausible) dropped.add(`${row}:${column}`);
        repeated.set(`${row}:${column}`, earlier);
        continue;
      }
      this.markSeen(spelling.number, slot, row);
      if (implausible) this.implausibleValues.push(this.rows.length);
      this.take(row, plotIndex, quadrat, spelling.spelling, values[index]);
    }
    return { crossing, crossingCount, dropped, repeated };
  }

  /**
   * Takes in the rows of the file's next part, checked elsewhere against the same context as
   * if this checker had read them itself: a value already given in this checker's rows is the
   * same duplicate error (and draws no range warning), problems stay in row order, and the
   * first MAX_PROBLEMS_SHOWN of the whole file are the ones listed.
   */
  absorb(part: CheckedPart): void {
    const map = this.map;
    if (!map) return;
    const shownBefore = this.problems.length;
    const { crossing, crossingCount, dropped, repeated } = this.takeInPart(part, map.format);
    const warningsDropped = dropped.size;
    // A later copy of such a value repeats, read in one pass, this checker's row, not the part's.
    const partListed = [...part.problems];
    for (const { problem, cell, earlier } of part.duplicatesListed) {
      const { row, column } = partListed[problem];
      const first = repeated.get(`${earlier}:${column}`);
      if (first !== undefined) partListed[problem] = duplicateProblem(row!, column!, cell, first);
    }
    const partProblems = dropped.size > 0 ? partListed.filter((problem) => !(problem.code === "implausible" && dropped.has(`${problem.row}:${problem.column}`))) : partListed;
    this.rowsRead += part.rowsRead;
    this.errors += part.errors + crossingCount;
    this.problemCount += part.problemCount - warningsDropped + crossingCount;
    // Both lists are in file order (row, then a wide row's quadrat columns) and each holds the
    // first MAX_PROBLEMS_SHOWN of its kind (the part's, less any range warnings dropped above).
    const columnOrder = new Map([...map.quadratColumns.values()].map((quadrat, order) => [`q${quadrat}`, order]));
    const before = (a: IngestProblem, b: IngestProblem) => a.row! < b.row! || (a.row === b.row && (columnOrder.get(a.column ?? "") ?? 0) < (columnOrder.get(b.column ?? "") ?? 0));
    let fromPart = 0;
    let fromCrossing = 0;
    for (let shown = shownBefore; shown < MAX_PROBLEMS_SHOWN; shown += 1) {
      const next = partProblems[fromPart];
      const crossed = crossing[fromCrossing];
      if (!next && !crossed) break;
      if (crossed && (!next || before(crossed, next))) {
        this.problems.push(crossed);
        fromCrossing += 1;
      } else {
        this.problems.push(next);
        fromPart += 1;
      }
    }
  }

  finish(): IngestResult {
    if (!this.headerSeen) {
      this.report({ severity: "error", code: "empty-file", message: "The file is empty. Fill in the data sheet and upload it again." });
    } else if (this.map && this.rows.length === 0 && this.errorCount === 0) {
      this.report({ severity: "error", code: "no-values", message: "The file has a header but no values. Fill in the data sheet and upload it again." });
    }
    if (this.map && this.rows.length > 0) {
      const missingPlots: number[] = [];
      const short: number[] = [];
      this.context.plots.forEach((plot, index) => {
        let quadrats = 0;
        for (let quadrat = 1; quadrat < this.stride; quadrat += 1) quadrats += this.quadratsWithValues[index * this.stride + quadrat];
        if (quadrats === 0) missingPlots.push(plot.number);
        else if (quadrats < this.context.quadratsPerPlot) short.push(plot.number);
      });
      if (missingPlots.length > 0) {
        this.report({
          severity: "warning",
          code: "missing-plot",
          message: `No values for plot${missingPlots.length === 1 ? "" : "s"} ${describePlots(missingPlots)}. ${missingPlots.length === 1 ? "It is" : "They are"} analysed as lost plots unless you add them.`,
        });
      }
      if (short.length > 0) {
        this.report({
          severity: "warning",
          code: "missing-quadrat",
          message: `Plot${short.length === 1 ? "" : "s"} ${describePlots(short)} ${short.length === 1 ? "has" : "have"} fewer than ${this.context.quadratsPerPlot} quadrats; the plot mean uses the quadrats present.`,
        });
      }
    }
    if (this.problemCount > this.problems.length) {
      this.problems.push({ severity: "warning", code: "more-problems", message: `${this.problemCount - this.problems.length} further problems are not listed. Fix the ones above and upload again.` });
    }
    const values = {
      rows: this.rows.view(),
      plotNumbers: Int32Array.from(this.valuePlotIndexes.view(), (plotIndex) => this.context.plots[plotIndex].number),
      quadrats: this.quadrats.view(),
      speciesIndexes: this.valueSpellings.view(),
      speciesNames: this.spellingNames,
      values: this.values.view(),
    };
    return { format: this.map?.format ?? null, values, problems: this.problems, rowsRead: this.rowsRead };
  }
}
