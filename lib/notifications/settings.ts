import "server-only";
import { db } from "@/lib/db/sequelize";
import { NotificationSetting } from "@/models";
import type { NotificationSettingsInput } from "@/lib/validations/notification-settings";

export async function saveNotificationPreferences(userId: string, input: NotificationSettingsInput): Promise<void> {
  db();
  await NotificationSetting.upsert({ userId, delivery: input.delivery, mutedTypes: [...new Set(input.muted)] });
}
