import { AppError } from "@/lib/errors";

export interface PlotValue {
  plotNumber: number;
  quadrat: number;
  species: string;
  value: number;
}

/** One plot's values in the order they came, as observation_values stores them. */
export interface PlotValues {
  plotNumber: number;
  quadrats: number[];
  species: string[];
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
export function groupValuesByPlot(values: readonly PlotValue[], plotNumbers: readonly number[]): PlotValues[] {
  const plotIndexes = new Map(plotNumbers.map((number, index) => [number, index]));
  const speciesNumbers = new Map<string, number>();
  let highestQuadrat = 0;
  for (const entry of values) {
    if (!Number.isInteger(entry.quadrat) || entry.quadrat < 1 || entry.quadrat > MAX_QUADRAT) throw new AppError("INVALID_INPUT", `Quadrat ${entry.quadrat} is not a quadrat number.`);
    if (entry.quadrat > highestQuadrat) highestQuadrat = entry.quadrat;
    if (!speciesNumbers.has(entry.species)) speciesNumbers.set(entry.species, speciesNumbers.size);
  }
  const slotsPerPlot = speciesNumbers.size * (highestQuadrat + 1);
  const tableSize = slotsPerPlot * plotNumbers.length;
  // A 100,000-value file fills most slots of a small table: one byte each beats hashing keys.
  const table = tableSize <= MAX_TABLE_SLOTS ? new Uint8Array(tableSize) : null;
  const keys = table ? null : new Set<number>();

  const groups: (PlotValues | undefined)[] = new Array(plotNumbers.length);
  const order: PlotValues[] = [];
  for (const entry of values) {
    const plotIndex = plotIndexes.get(entry.plotNumber);
    if (plotIndex === undefined) throw new AppError("INVALID_INPUT", `Plot ${entry.plotNumber} is not in this trial.`);
    const slot = plotIndex * slotsPerPlot + speciesNumbers.get(entry.species)! * (highestQuadrat + 1) + entry.quadrat;
    const seen = table ? table[slot] === 1 : keys!.has(slot);
    if (seen) throw new AppError("INVALID_INPUT", `Plot ${entry.plotNumber}, quadrat ${entry.quadrat}${entry.species ? `, ${entry.species}` : ""} has more than one value.`);
    if (table) table[slot] = 1;
    else keys!.add(slot);
    let group = groups[plotIndex];
    if (!group) {
      group = groups[plotIndex] = { plotNumber: entry.plotNumber, quadrats: [], species: [], values: [] };
      order.push(group);
    }
    group.quadrats.push(entry.quadrat);
    group.species.push(entry.species);
    group.values.push(entry.value);
  }
  return order;
}
