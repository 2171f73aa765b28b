"use server";

import { revalidatePath } from "next/cache";
import { action } from "@/lib/auth/guard";
import { createUser } from "@/lib/data/users";
import { createUserSchema } from "@/lib/validations/auth";

const createUserGuarded = action({ permission: "user:manage", input: createUserSchema }, async ({ input }) => {
  const user = await createUser(input);
  revalidatePath("/admin/users");
  return { id: user.id, email: user.email, role: user.role };
});

export async function createUserAction(input: unknown) {
  return createUserGuarded(input);
}
