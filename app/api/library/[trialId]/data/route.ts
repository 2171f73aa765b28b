import { publicRoute } from "@/lib/auth/guard";
import { publishedTrial } from "@/lib/data/library";
import { notFound } from "@/lib/errors";
import { plotValuesCsv } from "@/lib/exports/trial-data";
import { trialIdParams } from "@/lib/validations/common";

export const dynamic = "force-dynamic";

/** A published trial's tidy plot values; any other trial is 404, the same as one that does not exist. */
export const GET = publicRoute(
  { why: "Published trials' data are open to everyone who reads the library; unpublished trials answer 404.", params: trialIdParams },
  async ({ params }) => {
    const trial = await publishedTrial(params.trialId);
    if (!trial) throw notFound("trial");
    const csv = await plotValuesCsv(trial);
    return new Response(csv, {
      headers: { "content-type": "text/csv; charset=utf-8", "content-disposition": `attachment; filename="hoebench-published-plot-values-${trial.id.slice(0, 8)}.csv"` },
    });
  },
);
