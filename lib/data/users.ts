import "server-only";
import { z } from "zod";
import { UniqueConstraintError } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { hashPassword } from "@/lib/auth/password";
import { roles, type Role } from "@/lib/auth/roles";
import { User } from "@/models";

export const publicUserSchema = z.object({
  id: z.string(),
  email: z.string(),
  name: z.string(),
  role: z.enum(roles),
  active: z.boolean(),
  createdAt: z.date(),
});
export type PublicUser = z.infer<typeof publicUserSchema>;

function toPublic(user: User): PublicUser {
  return publicUserSchema.parse(user.get({ plain: true }));
}

export async function findUserForSignIn(email: string): Promise<User | null> {
  db();
  return User.findOne({ where: { email } });
}

export async function listUsers(): Promise<PublicUser[]> {
  db();
  const users = await User.findAll({ order: [["role", "ASC"], ["name", "ASC"]] });
  return users.map(toPublic);
}

export async function listUsersByRole(role: Role): Promise<PublicUser[]> {
  db();
  const users = await User.findAll({ where: { role, active: true }, order: [["name", "ASC"]] });
  return users.map(toPublic);
}

export async function createUser(input: { name: string; email: string; role: Role; password: string }): Promise<PublicUser> {
  db();
  try {
    const user = await User.create({
      name: input.name,
      email: input.email,
      role: input.role,
      passwordHash: await hashPassword(input.password),
    });
    return toPublic(user);
  } catch (error) {
    if (error instanceof UniqueConstraintError) {
      throw new AppError("CONFLICT", "An account with that e-mail address already exists.", [
        { path: "email", message: "An account with that e-mail address already exists." },
      ]);
    }
    throw error;
  }
}
