/**
 * Raw values as parallel columns, in the order they came: value i is plotNumbers[i],
 * quadrats[i], species[i], values[i]. A 100,000-value file is four arrays, not 100,000
 * objects for the collector to trace and move.
 */
export interface ValueColumns {
  plotNumbers: number[];
  quadrats: number[];
  species: string[];
  values: number[];
}

export interface PlotValue {
  plotNumber: number;
  quadrat: number;
  species: string;
  value: number;
}

export function columnsOf(values: readonly PlotValue[]): ValueColumns {
  return {
    plotNumbers: values.map((entry) => entry.plotNumber),
    quadrats: values.map((entry) => entry.quadrat),
    species: values.map((entry) => entry.species),
    values: values.map((entry) => entry.value),
  };
}
