import { expect } from "vitest";

/** Asserts |actual - expected| <= max(relative·|expected|, absolute). */
export function expectClose(actual: number, expected: number, relative = 1e-6, absolute = 0, label = ""): void {
  const tolerance = Math.max(relative * Math.abs(expected), absolute);
  const difference = Math.abs(actual - expected);
  if (!(difference <= tolerance)) {
    expect.fail(`${label}: expected ${expected}, got ${actual} (difference ${difference.toExponential(3)} > ${tolerance.toExponential(3)})`);
  }
}

/**
 * Number of correct significant digits of actual against a certified value: NIST's log relative
 * error (McCullough 1998, "Assessing the reliability of statistical software", Am. Stat. 52; the
 * StRD guidance): LRE = -log10(|actual - certified| / |certified|), or -log10(|actual|) when the
 * certified value is 0. It is capped at the digits the certified value carries (15 in the StRD
 * files), so an exact match counts as that many, and floored at 0 for a result that has no
 * correct digit.
 */
export function logRelativeError(actual: number, certified: number, certifiedDigits = 15): number {
  if (!Number.isFinite(actual)) return 0;
  if (actual === certified) return certifiedDigits;
  const lre = certified === 0 ? -Math.log10(Math.abs(actual)) : -Math.log10(Math.abs(actual - certified) / Math.abs(certified));
  return Math.min(certifiedDigits, Math.max(0, lre));
}
