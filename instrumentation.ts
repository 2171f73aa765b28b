/**
 * Next calls register() once when a server starts. Background work (the mail queue worker
 * and the daily jobs) runs inside the app server, in the Node runtime only, never while
 * building; lib/jobs/start.ts also guards against a second start.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  if (process.env.NEXT_PHASE === "phase-production-build") return;
  // A bad setting stops the server now, by name, rather than failing requests later.
  const { config } = await import("./lib/config");
  config();
  if (process.env.HOEBENCH_BACKGROUND_JOBS === "off") return;
  const { startBackgroundJobs } = await import("./lib/jobs/start");
  startBackgroundJobs();
}
