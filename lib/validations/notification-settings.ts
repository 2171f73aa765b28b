import { z } from "zod";
import { notificationTypeKeys } from "@/lib/notifications/types";

export const notificationSettingsSchema = z
  .object({
    delivery: z.enum(["immediate", "digest"], "Choose how notices reach you."),
    muted: z.array(z.enum(notificationTypeKeys)).max(notificationTypeKeys.length),
  })
  .strict();

export type NotificationSettingsInput = z.output<typeof notificationSettingsSchema>;
