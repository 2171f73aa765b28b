import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { Follow } from "@/models";
import type { FollowInput } from "@/lib/validations/follows";

export async function followsOf(userId: string): Promise<Follow[]> {
  db();
  return Follow.findAll({ where: { userId }, order: [["kind", "ASC"], ["value", "ASC"]] });
}

/** Adds a follow; following the same thing twice keeps the first. */
export async function addFollow(userId: string, input: FollowInput): Promise<Follow> {
  db();
  const [follow] = await Follow.findOrCreate({ where: { userId, kind: input.kind, value: input.value }, defaults: { userId, kind: input.kind, value: input.value } });
  return follow;
}

/** Removes one of the user's own follows; true when there was one. */
export async function removeFollow(userId: string, followId: string): Promise<boolean> {
  db();
  return (await Follow.destroy({ where: { id: followId, userId } })) > 0;
}

/**
 * Who follows a published trial's crop or any of its methods: one row per user. For the
 * notifications side, which decides how and when to tell them.
 */
export async function followersOfTrial(trialId: string): Promise<Array<{ userId: string; reasons: string[] }>> {
  return db().query<{ userId: string; reasons: string[] }>(
    `SELECT f.user_id AS "userId", array_agg(f.kind || ':' || f.value ORDER BY f.kind, f.value) AS reasons
       FROM follows f
       JOIN trials t ON t.id = :trialId
      WHERE (f.kind = 'crop' AND f.value = lower(t.crop))
         OR (f.kind = 'method' AND EXISTS (SELECT 1 FROM treatments m WHERE m.trial_id = t.id AND m.category = f.value))
      GROUP BY f.user_id`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
}
