import "server-only";
import type { Transaction } from "sequelize";
import { db } from "@/lib/db/sequelize";
import type { NotificationType } from "@/lib/notifications/events";
import { notificationTypeKeys } from "@/lib/notifications/types";
import { NotificationSetting, type NotificationDelivery } from "@/models/NotificationSetting";

export interface NotificationPreferences {
  delivery: NotificationDelivery;
  muted: NotificationType[];
}

export const defaultPreferences: NotificationPreferences = { delivery: "immediate", muted: [] };

/**
 * A person's notification choices; without a saved row, every notice as its own mail.
 * Notices queued inside an action's transaction read through it, on its connection.
 */
export async function notificationPreferencesFor(userId: string, options: { transaction?: Transaction } = {}): Promise<NotificationPreferences> {
  db();
  const row = await NotificationSetting.findByPk(userId, { transaction: options.transaction });
  if (!row) return { ...defaultPreferences };
  const known = new Set<string>(notificationTypeKeys);
  return { delivery: row.delivery, muted: row.mutedTypes.filter((type): type is NotificationType => known.has(type)) };
}
