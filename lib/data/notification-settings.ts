import "server-only";
import { db } from "@/lib/db/sequelize";
import type { NotificationType } from "@/lib/notifications/events";
import { notificationTypeKeys } from "@/lib/notifications/types";
import { NotificationSetting, type NotificationDelivery } from "@/models/NotificationSetting";

export interface NotificationPreferences {
  delivery: NotificationDelivery;
  muted: NotificationType[];
}

export const defaultPreferences: NotificationPreferences = { delivery: "immediate", muted: [] };

/** A person's notification choices; without a saved row, every notice as its own mail. */
export async function notificationPreferencesFor(userId: string): Promise<NotificationPreferences> {
  db();
  const row = await NotificationSetting.findByPk(userId);
  if (!row) return { ...defaultPreferences };
  const known = new Set<string>(notificationTypeKeys);
  return { delivery: row.delivery, muted: row.mutedTypes.filter((type): type is NotificationType => known.has(type)) };
}
