import { z } from "zod";
import { route } from "@/lib/auth/guard";
import { findAssessment } from "@/lib/data/assessments";
import { notFound } from "@/lib/errors";
import { plotValuesCsv, rawValuesCsv } from "@/lib/exports/trial-data";
import { uuidSchema } from "@/lib/validations/common";

export const dynamic = "force-dynamic";

const exportQuery = z
  .object({ trialId: uuidSchema, assessmentId: uuidSchema.optional(), kind: z.enum(["raw", "plot"], "Choose raw or plot values.") })
  .strict();

/** Tidy CSV of a trial's data, for one assessment or the whole trial. */
export const GET = route({ permission: "trial:read", query: exportQuery, trialId: ({ query }) => query.trialId }, async ({ query, trial }) => {
  // An assessment of another trial would give an empty file; say plainly that it is not here.
  if (query.assessmentId && !(await findAssessment(trial!.id, query.assessmentId))) throw notFound("assessment");
  const csv = query.kind === "raw" ? await rawValuesCsv(trial!, query.assessmentId) : await plotValuesCsv(trial!, query.assessmentId);
  const name = `hoebench-${query.kind === "raw" ? "raw-values" : "plot-values"}-${trial!.id.slice(0, 8)}${query.assessmentId ? `-${query.assessmentId.slice(0, 8)}` : ""}.csv`;
  return new Response(csv, { headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="${name}"` } });
});
