/**
 * Compact letter display: letters such that two treatments share a letter
 * exactly when their difference is not significant.
 *
 * Formula: Piepho's insert-and-absorb algorithm. Start with one letter
 * column holding every treatment; for each significant pair (i, j), every
 * column holding both is split into a copy without i and a copy without j;
 * after each split, columns contained in another column are absorbed
 * (deleted). Columns are then ordered by their highest-mean member, so the
 * treatment with the highest mean gets "a"; letters run a-z, then A-Z, then
 * numbered.
 *
 * Why this algorithm: simple "sort and sweep" letterings are wrong when the
 * significance pattern is not a set of intervals, which happens with
 * unbalanced data and many treatments; insert-absorb is correct for any
 * pattern.
 *
 * Reference: Piepho, H.-P. (2004) An algorithm for a letter-based
 * representation of all-pairwise comparisons. Journal of Computational and
 * Graphical Statistics 13:456-466.
 *
 * @example
 * compactLetterDisplay([10, 9, 1], (i, j) => Math.abs(i - j) === 2 || (i === 1 && j === 2) || (i === 2 && j === 1))
 * // ["a", "a", "b"]
 */
export function compactLetterDisplay(means: ArrayLike<number>, isSignificant: (first: number, second: number) => boolean): string[] {
  const count = means.length;
  let columns: Uint8Array[] = [new Uint8Array(count).fill(1)];
  for (let first = 0; first < count; first++) {
    for (let second = first + 1; second < count; second++) {
      if (!isSignificant(first, second)) continue;
      const next: Uint8Array[] = [];
      let changed = false;
      for (const column of columns) {
        if (column[first] && column[second]) {
          const withoutSecond = Uint8Array.from(column);
          withoutSecond[second] = 0;
          const withoutFirst = Uint8Array.from(column);
          withoutFirst[first] = 0;
          next.push(withoutSecond, withoutFirst);
          changed = true;
        } else next.push(column);
      }
      if (changed) columns = absorb(next);
    }
  }
  const orderByMean = Array.from({ length: count }, (_, index) => index).sort((a, b) => means[b] - means[a] || a - b);
  const rank = new Int32Array(count);
  orderByMean.forEach((treatment, position) => (rank[treatment] = position));
  const memberRanks = columns.map((column) =>
    Array.from(column.keys())
      .filter((index) => column[index])
      .map((index) => rank[index])
      .sort((a, b) => a - b),
  );
  const columnOrder = columns
    .map((_, index) => index)
    .sort((a, b) => {
      const first = memberRanks[a];
      const second = memberRanks[b];
      for (let position = 0; position < Math.min(first.length, second.length); position++) {
        if (first[position] !== second[position]) return first[position] - second[position];
      }
      return first.length - second.length;
    });
  const labels = new Array<string>(count).fill("");
  columnOrder.forEach((columnIndex, letterIndex) => {
    const letter = letterName(letterIndex);
    columns[columnIndex].forEach((member, treatment) => {
      if (member) labels[treatment] += letter;
    });
  });
  return labels;
}

function absorb(columns: Uint8Array[]): Uint8Array[] {
  const kept: Uint8Array[] = [];
  for (let index = 0; index < columns.length; index++) {
    let absorbed = false;
    for (let other = 0; other < columns.length && !absorbed; other++) {
      if (other === index) continue;
      if (isSubset(columns[index], columns[other]) && (!isSubset(columns[other], columns[index]) || other < index)) absorbed = true;
    }
    if (!absorbed) kept.push(columns[index]);
  }
  return kept;
}

function isSubset(inner: Uint8Array, outer: Uint8Array): boolean {
  for (let index = 0; index < inner.length; index++) if (inner[index] && !outer[index]) return false;
  return true;
}

function letterName(index: number): string {
  const alphabet = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ";
  if (index < alphabet.length) return alphabet[index];
  return `${alphabet[index % alphabet.length]}${Math.floor(index / alphabet.length)}`;
}
