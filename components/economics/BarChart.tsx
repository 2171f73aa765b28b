/**
 * A horizontal bar chart a grower reads at a glance: one labelled bar per method with its value
 * written at the end, optional range whiskers. Plain HTML, so it reflows on a phone and prints.
 */
export interface Bar {
  key: string;
  label: string;
  value: number;
  valueText: string;
  note?: string;
  tone?: "check" | "method";
}

export function BarChart({ title, caption, bars, testId }: { title: string; caption?: string; bars: Bar[]; testId?: string }) {
  const max = Math.max(...bars.map((bar) => bar.value), 0) || 1;
  return (
    <figure className="rounded border border-soil-200 bg-white p-4" data-testid={testId}>
      <figcaption className="mb-3">
        <span className="block font-semibold">{title}</span>
        {caption && <span className="block text-sm text-soil-700">{caption}</span>}
      </figcaption>
      <ul className="space-y-2">
        {bars.map((bar) => (
          <li key={bar.key} className="grid grid-cols-1 gap-1 sm:grid-cols-[11rem_1fr] sm:items-center sm:gap-3">
            <span className="text-sm">{bar.label}</span>
            <span className="flex items-center gap-2">
              <span className="relative h-5 flex-1 rounded-sm bg-soil-100" aria-hidden>
                <span
                  className={`absolute inset-y-0 left-0 rounded-sm ${bar.tone === "check" ? "bg-soil-500" : "bg-leaf-600"}`}
                  style={{ width: `${Math.max(0, (bar.value / max) * 100)}%` }}
                />
              </span>
              <span className="w-36 shrink-0 text-right text-sm tabular-nums">
                {bar.valueText}
                {bar.note && <span className="block text-xs text-soil-700">{bar.note}</span>}
              </span>
            </span>
          </li>
        ))}
      </ul>
    </figure>
  );
}
