import "server-only";
import { sendAssessmentDueReminders } from "@/lib/notifications/assessment-due";
import { sendDailyDigests } from "@/lib/notifications/digest";
import { runDueDailyJobs, type DailyJob } from "./daily";
import { startMailWorker } from "./mail-worker";

export const dailyJobs: DailyJob[] = [
  { name: "assessment-due-reminders", hourUtc: 6, run: (now) => sendAssessmentDueReminders(now) },
  { name: "notification-digest", hourUtc: 6, run: (now) => sendDailyDigests(now) },
];

const holder = globalThis as unknown as { hoebenchJobsStarted?: boolean };
const CHECK_DAILY_MS = 60_000;

/** Called once from instrumentation.ts when an app server starts (Node runtime only). */
export function startBackgroundJobs(): void {
  if (holder.hoebenchJobsStarted) return;
  holder.hoebenchJobsStarted = true;
  startMailWorker();
  const check = () => void runDueDailyJobs(dailyJobs).catch(() => undefined);
  setTimeout(check, 5_000).unref();
  setInterval(check, CHECK_DAILY_MS).unref();
}
