import "server-only";
import { db } from "@/lib/db/sequelize";
import { notAllowed, notFound } from "@/lib/errors";
import { Membership, Trial } from "@/models";
import { can, isTrialScoped, type Permission } from "./permissions";
import type { SessionUser } from "./session";

export type TrialRelation = "admin" | "owner" | "technician" | "reviewer";

/** How a user stands to a trial, or null when the trial is not theirs to see. */
export async function trialRelation(user: SessionUser, trial: Trial): Promise<TrialRelation | null> {
  if (user.role === "admin") return "admin";
  if (user.role === "researcher") return trial.ownerId === user.id ? "owner" : null;
  if (user.role === "technician" || user.role === "reviewer") {
    const membership = await Membership.findOne({ where: { trialId: trial.id, userId: user.id, role: user.role } });
    return membership ? user.role : null;
  }
  return null;
}

/** The trial row as a model instance, by a plain query: every trial request starts here, and the ORM's query building cost twice the query itself. */
async function loadTrial(trialId: string): Promise<Trial | null> {
  const [trial] = await db().query("SELECT * FROM trials WHERE id = :trialId", { model: Trial, mapToModel: true, replacements: { trialId } });
  return trial ?? null;
}

/**
 * Checks the role table, then (for trial permissions) that the user belongs to the trial.
 * A trial the user cannot see answers 404, so ids of other people's trials reveal nothing.
 */
export async function authorize(user: SessionUser, permission: Permission, trialId?: string): Promise<Trial | undefined> {
  if (!isTrialScoped(permission)) {
    if (!can(user.role, permission)) throw notAllowed();
    return undefined;
  }
  if (!trialId) throw new Error(`permission ${permission} needs a trial`);
  const trial = await loadTrial(trialId);
  if (!trial) throw notFound("trial");
  const relation = await trialRelation(user, trial);
  if (!relation) throw notFound("trial");
  if (!can(user.role, permission)) throw notAllowed();
  return trial;
}
