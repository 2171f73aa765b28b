import type { RandomSource } from "./prng";

/**
 * Fisher–Yates (Durstenfeld) shuffle into a new array: every ordering is equally likely
 * when the random source is uniform, which a sort with a random comparator does not give.
 */
export function shuffled<T>(items: readonly T[], random: RandomSource): T[] {
  const result = items.slice();
  for (let i = result.length - 1; i > 0; i--) {
    const j = random.nextBelow(i + 1);
    [result[i], result[j]] = [result[j], result[i]];
  }
  return result;
}

/** A random ordering of 0..count-1. */
export function randomPermutation(count: number, random: RandomSource): number[] {
  return shuffled(
    Array.from({ length: count }, (_, index) => index),
    random,
  );
}
