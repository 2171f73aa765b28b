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
  const words = Math.max(1, Math.ceil(count / 32));
  const everyone = new Uint32Array(words);
  for (let treatment = 0; treatment < count; treatment++) everyone[treatment >>> 5] |= 1 << (treatment & 31);
  let columns: Uint32Array[] = [everyone];
  for (let first = 0; first < count; first++) {
    const firstWord = first >>> 5;
    const firstBit = 1 << (first & 31);
    for (let second = first + 1; second < count; second++) {
      const secondWord = second >>> 5;
      const secondBit = 1 << (second & 31);
      if (!columns.some((column) => column[firstWord] & firstBit && column[secondWord] & secondBit)) continue;
      if (!isSignificant(first, second)) continue;
      const kept: Uint32Array[] = [];
      const created: Uint32Array[] = [];
      for (const column of columns) {
        if (column[firstWord] & firstBit && column[secondWord] & secondBit) {
          const withoutSecond = Uint32Array.from(column);
          withoutSecond[secondWord] &= ~secondBit;
          const withoutFirst = Uint32Array.from(column);
          withoutFirst[firstWord] &= ~firstBit;
          created.push(withoutSecond, withoutFirst);
        } else kept.push(column);
      }
      // Only the new columns can be absorbed: each is a proper subset of a column that was not
      // itself contained in any other, so no old column can lie inside a new one.
      for (let index = 0; index < created.length; index++) {
        const candidate = created[index];
        const absorbed =
          kept.some((column) => isSubset(candidate, column)) ||
          created.some((column, other) => other !== index && isSubset(candidate, column) && (!isSubset(column, candidate) || other < index));
        if (!absorbed) kept.push(candidate);
        else created[index] = new Uint32Array(words);
      }
      columns = kept;
    }
  }
  const has = (column: Uint32Array, treatment: number) => (column[treatment >>> 5] & (1 << (treatment & 31))) !== 0;
  const orderByMean = Array.from({ length: count }, (_, index) => index).sort((a, b) => means[b] - means[a] || a - b);
  const rank = new Int32Array(count);
  orderByMean.forEach((treatment, position) => (rank[treatment] = position));
  const memberRanks = columns.map((column) =>
    Array.from({ length: count }, (_, index) => index)
      .filter((index) => has(column, index))
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
    for (let treatment = 0; treatment < count; treatment++) if (has(columns[columnIndex], treatment)) labels[treatment] += letter;
  });
  return labels;
}

function isSubset(inner: Uint32Array, outer: Uint32Array): boolean {
  for (let index = 0; index < inner.length; index++) if ((inner[index] & ~outer[index]) !== 0) return false;
  return true;
}

function letterName(index: number): string {
  const alphabet = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ";
  if (index < alphabet.length) return alphabet[index];
  return `${alphabet[index % alphabet.length]}${Math.floor(index / alphabet.length)}`;
}
