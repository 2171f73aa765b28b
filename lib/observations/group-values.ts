import { AppError } from "@/lib/errors";
import type { ValueColumns } from "./value-columns";

/**
 * One plot's values in the order they came, as observation_values stores them: each value's
 * species is its place (from 1) in the plot's list of names, each name listed once.
 */
export interface PlotValues {
  plotNumber: number;
  quadrats: number[];
  speciesNames: string[];
  speciesNumbers: number[];
  values: number[];
}

const MAX_QUADRAT = 65_535;
/** Slots of the seen-table (one byte each) past which a set of keys is cheaper. */
const MAX_TABLE_SLOTS = 8_000_000;

/**
 * Groups a version's values by plot and refuses a second value for the same plot, quadrat
 * and species (the same check an upload makes with row numbers; here it is the last line
 * before the database, kept in place of a unique index that would cost a third of a large
 * commit). Plots must be known: `plotNumbers` lists the trial's plots.
 */
export function groupValuesByPlot(columns: ValueColumns, plotNumbers: readonly number[]): PlotValues[] {
  const plotIndexes = new Map(plotNumbers.map((number, index) => [number, index]));
  const { plotNumbers: plotOf, quadrats, speciesIndexes, speciesNames, values } = columns;
  const count = plotOf.length;
  let highestQuadrat = 0;
  for (let index = 0; index < count; index += 1) {
    const quadrat = quadrats[index];
    if (!Number.isInteger(quadrat) || quadrat < 1 || quadrat > MAX_QUADRAT) throw new AppError("INVALID_INPUT", `Quadrat ${quadrat} is not a quadrat number.`);
    if (quadrat > highestQuadrat) highestQuadrat = quadrat;
  }
  // Species are told apart as written (each spelling is one name in the list).
  const slotsPerPlot = speciesNames.length * (highestQuadrat + 1);
  const tableSize = slotsPerPlot * plotNumbers.length;
  // A 100,000-value file fills most slots of a small table: one byte each beats hashing keys.
  const table = tableSize <= MAX_TABLE_SLOTS ? new Uint8Array(tableSize) : null;
  const keys = table ? null : new Set<number>();

  const groups: (PlotValues | undefined)[] = new Array(plotNumbers.length);
  /** Per plot: the file's species number → its number in the plot's list. */
  const listed: (Map<number, number> | undefined)[] = new Array(plotNumbers.length);
  const order: PlotValues[] = [];
  for (let index = 0; index < count; index += 1) {
    const plotNumber = plotOf[index];
    const plotIndex = plotIndexes.get(plotNumber);
    if (plotIndex === undefined) throw new AppError("INVALID_INPUT", `Plot ${plotNumber} is not in this trial.`);
    const quadrat = quadrats[index];
    const speciesNumber = speciesIndexes[index];
    const slot = plotIndex * slotsPerPlot + speciesNumber * (highestQuadrat + 1) + quadrat;
    const seen = table ? table[slot] === 1 : keys!.has(slot);
    if (seen) throw new AppError("INVALID_INPUT", `Plot ${plotNumber}, quadrat ${quadrat}${speciesNames[speciesNumber] ? `, ${speciesNames[speciesNumber]}` : ""} has more than one value.`);
    if (table) table[slot] = 1;
    else keys!.add(slot);
    let group = groups[plotIndex];
    let names = listed[plotIndex];
    if (!group || !names) {
      group = groups[plotIndex] = { plotNumber, quadrats: [], speciesNames: [], speciesNumbers: [], values: [] };
      names = listed[plotIndex] = new Map();
      order.push(group);
    }
    let listNumber = names.get(speciesNumber);
    if (listNumber === undefined) {
      listNumber = group.speciesNames.push(speciesNames[speciesNumber]);
      names.set(speciesNumber, listNumber);
    }
    group.quadrats.push(quadrat);
    group.speciesNumbers.push(listNumber);
    group.values.push(values[index]);
  }
  return order;
}
