import { z } from "zod";
import { publicRoute } from "@/lib/auth/guard";
import { databaseReachable } from "@/lib/db/health";
import { checkThreadState } from "@/lib/ingest/check-thread";
import { jsonResponse } from "@/lib/http";
import { mailReachable } from "@/lib/mail/transport";
import { storageReachable } from "@/lib/storage/s3";

export const dynamic = "force-dynamic";

const healthSchema = z.object({
  status: z.enum(["ok", "degraded"]),
  database: z.enum(["ok", "down"]),
  objectStorage: z.enum(["ok", "down"]),
  mail: z.enum(["ok", "down"]),
  /** This server process's second thread for large data files (not a dependency: one thread still checks them). */
  fileCheckThread: z.enum(["idle", "running", "failed"]),
});

export const GET = publicRoute({ why: "load balancers and the start script probe it without a session" }, async () => {
  const [database, objectStorage, mail] = await Promise.all([databaseReachable(), storageReachable(), mailReachable()]);
  const state = (up: boolean) => (up ? "ok" : "down") as "ok" | "down";
  const allUp = database && objectStorage && mail;
  return jsonResponse(
    healthSchema,
    { status: allUp ? "ok" : "degraded", database: state(database), objectStorage: state(objectStorage), mail: state(mail), fileCheckThread: checkThreadState() },
    allUp ? 200 : 503,
  );
});
