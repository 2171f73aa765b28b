import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { FollowManager } from "@/components/library/FollowManager";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { followsOf } from "@/lib/data/follows";
import { libraryChoices } from "@/lib/data/library";

export const metadata: Metadata = { title: "Following" };
export const dynamic = "force-dynamic";

export default async function FollowingPage() {
  const user = await currentUser();
  if (!user || !can(user.role, "follow:manage")) notFound();
  const [follows, choices] = await Promise.all([followsOf(user.id), libraryChoices()]);
  return (
    <section>
      <h1 className="text-2xl font-semibold">Following</h1>
      <p className="mb-4 max-w-prose text-soil-700">Follow a crop or a weeding method and we will tell you when a new trial about it is published in the library.</p>
      <FollowManager follows={follows.map((follow) => ({ id: follow.id, kind: follow.kind, value: follow.value }))} crops={choices.crops} />
    </section>
  );
}
