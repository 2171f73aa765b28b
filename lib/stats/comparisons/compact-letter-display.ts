/**
 * Compact letter display: letters such that two treatments share a letter
 * exactly when their difference is not significant.
 *
 * Formula: Piepho's insert-and-absorb algorithm. Start with one letter
 * column holding every treatment; for each significant pair (i, j), every
 * column holding both is split into a copy without i and a copy without j;
 * after each split, columns contained in another column are absorbed
 * (deleted). Absorption alone can leave a column whose every pair (and
 * every member) is also covered by other columns; such redundant columns
 * are then removed one at a time (the widest first), so that dropping any
 * remaining letter would break the display. Columns are then ordered by
 * their highest-mean member, so the treatment with the highest mean gets
 * "a".
 *
 * Letter names: a-z, then A-Z (52 columns), then the same letters with one
 * prime (a' … Z'), then two (a'' … Z''), and so on. A treatment's letters
 * are joined without separators ("ab'c"); every letter starts with a Latin
 * letter and its primes follow it, so the string splits back without
 * ambiguity with group.match(/[a-zA-Z]'{0,}/g); with numbered suffixes
 * ("a1") a letter name could be read as a letter and a footnote digit.
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
  columns = withoutRedundantColumns(columns, count);
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

/**
 * Drops columns whose pairs and members all appear in other columns too: they add no
 * information, and a display with them is not minimal. The widest redundant column goes first
 * (it removes the most letters from the table); counts are updated after each removal, since
 * dropping one column can make another one necessary.
 */
function withoutRedundantColumns(columns: Uint32Array[], count: number): Uint32Array[] {
  const members = columns.map((column) => {
    const list: number[] = [];
    for (let treatment = 0; treatment < count; treatment++) if (column[treatment >>> 5] & (1 << (treatment & 31))) list.push(treatment);
    return list;
  });
  const pairCover = new Int32Array(count * count);
  const memberCover = new Int32Array(count);
  const cover = (list: number[], change: number) => {
    for (let first = 0; first < list.length; first++) {
      memberCover[list[first]] += change;
      for (let second = first + 1; second < list.length; second++) pairCover[list[first] * count + list[second]] += change;
    }
  };
  for (const list of members) cover(list, 1);
  const alive = columns.map(() => true);
  const redundant = (list: number[]) => {
    for (let first = 0; first < list.length; first++) {
      if (memberCover[list[first]] < 2) return false;
      for (let second = first + 1; second < list.length; second++) if (pairCover[list[first] * count + list[second]] < 2) return false;
    }
    return true;
  };
  for (;;) {
    let widest = -1;
    for (let index = 0; index < columns.length; index++) {
      if (alive[index] && (widest < 0 || members[index].length > members[widest].length) && redundant(members[index])) widest = index;
    }
    if (widest < 0) break;
    alive[widest] = false;
    cover(members[widest], -1);
  }
  return columns.filter((_, index) => alive[index]);
}

/** a-z, A-Z, then the same with one prime, two primes, …: joined letters split back with /[a-zA-Z]'{0,}/g. */
function letterName(index: number): string {
  const alphabet = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ";
  return alphabet[index % alphabet.length] + "'".repeat(Math.floor(index / alphabet.length));
}
