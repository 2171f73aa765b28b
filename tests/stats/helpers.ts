import { expect } from "vitest";

/** Asserts |actual - expected| <= max(relative·|expected|, absolute). */
export function expectClose(actual: number, expected: number, relative = 1e-6, absolute = 0, label = ""): void {
  const tolerance = Math.max(relative * Math.abs(expected), absolute);
  const difference = Math.abs(actual - expected);
  if (!(difference <= tolerance)) {
    expect.fail(`${label}: expected ${expected}, got ${actual} (difference ${difference.toExponential(3)} > ${tolerance.toExponential(3)})`);
  }
}

/** Number of correct significant digits of actual against a certified value (NIST's LRE). */
export function logRelativeError(actual: number, certified: number): number {
  if (actual === certified) return 17;
  if (certified === 0) return -Math.log10(Math.abs(actual));
  return -Math.log10(Math.abs(actual - certified) / Math.abs(certified));
}
