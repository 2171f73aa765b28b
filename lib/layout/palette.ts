import type { MethodCategory } from "@/models/Treatment";

/** Second visual channel beside colour, so categories stay apart in greyscale and for colour-blind readers. */
export type PatternKind = "plain" | "dots" | "diagonal" | "horizontal" | "crosshatch" | "grid" | "zigzag" | "vertical";

export type CategoryStyle = {
  label: string;
  /** Cell fill. */
  fill: string;
  /** Text drawn on the fill; also the colour of the pattern marks. Contrast with fill ≥ 4.5:1. */
  text: string;
  pattern: PatternKind;
};

/** Ink for everything drawn on white paper outside the cells. */
export const mapInk = "#1a1612";
export const mapPaper = "#ffffff";
/** Block bands: a pale soil tone, never carrying text. */
export const bandFill = "#ece7e0";
export const bandStroke = "#8a7660";

/*
 * Our own palette, built in CIE LCh: the eight fills sit ten L* units apart (96 … 26), so they
 * differ in lightness, the one cue that survives greyscale printing and every kind of colour
 * blindness; hue (ivory, straw, green, ochre, lilac, blue, brick, dark teal) only adds to that.
 * Light fills carry dark text, dark fills white text, each pair ≥ 4.5:1 (WCAG 2.1 §1.4.3).
 * Each category also has its own pattern, so nothing depends on colour alone (WCAG 2.1 §1.4.1).
 */
export const categoryStyles: Record<MethodCategory, CategoryStyle> = {
  check: { label: "Check", fill: "#f8f3ec", text: mapInk, pattern: "plain" },
  mulch: { label: "Mulch", fill: "#f3d48b", text: mapInk, pattern: "dots" },
  hand: { label: "Hand weeding", fill: "#9ac889", text: mapInk, pattern: "diagonal" },
  cultivation: { label: "Cultivation", fill: "#d7915a", text: mapInk, pattern: "horizontal" },
  other: { label: "Other", fill: "#977ab5", text: mapInk, pattern: "crosshatch" },
  robotic: { label: "Robotic", fill: "#0174a5", text: "#ffffff", pattern: "grid" },
  thermal: { label: "Thermal", fill: "#933633", text: "#ffffff", pattern: "zigzag" },
  chemical: { label: "Chemical", fill: "#024547", text: "#ffffff", pattern: "vertical" },
};

export function categoryStyle(category: MethodCategory): CategoryStyle {
  return categoryStyles[category] ?? categoryStyles.other;
}
