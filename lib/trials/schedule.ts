import type { TimingReference } from "./vocabulary";

export interface ScheduledAssessment {
  id: string;
  name: string;
  plannedDate: string | null;
  timingDays: number | null;
  timingReference: TimingReference | null;
}

export type ScheduleState = "overdue" | "today" | "upcoming" | "undated";

export interface ScheduleRow<T extends ScheduledAssessment> {
  assessment: T;
  dueDate: string | null;
  /** Days from today to the due date; negative when it has passed. */
  daysFromToday: number | null;
  state: ScheduleState;
}

const DAY_MS = 86_400_000;

function addDays(isoDate: string, days: number): string {
  return new Date(Date.parse(`${isoDate}T00:00:00Z`) + days * DAY_MS).toISOString().slice(0, 10);
}

function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / DAY_MS);
}

/** A due date: the planned date when given, else days after planting (treatment dates come later). */
export function dueDate(assessment: ScheduledAssessment, plantingDate: string | null): string | null {
  if (assessment.plannedDate) return assessment.plannedDate;
  if (assessment.timingDays !== null && assessment.timingReference === "planting" && plantingDate) return addDays(plantingDate, assessment.timingDays);
  return null;
}

/**
 * The assessment schedule relative to today, in due order (undated last). Observations do not
 * exist yet, so "overdue" means the date has passed; the data-entry issue will mark done ones.
 */
export function assessmentSchedule<T extends ScheduledAssessment>(assessments: T[], plantingDate: string | null, today: string): ScheduleRow<T>[] {
  const rows = assessments.map((assessment): ScheduleRow<T> => {
    const due = dueDate(assessment, plantingDate);
    if (!due) return { assessment, dueDate: null, daysFromToday: null, state: "undated" };
    const days = daysBetween(today, due);
    return { assessment, dueDate: due, daysFromToday: days, state: days < 0 ? "overdue" : days === 0 ? "today" : "upcoming" };
  });
  return rows.sort((a, b) => (a.dueDate ?? "9999").localeCompare(b.dueDate ?? "9999"));
}

export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}
