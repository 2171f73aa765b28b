/**
 * Colour measures for checking the map palette, per WCAG 2.1 (§1.4.3 Contrast (Minimum) and
 * its definitions of relative luminance and contrast ratio) and CIE 1976 lightness.
 */

/** sRGB "#rrggbb" → relative luminance Y in 0..1 (WCAG 2.x definition). */
export function relativeLuminance(hex: string): number {
  const match = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(hex);
  if (!match) throw new Error(`Expected a colour as #rrggbb, got "${hex}"`);
  const [red, green, blue] = match.slice(1).map((pair) => linearChannel(parseInt(pair, 16) / 255));
  return 0.2126 * red + 0.7152 * green + 0.0722 * blue;
}

// WCAG 2.x writes the threshold as 0.03928; the sRGB standard's 0.04045 gives the same
// result for every 8-bit value, since no channel value falls between the two.
function linearChannel(value: number): number {
  return value <= 0.04045 ? value / 12.92 : ((value + 0.055) / 1.055) ** 2.4;
}

/** WCAG contrast ratio (L1 + 0.05) / (L2 + 0.05), from 1 to 21. */
export function contrastRatio(first: string, second: string): number {
  const a = relativeLuminance(first);
  const b = relativeLuminance(second);
  return (Math.max(a, b) + 0.05) / (Math.min(a, b) + 0.05);
}

/**
 * CIE 1976 L* (0 black … 100 white): lightness as people perceive it, which is what is left
 * of a colour in greyscale print, so differences in L* say whether two fills stay apart.
 */
export function perceivedLightness(hex: string): number {
  const y = relativeLuminance(hex);
  return y > 216 / 24389 ? 116 * Math.cbrt(y) - 16 : (24389 / 27) * y;
}
