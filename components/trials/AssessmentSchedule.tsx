import Link from "next/link";
import type { AssessmentRecord } from "@/lib/data/assessments";
import { variableNames } from "@/lib/trials/labels";
import type { ScheduleRow, ScheduleState } from "@/lib/trials/schedule";

const stateLabels: Record<ScheduleState, string> = { overdue: "Overdue", today: "Due today", upcoming: "Upcoming", undated: "No date" };
const stateStyles: Record<ScheduleState, string> = {
  overdue: "border-red-700 text-red-800",
  today: "border-leaf-700 bg-leaf-50 text-leaf-900",
  upcoming: "border-soil-500 text-soil-700",
  undated: "border-dashed border-soil-500 text-soil-700",
};

function relative(days: number | null): string {
  if (days === null) return "";
  if (days === 0) return "today";
  if (days > 0) return days === 1 ? "tomorrow" : `in ${days} days`;
  return days === -1 ? "yesterday" : `${-days} days ago`;
}

function timing(assessment: AssessmentRecord): string {
  if (assessment.timingDays === null || !assessment.timingReference) return "";
  return `${assessment.timingDays} days after ${assessment.timingReference}`;
}

/** Assessments in due order, marked overdue or upcoming relative to today. */
export function AssessmentSchedule({ trialId, rows, showStates }: { trialId: string; rows: ScheduleRow<AssessmentRecord>[]; showStates: boolean }) {
  if (rows.length === 0) return <p className="text-soil-700">No assessments planned yet.</p>;
  return (
    <ul className="divide-y divide-soil-100 rounded border border-soil-200 bg-white">
      {rows.map(({ assessment, dueDate, daysFromToday, state }) => (
        <li key={assessment.id} className="flex flex-col gap-1 p-3 sm:flex-row sm:items-center sm:gap-4" data-testid="schedule-row">
          <div className="flex-1">
            <p className="font-medium">{assessment.name}</p>
            <p className="text-sm text-soil-700">
              {variableNames[assessment.variable]} · {assessment.unit} · {assessment.quadratsPerPlot} {assessment.quadratsPerPlot === 1 ? "reading" : "quadrats"} per plot
              {timing(assessment) ? ` · ${timing(assessment)}` : ""}
            </p>
          </div>
          <div className="flex flex-wrap items-center gap-3 text-sm">
            {dueDate && (
              <span>
                {dueDate}
                {showStates ? ` (${relative(daysFromToday)})` : ""}
              </span>
            )}
            {showStates && <span className={`rounded border px-2 py-0.5 text-xs font-medium ${stateStyles[state]}`}>{stateLabels[state]}</span>}
            <Link href={`/trials/${trialId}/sheets/${assessment.id}`} className="text-leaf-700 underline">
              Data sheet
            </Link>
          </div>
        </li>
      ))}
    </ul>
  );
}
