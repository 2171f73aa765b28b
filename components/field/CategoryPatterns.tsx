import { categoryStyles, type PatternKind } from "@/lib/layout/palette";
import { methodCategories, type MethodCategory } from "@/models/Treatment";

/** Pattern ids are prefixed so two maps on one page do not pick up each other's patterns. */
export function patternId(idPrefix: string, category: MethodCategory): string {
  return `${idPrefix}-pattern-${category}`;
}

const tile = 10;

/**
 * One SVG <pattern> per method category: the second channel beside colour, so categories stay
 * apart in greyscale print and for colour-blind readers. Marks use the category's text colour,
 * which has ≥ 4.5:1 contrast with its fill, so they stay visible on light and dark fills alike.
 * The patterns only draw marks (no background), laid over the plain fill.
 */
export function CategoryPatternDefs({ idPrefix }: { idPrefix: string }) {
  return (
    <defs>
      {methodCategories
        .filter((category) => categoryStyles[category].pattern !== "plain")
        .map((category) => (
          <pattern key={category} id={patternId(idPrefix, category)} width={tile} height={tile} patternUnits="userSpaceOnUse">
            <PatternMarks kind={categoryStyles[category].pattern} colour={categoryStyles[category].text} />
          </pattern>
        ))}
    </defs>
  );
}

function PatternMarks({ kind, colour }: { kind: PatternKind; colour: string }) {
  const line = { stroke: colour, strokeWidth: 1.2, fill: "none" };
  switch (kind) {
    case "plain":
      return null;
    case "dots":
      return <circle cx={tile / 2} cy={tile / 2} r={1.7} fill={colour} />;
    case "diagonal":
      return <path d="M-1,1 L1,-1 M0,10 L10,0 M9,11 L11,9" {...line} />;
    case "horizontal":
      return <path d="M0,5 L10,5" {...line} />;
    case "vertical":
      return <path d="M5,0 L5,10" {...line} />;
    case "crosshatch":
      return <path d="M-1,1 L1,-1 M0,10 L10,0 M9,11 L11,9 M-1,9 L1,11 M0,0 L10,10 M9,-1 L11,1" {...line} strokeWidth={0.9} />;
    case "grid":
      return <path d="M5,0 L5,10 M0,5 L10,5" {...line} />;
    case "zigzag":
      return <path d="M0,7 L2.5,3 L5,7 L7.5,3 L10,7" {...line} />;
  }
}
