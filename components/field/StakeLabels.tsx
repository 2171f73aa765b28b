import { qrSvg } from "@/lib/layout/qr";
import { stakeWarningFor } from "@/lib/safety/cautions";
import type { MethodCategory } from "@/models/Treatment";

export type StakeLabelsProps = {
  trialTitle: string;
  plots: { number: number; block: number; treatmentCode: string; category: MethodCategory; url: string }[];
};

/** 3 × 7 labels of 66 × 37 mm fit A4 and US Letter alike inside 8 mm page margins (Letter leaves 263 mm of height). */
const labelsPerSheet = 21;
const maxTitleLength = 34;

/**
 * Printable plot stake labels, one per plot: plot number large enough to read at arm's length
 * outdoors (about 30 pt), block and treatment code (14 pt), a short trial title, and a QR code
 * that opens the plot's page on a phone. A plot treated with a herbicide, flame or a machine
 * says so in a line of bold print, for whoever walks in later. Sheets break onto new pages
 * when printed.
 */
export async function StakeLabels({ trialTitle, plots }: StakeLabelsProps) {
  const codes = await Promise.all(plots.map((plot) => qrSvg(plot.url)));
  const labels = plots.map((plot, index) => ({ plot, qr: codes[index] }));
  const sheets = Array.from({ length: Math.ceil(labels.length / labelsPerSheet) }, (_, index) =>
    labels.slice(index * labelsPerSheet, (index + 1) * labelsPerSheet),
  );
  const title = shortTitle(trialTitle);
  return (
    <div className="flex flex-col items-center gap-6 print:block">
      <style>{"@media print { @page { margin: 8mm; } }"}</style>
      {sheets.map((sheet, sheetIndex) => (
        <section
          key={sheetIndex}
          aria-label={`Stake labels, sheet ${sheetIndex + 1} of ${sheets.length}`}
          className="grid w-[198mm] grid-cols-3 auto-rows-[37mm] bg-white shadow print:shadow-none print:break-after-page print:last:break-after-auto"
        >
          {sheet.map(({ plot, qr }) => (
            <article key={plot.number} className="flex items-center gap-[2mm] overflow-hidden border border-dashed border-soil-500 p-[2mm] text-black break-inside-avoid">
              <div
                role="img"
                aria-label={`QR code for plot ${plot.number}`}
                className="h-[29mm] w-[29mm] shrink-0 [&>svg]:h-full [&>svg]:w-full"
                dangerouslySetInnerHTML={{ __html: qr }}
              />
              <div className="min-w-0 leading-tight">
                <p className="truncate text-[8pt]">{title}</p>
                <p className="text-[30pt] font-bold leading-none tabular-nums">{plot.number}</p>
                <p className="mt-[1mm] text-[14pt] font-semibold">Block {plot.block}</p>
                <p className="truncate text-[14pt] font-semibold">{plot.treatmentCode}</p>
                {stakeWarningFor(plot.category) ? <p className="mt-[0.5mm] text-[7pt] font-bold leading-tight">⚠ {stakeWarningFor(plot.category)}</p> : null}
              </div>
            </article>
          ))}
        </section>
      ))}
    </div>
  );
}

function shortTitle(title: string): string {
  return title.length > maxTitleLength ? `${title.slice(0, maxTitleLength - 1)}…` : title;
}
