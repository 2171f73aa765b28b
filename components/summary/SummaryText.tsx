import { parseSummaryText } from "@/lib/summaries/generate";

/** The summary as readers see it: "## " lines are headings, blank lines separate paragraphs. */
export function SummaryText({ text }: { text: string }) {
  const sections = parseSummaryText(text);
  return (
    <div className="space-y-4" data-testid="summary-text">
      {sections.map((section, index) => (
        <section key={`${section.heading}-${index}`}>
          {section.heading && <h2 className="mb-1 text-lg font-semibold">{section.heading}</h2>}
          {section.paragraphs.map((paragraph) => (
            <p key={paragraph} className="mb-2 max-w-prose leading-relaxed">
              {paragraph}
            </p>
          ))}
        </section>
      ))}
    </div>
  );
}
