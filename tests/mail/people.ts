import { Op } from "sequelize";
import { hashPassword } from "@/lib/auth/password";
import type { Role } from "@/lib/auth/roles";
import { User } from "@/models";
import { testDatabase } from "../support/database";
import { uniqueAddress } from "./support";

const made: string[] = [];
export const PERSON_PASSWORD = "field-notes-2026";

/** A fresh account per test, so settings and caught mail never mix with the demo people's. */
export async function createPerson(role: Role, label: string = role): Promise<User> {
  testDatabase();
  const user = await User.create({ email: uniqueAddress(label), name: `${label[0].toUpperCase()}${label.slice(1)} Tester`, role, passwordHash: await hashPassword(PERSON_PASSWORD) });
  made.push(user.email);
  return user;
}

export function rememberAddress(email: string): void {
  made.push(email);
}

/** Call after removeTrialFixtures(): trials reference their owners. */
export async function removePeople(): Promise<void> {
  testDatabase();
  await User.destroy({ where: { email: { [Op.in]: made.splice(0) } } });
}
