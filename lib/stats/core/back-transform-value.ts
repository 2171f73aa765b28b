import type { ResponseTransform } from "./transform-value";

/**
 * Maps a mean on the transformed scale back to the original units.
 *
 * Formula: sqrt → m²; log1p → exp(m) - 1; asin-sqrt → 100 sin²(m); none → m.
 * This is the plain inverse (a median-type value on the original scale),
 * without a bias correction, as tables of back-transformed means usually
 * report (and as R's emmeans(type = "response") does by default).
 *
 * Reference: Gomez & Gomez (1984) §7.2.2.
 *
 * @example
 * backTransformValue(0.5235987755982989, "asin-sqrt") // 25
 */
export function backTransformValue(value: number, transform: ResponseTransform): number {
  switch (transform) {
    case "none":
      return value;
    case "sqrt":
      return value * value;
    case "log1p":
      return Math.expm1(value);
    case "asin-sqrt": {
      const sine = Math.sin(value);
      return 100 * sine * sine;
    }
  }
}
