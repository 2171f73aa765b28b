/**
 * Seeded pseudo-random numbers for plot randomization.
 *
 * Why our own generator: `Math.random` cannot be seeded, and a trial's layout must be
 * reproducible from its stored seed years later, on any machine and any Node version.
 *
 * Algorithm: Mulberry32 (Tommy Ettinger, 2017, public domain), in its widely used revision
 * with increment 0x6D2B79F5 and the `| 61` step. (An earlier revision used 0x6D4B79F5 and
 * `| 29`; it gives different numbers, so the constants here must never change or every
 * stored layout would be redrawn differently.) State is one 32-bit word, period 2^32; it is
 * not cryptographic, which a field layout does not need. `Math.imul` gives the wrapping
 * 32-bit multiplication of the C original.
 */
export type RandomSource = {
  /** Next unsigned 32-bit integer. */
  nextUint32(): number;
  /** Uniform integer in 0..bound-1, without modulo bias. */
  nextBelow(bound: number): number;
};

const TWO_POW_32 = 4294967296;

export function mulberry32(seed: number): RandomSource {
  let state = seed >>> 0;

  function nextUint32(): number {
    state = (state + 0x6d2b79f5) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 15), z | 1);
    z ^= z + Math.imul(z ^ (z >>> 7), z | 61);
    return (z ^ (z >>> 14)) >>> 0;
  }

  // Rejection sampling: drawing `u % bound` directly would favour small values slightly
  // whenever 2^32 is not a multiple of bound; values in the incomplete last cycle are redrawn.
  function nextBelow(bound: number): number {
    if (!Number.isInteger(bound) || bound < 1 || bound > TWO_POW_32) {
      throw new RangeError(`nextBelow needs a whole bound between 1 and 2^32, got ${bound}`);
    }
    const limit = TWO_POW_32 - (TWO_POW_32 % bound);
    for (;;) {
      const u = nextUint32();
      if (u < limit) return u % bound;
    }
  }

  return { nextUint32, nextBelow };
}
