import "server-only";
import { Op, QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import type { MembershipRole } from "@/lib/trials/vocabulary";
import { Membership, Trial, User } from "@/models";
import type { Recipient } from "./deliver";

function toRecipient(user: User): Recipient {
  return { id: user.id, email: user.email, name: user.name };
}

/** Active people, each once, without the person who caused the event. */
export async function activeUsers(ids: string[], exceptId?: string): Promise<Recipient[]> {
  db();
  const wanted = [...new Set(ids)].filter((id) => id !== exceptId);
  if (wanted.length === 0) return [];
  const users = await User.findAll({ where: { id: { [Op.in]: wanted }, active: true }, order: [["name", "ASC"]] });
  return users.map(toRecipient);
}

export async function teamIds(trialId: string, roles: MembershipRole[]): Promise<string[]> {
  db();
  const memberships = await Membership.findAll({ where: { trialId, role: { [Op.in]: roles } } });
  return memberships.map((membership) => membership.userId);
}

/**
 * People who follow the trial's crop or one of its methods (the follow feature's `follows`
 * table: crops in lower case, methods by category). Until that table exists in a database,
 * a publication notifies no one.
 */
export async function followersOf(trial: Trial): Promise<string[]> {
  const sequelize = db();
  const [table] = await sequelize.query<{ present: boolean }>(`SELECT to_regclass('follows') IS NOT NULL AS present`, { type: QueryTypes.SELECT });
  if (!table?.present) return [];
  const rows = await sequelize.query<{ user_id: string }>(
    `SELECT DISTINCT user_id FROM follows
     WHERE (kind = 'crop' AND value = lower(:crop))
        OR (kind = 'method' AND value IN (SELECT category FROM treatments WHERE trial_id = :trialId AND category <> 'check'))`,
    { type: QueryTypes.SELECT, replacements: { crop: trial.crop.trim(), trialId: trial.id } },
  );
  return rows.map((row) => row.user_id);
}
