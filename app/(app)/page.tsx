import Link from "next/link";
import { redirect } from "next/navigation";
import { ReviewQueue } from "@/components/review/ReviewQueue";
import { TrialList } from "@/components/trials/TrialList";
import { reviewStatusByTrial } from "@/lib/data/reviews";
import { currentUser } from "@/lib/auth/session";
import { trialsForHome } from "@/lib/data/trials";
import type { Role } from "@/lib/auth/roles";

export const dynamic = "force-dynamic";

const headings: Record<Role, { title: string; lead: string; empty: string }> = {
  admin: { title: "Overview", lead: "Every trial in Hoebench.", empty: "No trials yet." },
  researcher: { title: "My trials", lead: "Trials you plan and own.", empty: "You own no trials yet." },
  technician: {
    title: "Trials I collect for",
    lead: "Draft and active trials where you count, weigh and harvest.",
    empty: "You are not collecting for any trial yet. A researcher adds you to a trial's team.",
  },
  reviewer: {
    title: "Awaiting review",
    lead: "Trials you review. Analyses sent for review appear here.",
    empty: "No trials are assigned to you for review.",
  },
  grower: {
    title: "Published results",
    lead: "Trials that researchers have completed, reviewed and published.",
    empty: "Nothing has been published yet.",
  },
};

export default async function HomePage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  const trials = await trialsForHome(user);
  const heading = headings[user.role];
  const reviewStatus = user.role === "reviewer" || user.role === "researcher" ? await reviewStatusByTrial(trials.map((trial) => trial.id)) : null;
  return (
    <section>
      <h1 className="text-2xl font-semibold">{heading.title}</h1>
      <p className="mb-4 text-soil-700">
        {heading.lead}
        {user.role === "grower" && (
          <>
            {" "}
            <Link href="/library" className="text-leaf-700 underline">
              Search the library
            </Link>{" "}
            by crop, method, region and season.
          </>
        )}
      </p>
      {reviewStatus && (
        <ReviewQueue
          heading={user.role === "reviewer" ? "Review requests" : "Review status"}
          items={trials.filter((trial) => trial.status !== "draft").map((trial) => ({ id: trial.id, title: trial.title, status: reviewStatus.get(trial.id) ?? "none" }))}
        />
      )}
      <TrialList trials={trials} empty={heading.empty} linkTo={user.role === "grower" ? "library" : "trial"} />
    </section>
  );
}
