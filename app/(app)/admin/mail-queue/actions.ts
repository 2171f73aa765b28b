"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { action } from "@/lib/auth/guard";
import { AppError } from "@/lib/errors";
import { wakeMailWorker } from "@/lib/jobs/mail-worker";
import { retryMailNow } from "@/lib/mail/queue";
import { uuidSchema } from "@/lib/validations/common";

const retry = action({ permission: "mail:manage-queue", input: z.object({ id: uuidSchema }).strict() }, async ({ input }) => {
  if (!(await retryMailNow(input.id))) throw new AppError("CONFLICT", "That message was sent or is being sent; there is nothing to retry.");
  wakeMailWorker();
  revalidatePath("/admin/mail-queue");
  return { id: input.id };
});

export async function retryMail(input: { id: string }) {
  return retry(input);
}
