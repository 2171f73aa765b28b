/** A categorical variable: its sorted level labels and, per plot, the level index. */
export interface EncodedFactor {
  levels: string[];
  codes: Int32Array;
}

const naturalOrder = new Intl.Collator("en", { numeric: true, sensitivity: "variant" });

/**
 * Turns plot labels (treatment, block, row, …) into level indices.
 *
 * Levels are labels, never numbers ("25" and "025" are different levels),
 * and are sorted in natural order ("2" before "10", "tip1" before "tip2") so
 * that tables read the way researchers number their treatments.
 *
 * Reference: the "factor" of Chambers & Hastie (1992) Statistical Models in
 * S, ch. 2.
 *
 * @example
 * encodeFactor(["b", "a", "b"]) // { levels: ["a", "b"], codes: Int32Array [1, 0, 1] }
 */
export function encodeFactor(labels: ReadonlyArray<string>): EncodedFactor {
  const levels = Array.from(new Set(labels)).sort((first, second) => {
    const order = naturalOrder.compare(first, second);
    return order !== 0 ? order : first < second ? -1 : first > second ? 1 : 0;
  });
  const indexOfLevel = new Map<string, number>();
  levels.forEach((level, index) => indexOfLevel.set(level, index));
  const codes = new Int32Array(labels.length);
  for (let index = 0; index < labels.length; index++) codes[index] = indexOfLevel.get(labels[index]) as number;
  return { levels, codes };
}
