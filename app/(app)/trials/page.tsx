import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { TrialFilters } from "@/components/trials/TrialFilters";
import { TrialList } from "@/components/trials/TrialList";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { listTrials, trialFilterChoices } from "@/lib/data/trials";
import { trialListQuerySchema } from "@/lib/validations/trial";

export const metadata: Metadata = { title: "Trials" };
export const dynamic = "force-dynamic";

export default async function TrialsPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!can(user.role, "trial:list")) notFound();
  const raw = await searchParams;
  const parsed = trialListQuerySchema.safeParse({
    crop: typeof raw.crop === "string" ? raw.crop : undefined,
    season: typeof raw.season === "string" ? raw.season : undefined,
    status: typeof raw.status === "string" ? raw.status : undefined,
  });
  const filters = parsed.success ? parsed.data : {};
  const [trials, choices] = await Promise.all([listTrials(user, filters), trialFilterChoices(user)]);
  const filtered = Boolean(filters.crop || filters.season || filters.status);
  return (
    <section>
      <div className="mb-4 flex flex-wrap items-center gap-3">
        <h1 className="mr-auto text-2xl font-semibold">Trials</h1>
        {can(user.role, "trial:create") && (
          <Link href="/trials/new" className="rounded bg-leaf-600 px-4 py-2 text-sm font-medium text-white hover:bg-leaf-700">
            New trial
          </Link>
        )}
      </div>
      <TrialFilters crops={choices.crops} seasons={choices.seasons} current={filters} />
      <p className="mb-2 text-sm text-soil-700" role="status">
        {trials.length} {trials.length === 1 ? "trial" : "trials"}
        {filtered ? " match the filters" : ""}
      </p>
      <TrialList trials={trials} empty={filtered ? "No trials match these filters." : "No trials yet."} />
    </section>
  );
}
