/**
 * Safety cautions in a box that stays visible on screen and on paper: a solid dark border and
 * a heading rather than colour alone, and kept in one piece when printed.
 */
export function Cautions({ cautions, heading = "Safety" }: { cautions: string[]; heading?: string }) {
  if (cautions.length === 0) return null;
  return (
    <aside role="note" aria-label={heading} className="my-4 break-inside-avoid rounded border-2 border-soil-900 bg-white p-3 text-soil-900 print:my-2 print:p-2">
      <h2 className="text-base font-bold print:text-sm">{heading}</h2>
      <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm print:text-xs">
        {cautions.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
    </aside>
  );
}
