import { StatsInputError } from "../errors";

/** Variance-stabilising transformations offered for the response. */
export type ResponseTransform = "none" | "sqrt" | "log1p" | "asin-sqrt";

/**
 * Applies a variance-stabilising transformation to one response value.
 *
 * Formula: sqrt → √y (counts); log1p → log(1 + y) (counts spanning orders of
 * magnitude, zeros allowed); asin-sqrt → asin(√(y/100)) in radians for
 * percentages 0-100 (cover, control ratings).
 *
 * Assumptions: y >= 0 for sqrt, y > -1 for log1p, 0 <= y <= 100 for asin-sqrt;
 * otherwise an error names the value.
 *
 * Reference: Bartlett, M. S. (1947) The use of transformations. Biometrics
 * 3:39-52; Gomez & Gomez (1984) §7.2.2.
 *
 * @example
 * transformValue(25, "asin-sqrt") // 0.5235987755982989 (= π/6)
 */
export function transformValue(value: number, transform: ResponseTransform): number {
  switch (transform) {
    case "none":
      return value;
    case "sqrt":
      if (value < 0) throw new StatsInputError(`sqrt transform requires values >= 0, got ${value}`);
      return Math.sqrt(value);
    case "log1p":
      if (value <= -1) throw new StatsInputError(`log1p transform requires values > -1, got ${value}`);
      return Math.log1p(value);
    case "asin-sqrt":
      if (value < 0 || value > 100) throw new StatsInputError(`asin-sqrt transform requires percentages between 0 and 100, got ${value}`);
      return Math.asin(Math.sqrt(value / 100));
  }
}
