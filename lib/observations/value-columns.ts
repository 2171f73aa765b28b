import { AppError } from "@/lib/errors";

/**
 * Raw values as parallel columns, in the order they came: value i is plotNumbers[i],
 * quadrats[i], speciesNames[speciesIndexes[i]], values[i]. A 100,000-value file is a few typed
 * arrays and a short list of names, not 100,000 objects or strings for the collector.
 */
export interface ValueColumns {
  plotNumbers: Int32Array;
  quadrats: Int32Array;
  /** Each value's species as its place in speciesNames: every spelling as written, once. */
  speciesIndexes: Int32Array;
  speciesNames: readonly string[];
  values: Float64Array;
}

export interface PlotValue {
  plotNumber: number;
  quadrat: number;
  species: string;
  value: number;
}

/** Plot and quadrat numbers are whole: a typed column would silently cut 1.5 to 1. */
function whole(number: number, what: "Plot" | "Quadrat"): number {
  if (!Number.isInteger(number) || Math.abs(number) > 2 ** 31 - 1) {
    throw new AppError("INVALID_INPUT", what === "Plot" ? `Plot ${number} is not in this trial.` : `Quadrat ${number} is not a quadrat number.`);
  }
  return number;
}

export function columnsOf(values: readonly PlotValue[]): ValueColumns {
  const speciesNames: string[] = [];
  const spellings = new Map<string, number>();
  const speciesIndexes = Int32Array.from(values, ({ species }) => {
    let index = spellings.get(species);
    if (index === undefined) spellings.set(species, (index = speciesNames.push(species) - 1));
    return index;
  });
  return {
    plotNumbers: Int32Array.from(values, (entry) => whole(entry.plotNumber, "Plot")),
    quadrats: Int32Array.from(values, (entry) => whole(entry.quadrat, "Quadrat")),
    speciesIndexes,
    speciesNames,
    values: Float64Array.from(values, (entry) => entry.value),
  };
}

export const speciesAt = (columns: ValueColumns, index: number) => columns.speciesNames[columns.speciesIndexes[index]];

export const emptyColumns = (): ValueColumns => ({ plotNumbers: new Int32Array(), quadrats: new Int32Array(), speciesIndexes: new Int32Array(), speciesNames: [], values: new Float64Array() });
