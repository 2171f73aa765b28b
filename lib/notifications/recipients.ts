import "server-only";
import { Op, type Transaction } from "sequelize";
import { db } from "@/lib/db/sequelize";
import type { MembershipRole } from "@/lib/trials/vocabulary";
import { Follow, Membership, Treatment, Trial, User } from "@/models";
import type { Recipient } from "./deliver";

/** Lets recipients be read inside the action's transaction, on its connection. */
type Reading = { transaction?: Transaction };

function toRecipient(user: User): Recipient {
  return { id: user.id, email: user.email, name: user.name };
}

/** Active people, each once, without the person who caused the event. */
export async function activeUsers(ids: string[], exceptId?: string, { transaction }: Reading = {}): Promise<Recipient[]> {
  db();
  const wanted = [...new Set(ids)].filter((id) => id !== exceptId);
  if (wanted.length === 0) return [];
  const users = await User.findAll({ where: { id: { [Op.in]: wanted }, active: true }, order: [["name", "ASC"]], transaction });
  return users.map(toRecipient);
}

export async function teamIds(trialId: string, roles: MembershipRole[], { transaction }: Reading = {}): Promise<string[]> {
  db();
  const memberships = await Membership.findAll({ where: { trialId, role: { [Op.in]: roles } }, transaction });
  return memberships.map((membership) => membership.userId);
}

/**
 * People who follow the trial's crop or one of its methods (the follow feature stores crops
 * in lower case and methods by their category, so matching is exact).
 */
export async function followersOf(trial: Trial, { transaction }: Reading = {}): Promise<string[]> {
  db();
  const treatments = await Treatment.findAll({ where: { trialId: trial.id }, attributes: ["category"], transaction });
  const methods = [...new Set(treatments.map((treatment) => treatment.category))].filter((category) => category !== "check");
  const follows = await Follow.findAll({
    where: {
      [Op.or]: [
        { kind: "crop", value: trial.crop.trim().toLowerCase() },
        ...(methods.length ? [{ kind: "method" as const, value: { [Op.in]: methods } }] : []),
      ],
    },
    attributes: ["userId"],
    transaction,
  });
  return follows.map((follow) => follow.userId);
}
