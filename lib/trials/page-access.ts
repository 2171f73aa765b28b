import "server-only";
import { notFound, redirect } from "next/navigation";
import type { Permission } from "@/lib/auth/permissions";
import { currentUser, type SessionUser } from "@/lib/auth/session";
import { authorize } from "@/lib/auth/trial-access";
import { isAppError } from "@/lib/errors";
import type { Trial } from "@/models";
import { uuidSchema } from "@/lib/validations/common";

/**
 * A trial page's access check: the same authorize() the APIs use. A trial the user may not
 * see, or may not act on, shows the not-found page.
 */
export async function trialForPage(trialId: string, permission: Permission = "trial:read"): Promise<{ user: SessionUser; trial: Trial }> {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!uuidSchema.safeParse(trialId).success) notFound();
  try {
    const trial = await authorize(user, permission, trialId);
    return { user, trial: trial! };
  } catch (error) {
    if (isAppError(error) && (error.code === "NOT_FOUND" || error.code === "FORBIDDEN")) notFound();
    throw error;
  }
}
