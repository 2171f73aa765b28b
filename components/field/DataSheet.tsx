import { Cautions } from "@/components/safety/Cautions";

export type DataSheetProps = {
  trialTitle: string;
  assessmentName: string;
  unit: string;
  plannedDate: string | null;
  quadratsPerPlot: number;
  plots: { number: number; block: number; walkOrder: number; treatmentCode?: string }[];
  cautions?: string[];
};

/**
 * Printable field data sheet: plots in walking order so the scorer fills it top to bottom
 * while walking, one blank per quadrat and a notes column, and blanks for date, assessor and
 * weather. Treatment codes appear only when the caller passes them (blind scoring otherwise).
 * The header row repeats on every printed page.
 */
export function DataSheet({ trialTitle, assessmentName, unit, plannedDate, quadratsPerPlot, plots, cautions = [] }: DataSheetProps) {
  const ordered = [...plots].sort((a, b) => a.walkOrder - b.walkOrder || a.number - b.number);
  const showTreatment = ordered.some((plot) => plot.treatmentCode !== undefined);
  const quadrats = Array.from({ length: quadratsPerPlot }, (_, index) => index + 1);
  const cell = "border border-soil-900 px-1";
  return (
    <section className="bg-white p-4 text-soil-900 print:p-0 print:text-black">
      <header className="mb-3">
        <h1 className="text-xl font-bold print:text-lg">{trialTitle}</h1>
        <p className="text-base">
          {assessmentName} <span className="text-soil-700 print:text-black">({unit})</span>
        </p>
        <dl className="mt-2 grid grid-cols-3 gap-4 text-sm">
          <Blank label="Date" hint={plannedDate ? `planned ${plannedDate}` : undefined} />
          <Blank label="Assessor" />
          <Blank label="Weather" />
        </dl>
      </header>
      <Cautions cautions={cautions} />
      <table className="w-full border-collapse text-sm">
        <thead className="bg-soil-100 print:bg-white">
          <tr>
            <th scope="col" className={`${cell} w-12 text-left`}>Walk</th>
            <th scope="col" className={`${cell} w-14 text-left`}>Plot</th>
            <th scope="col" className={`${cell} w-14 text-left`}>Block</th>
            {showTreatment ? <th scope="col" className={`${cell} w-20 text-left`}>Treatment</th> : null}
            {quadrats.map((quadrat) => (
              <th key={quadrat} scope="col" className={`${cell} text-left`}>
                Q{quadrat} <span className="font-normal">({unit})</span>
              </th>
            ))}
            <th scope="col" className={`${cell} w-1/4 text-left`}>Notes</th>
          </tr>
        </thead>
        <tbody>
          {ordered.map((plot) => (
            <tr key={plot.number} className="h-9 break-inside-avoid">
              <td className={`${cell} tabular-nums`}>{plot.walkOrder}</td>
              <th scope="row" className={`${cell} text-left font-bold tabular-nums`}>{plot.number}</th>
              <td className={`${cell} tabular-nums`}>{plot.block}</td>
              {showTreatment ? <td className={cell}>{plot.treatmentCode ?? ""}</td> : null}
              {quadrats.map((quadrat) => (
                <td key={quadrat} className={cell} />
              ))}
              <td className={cell} />
            </tr>
          ))}
        </tbody>
      </table>
    </section>
  );
}

function Blank({ label, hint }: { label: string; hint?: string }) {
  return (
    <div className="flex items-end gap-2">
      <dt className="font-semibold">{label}:</dt>
      <dd className="flex-1 border-b border-soil-900 pb-0.5 text-xs text-soil-700 print:text-black">{hint ?? "\u00a0"}</dd>
    </div>
  );
}
